// The accounts endpoints (lib/contracts/endpoint.ts says how one is declared).
import { endpoint, json, uuidSegment } from "@/lib/contracts/endpoint";
import { createAccountSchema, updateAccountSchema } from "@/lib/domain/validation/accounts";
import type { AccountDto } from "@/lib/contracts/accounts";

export const accountsApi = {
  list: endpoint({
    method: "GET",
    path: "/api/users",
    access: "accounts:manage",
    answer: json<{ users: AccountDto[] }>(),
    who: "admin",
    doc: `200 \`{ "users": [ { "id", "email", "name", "role", "status", "lastSignInAt", "createdAt", "classNames" } ] }\``,
  }),
  create: endpoint({
    method: "POST",
    path: "/api/users",
    access: "accounts:manage",
    body: { kind: "json", schema: createAccountSchema },
    answer: json<{ user: AccountDto }>(),
    status: 201,
    who: "admin",
    doc: `\`{ "name", "email", "role", "password"? }\` → 201 \`{ "user" }\`; without a password the account is \`invited\` and an invitation is mailed; 409 when the e-mail is taken`,
  }),
  get: endpoint({
    method: "GET",
    path: "/api/users/:id",
    access: "accounts:manage",
    params: { id: uuidSegment("That account") },
    answer: json<{ user: AccountDto }>(),
    who: "admin",
    doc: `200 \`{ "user" }\``,
  }),
  update: endpoint({
    method: "PATCH",
    path: "/api/users/:id",
    access: "accounts:manage",
    params: { id: uuidSegment("That account") },
    body: { kind: "json", schema: updateAccountSchema },
    answer: json<{ user: AccountDto }>(),
    who: "admin",
    doc: `\`{ "name"?, "role"?, "status"?: "active" \\| "deactivated" }\` → 200 \`{ "user" }\`; ends that person's sessions when role or status change; 409 for your own role or deactivation`,
  }),
  resendInvitation: endpoint({
    method: "POST",
    path: "/api/users/:id/invitation",
    access: "accounts:manage",
    params: { id: uuidSegment("That account") },
    answer: json<{ user: AccountDto }>(),
    status: 202,
    who: "admin",
    doc: `→ 202, a new invitation mail; the older link stops working`,
  }),
};
