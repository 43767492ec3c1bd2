// The session endpoints (lib/contracts/endpoint.ts says how one is declared).
import { endpoint, json, none } from "@/lib/contracts/endpoint";
import { passwordResetRequestSchema, setPasswordSchema, signInSchema } from "@/lib/domain/validation/accounts";
import type { Role } from "@/lib/domain/access/permissions";

export const sessionApi = {
  health: endpoint({
    method: "GET",
    path: "/api/health",
    access: "public",
    answer: json<{ status: "ok"; database: "ok" }>(),
    who: "anyone",
    doc: `200 \`{ "status": "ok" }\` when the database answers, else 503`,
  }),
  signIn: endpoint({
    method: "POST",
    path: "/api/session",
    access: "public",
    body: { kind: "json", schema: signInSchema },
    answer: json<{ user: { id: string; email: string; name: string; role: Role } }>(),
    who: "anyone",
    doc: `\`{ "email", "password" }\` → 200 \`{ "user": { "id", "email", "name", "role" } }\` and the cookie; 401 for a wrong e-mail or password (the same answer for both); 429 after repeated failures`,
  }),
  current: endpoint({
    method: "GET",
    path: "/api/session",
    access: "public",
    answer: json<{ user: { id: string; email: string; name: string; role: Role } }>(),
    who: "signed in",
    doc: `200 \`{ "user" }\`, else 401`,
  }),
  signOut: endpoint({
    method: "DELETE",
    path: "/api/session",
    access: "public",
    answer: none,
    status: 204,
    who: "anyone",
    doc: `204, cookie cleared`,
  }),
  requestReset: endpoint({
    method: "POST",
    path: "/api/password-resets",
    access: "public",
    body: { kind: "json", schema: passwordResetRequestSchema },
    answer: json<{ message: string }>(),
    status: 202,
    who: "anyone",
    doc: `\`{ "email" }\` → 202, the same answer whether the address exists or not; a mail with a link goes to an existing account`,
  }),
  setPassword: endpoint({
    method: "POST",
    path: "/api/password",
    access: "public",
    body: { kind: "json", schema: setPasswordSchema },
    answer: json<{ user: { email: string | undefined } }>(),
    who: "holder of a mailed link",
    doc: `\`{ "token", "password" }\` → 200; 422 when the link expired or was used`,
  }),
};
