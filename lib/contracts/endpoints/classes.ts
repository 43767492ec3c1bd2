// The classes endpoints (lib/contracts/endpoint.ts says how one is declared).
import { endpoint, json, uuidSegment } from "@/lib/contracts/endpoint";
import { addMembersSchema, createClassSchema, updateClassSchema } from "@/lib/domain/validation/classes";

export const classesApi = {
  list: endpoint({
    method: "GET",
    path: "/api/classes",
    access: "classes:view",
    answer: json<{ classes: unknown[] }>(),
    who: "instructor (own classes), admin (all)",
    doc: `200 \`{ "classes": [ { "id", "name", "description", "startsOn", "endsOn", "students", "staff" } ] }\``,
  }),
  create: endpoint({
    method: "POST",
    path: "/api/classes",
    access: "classes:manage",
    body: { kind: "json", schema: createClassSchema },
    answer: json<{ class: unknown }>(),
    status: 201,
    who: "admin",
    doc: `\`{ "name", "description"?, "startsOn"?, "endsOn"? }\` (dates \`YYYY-MM-DD\`) → 201 \`{ "class" }\`; 409 for a name in use`,
  }),
  get: endpoint({
    method: "GET",
    path: "/api/classes/:id",
    access: "classes:view",
    params: { id: uuidSegment("That class") },
    answer: json<{ class: unknown }>(),
    who: "member instructor, admin",
    doc: `200 \`{ "class": { …, "members": [ { "id", "name", "email", "role", "status" } ] } }\`; 404 for an instructor outside the class`,
  }),
  update: endpoint({
    method: "PATCH",
    path: "/api/classes/:id",
    access: "classes:manage",
    params: { id: uuidSegment("That class") },
    body: { kind: "json", schema: updateClassSchema },
    answer: json<{ class: unknown }>(),
    who: "admin",
    doc: `any class field → 200 \`{ "class" }\``,
  }),
  addMembers: endpoint({
    method: "POST",
    path: "/api/classes/:id/members",
    access: "classes:manage",
    params: { id: uuidSegment("That class") },
    body: { kind: "json", schema: addMembersSchema },
    answer: json<{ added: number }>(),
    who: "admin",
    doc: `\`{ "userIds": [ … ] }\` → 200 \`{ "added" }\` (people already in the class are skipped)`,
  }),
  removeMember: endpoint({
    method: "DELETE",
    path: "/api/classes/:id/members/:userId",
    access: "classes:manage",
    params: { id: uuidSegment("That class"), userId: uuidSegment("That member") },
    answer: json<{ removed: number }>(),
    who: "admin",
    doc: `→ 200 \`{ "removed": 1 }\`, 404 when not a member`,
  }),
};
