// The audit endpoints (lib/contracts/endpoint.ts says how one is declared).
import { auditQuerySchema } from "@/lib/domain/validation/audit";
import { endpoint, json } from "@/lib/contracts/endpoint";
import type { JsonObject } from "@/lib/contracts/endpoint";

export const auditApi = {
  list: endpoint({
    method: "GET",
    path: "/api/audit",
    access: "audit:view",
    query: auditQuerySchema,
    answer: json<{ events: JsonObject[] }>(),
    who: "admin",
    doc: `200 \`{ "events": [ { "id", "createdAt", "actorName", "actorEmail", "action", "subjectType", "subjectId", "details", "summary", "detailLines": [ { "label", "value" } ] } ] }\`, newest first. \`summary\` says in plain words who did what to which record ("Elena Brandt signed off Jonas Weber's run of 'Wheel bearing inspection' (version 3)"), with people and records named; \`detailLines\` are the details in words; \`action\` and \`details\` are the stored code and ids, for programs; \`kind\`: \`accounts\`, \`classes\`, \`library\`, \`cards\`, \`assignments\`, \`runs\`; \`actor\` part of a name or e-mail; \`from\`, \`to\` dates (both days included); unreadable filters are ignored`,
  }),
};
