import { describe, expect, it } from "vitest";
import { AppError, toAppError } from "@/lib/domain/errors";
import { parseWith } from "@/lib/server/http";
import { invitationMail } from "@/lib/server/mail/messages";
import { createAccountSchema, signInSchema } from "@/lib/domain/validation/accounts";
import { createClassSchema } from "@/lib/domain/validation/classes";

describe("AppError", () => {
  it.each([
    ["unauthorized", 401],
    ["forbidden", 403],
    ["not_found", 404],
    ["conflict", 409],
    ["payload_too_large", 413],
    ["unsupported_media_type", 415],
    ["invalid", 422],
    ["rate_limited", 429],
  ] as const)("%s answers %i with the error body", async (code, status) => {
    const response = new AppError(code, "Plain words.").toResponse();
    expect(response.status).toBe(status);
    expect(await response.json()).toEqual({ error: { code, message: "Plain words." } });
  });

  it("hides the cause of an unexpected error behind a generic message", () => {
    const original = console.error;
    console.error = () => undefined;
    try {
      const error = toAppError(new Error("password=hunter2 in the connection string"));
      expect(error.status).toBe(500);
      expect(error.message).not.toContain("hunter2");
    } finally {
      console.error = original;
    }
  });

  it("sends Retry-After with a rate limit", () => {
    expect(new AppError("rate_limited", undefined, { retryAfterSeconds: 8 }).toResponse().headers.get("retry-after")).toBe("8");
  });
});

describe("validation at the boundary", () => {
  it("normalises e-mail addresses before they are compared", () => {
    expect(signInSchema.parse({ email: "  Student@HangarLeaf.TEST ", password: "x" }).email).toBe("student@hangarleaf.test");
  });

  it("names the field that is wrong", () => {
    try {
      parseWith(createAccountSchema, { name: "A", email: "not-an-address", role: "pilot" });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(AppError);
      expect((error as AppError).status).toBe(422);
      expect(Object.keys((error as AppError).fields ?? {}).sort()).toEqual(["email", "role"]);
    }
  });

  it("refuses a class that ends before it starts, and a date that is not one", () => {
    expect(createClassSchema.safeParse({ name: "X", startsOn: "2027-01-10", endsOn: "2026-01-10" }).success).toBe(false);
    expect(createClassSchema.safeParse({ name: "X", startsOn: "2027-13-45" }).success).toBe(false);
    expect(createClassSchema.parse({ name: "X", startsOn: "", endsOn: "" })).toMatchObject({ startsOn: null, endsOn: null });
  });
});

describe("mail", () => {
  it("escapes names in the HTML part", () => {
    const mail = invitationMail({
      to: "a@b.test",
      name: "<script>x</script>",
      invitedBy: "A & B",
      link: "http://x/set-password/t",
      role: "Student",
    });
    expect(mail.html).not.toContain("<script>");
    expect(mail.html).toContain("&lt;script&gt;");
    expect(mail.html).toContain("A &amp; B");
    expect(mail.text).toContain("http://x/set-password/t");
  });
});
