import { describe, expect, it } from "vitest";
import { assertCan, can, navigationFor, permissionNames, roles, rolesWith, type Role } from "@/lib/domain/access/permissions";
import { AppError } from "@/lib/domain/errors";

const actor = (role: Role) => ({ id: "00000000-0000-4000-8000-000000000000", role });

// The whole matrix, written out: a change to a rule must change this table too.
const expected: Record<string, Role[]> = {
  "accounts:manage": ["admin"],
  "classes:manage": ["admin"],
  "classes:view": ["instructor", "admin"],
  "classes:view-all": ["admin"],
  "audit:view": ["admin"],
  "settings:manage": ["admin"],
  "outbox:view": ["admin"],
  "library:view": ["student", "instructor", "librarian", "admin"],
  "library:manage": ["librarian", "admin"],
  "cards:view": ["student", "instructor", "librarian", "admin"],
  "cards:author": ["instructor", "admin"],
  "cards:edit-any": ["admin"],
  "assignments:manage": ["instructor", "admin"],
  "runs:do": ["student"],
  "runs:review": ["instructor", "admin"],
  "records:view": ["student", "instructor", "admin"],
  "records:view-all": ["instructor", "admin"],
  "subjects:manage": ["admin"],
  "tools:view": ["student", "instructor", "librarian", "admin"],
  "tools:lend": ["librarian", "admin"],
  "tools:clear-holds": ["instructor", "admin"],
  "standard:manage": ["admin"],
  "attendance:take": ["instructor", "admin"],
  "fleet:view": ["student", "instructor", "librarian", "admin"],
  "fleet:manage": ["admin"],
  "hangar:book": ["instructor", "admin"],
  "findings:file": ["student", "instructor", "admin"],
  "findings:decide": ["instructor", "admin"],
};

describe("permissions", () => {
  it("lists exactly the permissions of the table", () => {
    expect([...permissionNames].sort()).toEqual(Object.keys(expected).sort());
  });

  for (const permission of permissionNames) {
    for (const role of roles) {
      const allowed = expected[permission]!.includes(role);
      it(`${role} ${allowed ? "may" : "may not"} ${permission}`, () => {
        expect(can(actor(role), permission)).toBe(allowed);
        expect(rolesWith(permission).includes(role)).toBe(allowed);
      });
    }
  }

  it("allows nothing to nobody", () => {
    for (const permission of permissionNames) expect(can(null, permission)).toBe(false);
  });

  it("answers 401 for nobody and 403 for a role without the permission", () => {
    const status = (fn: () => void) => {
      try {
        fn();
        return 200;
      } catch (error) {
        return error instanceof AppError ? error.status : 500;
      }
    };
    expect(status(() => assertCan(null, "accounts:manage"))).toBe(401);
    expect(status(() => assertCan(actor("student"), "accounts:manage"))).toBe(403);
    expect(status(() => assertCan(actor("instructor"), "accounts:manage"))).toBe(403);
    expect(status(() => assertCan(actor("admin"), "accounts:manage"))).toBe(200);
  });

  it("gives each role its own navigation", () => {
    const labels = (role: Role, outbox = false) => navigationFor(actor(role), { outbox }).map((n) => n.label);
    expect(labels("student")).toEqual(["Home", "Search", "Library", "Task cards", "My work", "Calculators", "Fleet", "Records"]);
    expect(labels("librarian")).toEqual(["Home", "Search", "Library", "Task cards", "Calculators", "Fleet", "Tool room"]);
    expect(labels("instructor")).toEqual([
      "Home",
      "Search",
      "Library",
      "Task cards",
      "Review",
      "Calculators",
      "Fleet",
      "Classes",
      "Records",
    ]);
    expect(labels("admin")).toEqual([
      "Home",
      "Search",
      "Library",
      "Task cards",
      "Review",
      "Calculators",
      "Fleet",
      "Classes",
      "Records",
      "Tool room",
      "Accounts",
      "Standard",
      "Audit log",
      "School settings",
    ]);
    expect(labels("admin", true)).toContain("Outbox");
    expect(labels("student", true)).not.toContain("Outbox");
  });
});
