import { describe, expect, it } from "vitest";
import { hashPassword, verifyPassword } from "@/lib/server/auth/password";
import { newPasswordSchema } from "@/lib/domain/validation/accounts";

describe("password hashing", () => {
  it("verifies the right password and refuses a wrong one", async () => {
    const hash = await hashPassword("torque-seal-orange");
    expect(hash.startsWith("scrypt$32768$8$1$")).toBe(true);
    expect(await verifyPassword(hash, "torque-seal-orange")).toBe(true);
    expect(await verifyPassword(hash, "torque-seal-orangE")).toBe(false);
  });

  it("salts every hash", async () => {
    expect(await hashPassword("same-password-twice")).not.toBe(await hashPassword("same-password-twice"));
  });

  it("refuses a stored value it does not understand instead of throwing", async () => {
    expect(await verifyPassword("", "x")).toBe(false);
    expect(await verifyPassword("bcrypt$whatever", "x")).toBe(false);
  });

  it("asks for 10 to 200 characters", () => {
    expect(newPasswordSchema.safeParse("short").success).toBe(false);
    expect(newPasswordSchema.safeParse("long-enough!").success).toBe(true);
    expect(newPasswordSchema.safeParse("x".repeat(201)).success).toBe(false);
  });
});
