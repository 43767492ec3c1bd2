// The certification standard's endpoints (lib/contracts/endpoint.ts says how one is declared).
import { z } from "zod";
import { endpoint, json, uuidSegment } from "@/lib/contracts/endpoint";
import type { ClassCoverageDto, CoverageDto, ElementDto } from "@/lib/contracts/standard";
import type { Readiness } from "@/lib/domain/standard/readiness";
import { sections } from "@/lib/domain/standard/elements";

export const standardApi = {
  listElements: endpoint({
    method: "GET",
    path: "/api/standard/elements",
    access: "signed-in",
    query: z.object({
      q: z.string().trim().max(100).optional().catch(undefined),
      kind: z.enum(["knowledge", "risk", "skill"]).optional().catch(undefined),
    }),
    answer: json<{ elements: ElementDto[]; excerpt: boolean }>(),
    who: "signed in",
    doc: '`?q=` words or a code prefix, `?kind=` → 200 `{ "elements": [ { "code", "kind": "knowledge\\|risk\\|skill", "title", "section", "area" } ], "excerpt" }` in code order (up to 200 with `q`, all without); `excerpt` is true while any element is still the demo\'s excerpt (not replaced by a school\'s import)',
  }),
  importStandard: endpoint({
    method: "POST",
    path: "/api/standard/import",
    access: "standard:manage",
    body: { kind: "binary" },
    answer: json<{ imported: number; updated: number; refused: { line: number; reason: string }[] }>(),
    who: "admin",
    doc: '`text/csv` body, or multipart with a `file` part (up to 2 MB): a header `code,area,element` then one element a row (`AM.II.C.S2`) → 200 `{ "imported", "updated", "refused": [ { "line", "reason" } ] }`. Rows refused (bad or repeated code, no words) are listed; the rest are stored; an element already known gets the new words; none is deleted. 415 another type; 413 too large',
  }),
  coverage: endpoint({
    method: "GET",
    path: "/api/records/students/:id/coverage",
    access: "records:view",
    params: { id: uuidSegment("That student") },
    answer: json<CoverageDto>(),
    who: "the student; their instructors; admins",
    doc: '200 `{ "student": { "id", "name" }, "elements": [ { "code", "kind", "title", "section", "area", "status": "demonstrated\\|practised\\|missing", "runId"?, "run"?: { "title", "versionNumber", "signedAt", "instructorName", "revisions" } } ], "totals": { "<section>": { "skill": { "demonstrated", "practised", "missing" }, … } } }`: demonstrated = a step mapped to it is on a signed-off run; practised = on a run started but not signed off',
  }),
  readiness: endpoint({
    method: "GET",
    path: "/api/records/students/:id/readiness",
    access: "records:view",
    params: { id: uuidSegment("That student") },
    query: z.object({ format: z.enum(["json", "csv", "pdf"]).optional().catch(undefined) }),
    answer: json<Readiness>(),
    who: "the student; their instructors; admins",
    doc: '200 `{ "student", "excerpt", "ready", "remaining", "sections": [ { "section", "counts": { "skill": { "demonstrated", "total" }, "knowledge", "risk" }, "attendedMinutes", "plannedHours", "remaining": [ { "code", "kind", "title", "area", "status": "practised\\|missing", "practisedIn" } ] } ] }`: what is left before the oral and practical test. `ready` = every skill element demonstrated and every planned hour attended. `?format=csv` one line per element left (Student, Section, Code, Kind, Area of operation, Element, Status, Practised in); `?format=pdf` the printed report',
  }),
  classCoverage: endpoint({
    method: "GET",
    path: "/api/records/classes/:id/coverage",
    access: "records:view-all",
    params: { id: uuidSegment("That class") },
    query: z.object({
      kind: z.enum(["knowledge", "risk", "skill"]).optional().catch(undefined),
      section: z.enum(Object.values(sections)).optional().catch(undefined),
    }),
    answer: json<ClassCoverageDto>(),
    who: "instructor (own classes), admin",
    doc: '`?kind=` (skill unless asked), `?section=General\\|Airframe\\|Powerplant` → 200 `{ "class", "excerpt", "kind", "elements": [ { "code", "kind", "title", "section", "area" } ], "students": [ { "id", "name", "statuses": { "<code>": "demonstrated\\|practised\\|missing" }, "demonstrated", "practised", "missing" } ], "gaps": [ codes no student has demonstrated ] }`',
  }),
};
