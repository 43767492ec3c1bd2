// The library endpoints (lib/contracts/endpoint.ts says how one is declared).
import { z } from "zod";
import { pageNumberSchema } from "@/lib/domain/validation/library";
import { searchParamsSchema } from "@/lib/domain/validation/search";
import { endpoint, file, json, schemaSegment, uuidSegment } from "@/lib/contracts/endpoint";
import { keepOnCartsSchema } from "@/lib/domain/validation/runs";
import type { JsonObject } from "@/lib/contracts/endpoint";
import type { ComparisonDto, RevisionStatusDto } from "@/lib/contracts/library";
import type { SearchResult } from "@/lib/contracts/search";

export const libraryApi = {
  listManuals: endpoint({
    method: "GET",
    path: "/api/manuals",
    access: "library:view",
    answer: json<{ manuals: JsonObject[] }>(),
    who: "signed in",
    doc: `200 \`{ "manuals": [ { "id", "title", "documentType", "applicability", "ataChapters", "currentRevisionId", "currentLabel", "currentDate", "pageCount", "latestStatus" } ] }\`; manuals with no ready revision only for librarians and admins`,
  }),
  createManual: endpoint({
    method: "POST",
    path: "/api/manuals",
    access: "library:manage",
    body: { kind: "multipart" },
    answer: json<{ manualId: string; revisionId: string }>(),
    status: 202,
    who: "librarian, admin",
    doc: `multipart: \`file\` (the PDF), \`title\`, \`documentType\` (\`maintenance_manual\`, \`overhaul_manual\`, \`parts_catalog\`, \`service_bulletin\`, \`airworthiness_directive\`, \`handbook\`, \`school_procedure\`), \`applicability\` and \`ataChapters\` (comma-separated, optional), \`revisionLabel\`, \`revisionDate\` (\`YYYY-MM-DD\`) → 202 \`{ "manualId", "revisionId" }\`. 413 over the limit, 415 not a PDF (by content, not name), 422 a field named in \`fields\` (also an empty or truncated file), 409 a title already in the library`,
  }),
  getManual: endpoint({
    method: "GET",
    path: "/api/manuals/:id",
    access: "library:view",
    params: { id: uuidSegment("That manual") },
    answer: json<JsonObject>(),
    who: "signed in",
    doc: `200 the manual's fields, \`currentRevisionId\` and \`revisions: [ { "id", "label", "date", "status", "pageCount", "supersededAt" } ]\` (students and instructors see ready revisions only)`,
  }),
  addRevision: endpoint({
    method: "POST",
    path: "/api/manuals/:id/revisions",
    access: "library:manage",
    params: { id: uuidSegment("That manual") },
    body: { kind: "multipart" },
    answer: json<{ revisionId: string }>(),
    status: 202,
    who: "librarian, admin",
    doc: `multipart \`file\`, \`revisionLabel\`, \`revisionDate\` → 202 \`{ "revisionId" }\`; 409 a label already used on the manual`,
  }),
  getRevision: endpoint({
    method: "GET",
    path: "/api/revisions/:id",
    access: "library:view",
    params: { id: uuidSegment("That revision") },
    answer: json<RevisionStatusDto>(),
    who: "signed in",
    doc: `200 \`{ "id", "manualId", "label", "date", "status": "queued\\|processing\\|ready\\|failed", "pagesDone", "pageCount", "error", "current", "supersededAt" }\``,
  }),
  retryRevision: endpoint({
    method: "POST",
    path: "/api/revisions/:id/retry",
    access: "library:manage",
    params: { id: uuidSegment("That revision") },
    answer: json<{ revisionId: string; status: "queued" }>(),
    status: 202,
    who: "librarian, admin",
    doc: `→ 202 for a failed revision; 409 for any other`,
  }),
  revisionFile: endpoint({
    method: "GET",
    path: "/api/revisions/:id/file",
    access: "library:view",
    params: { id: uuidSegment("That revision") },
    query: z.object({ copy: z.enum(["reader"]).optional().catch(undefined) }),
    answer: file,
    who: "signed in (not-ready revisions: librarian, admin)",
    doc: `the PDF as uploaded, or with \`copy=reader\` the copy packed for the reader (same content, objects in object streams) once it exists; a single \`Range: bytes=\` request → 206 with \`Content-Range\`, a range past the end → 416; \`Accept-Ranges\`, \`ETag\``,
  }),
  page: endpoint({
    method: "GET",
    path: "/api/revisions/:id/pages/:n",
    access: "library:view",
    params: { id: uuidSegment("That revision"), n: schemaSegment(pageNumberSchema) },
    answer: json<JsonObject>(),
    who: "signed in, ready revisions",
    doc: `200 \`{ "page", "text", "heading", "ocr", "thumbnail" }\``,
  }),
  thumbnail: endpoint({
    method: "GET",
    path: "/api/revisions/:id/pages/:n/thumbnail",
    access: "library:view",
    params: { id: uuidSegment("That revision"), n: schemaSegment(pageNumberSchema) },
    answer: file,
    who: "signed in, ready revisions",
    doc: `the page as a small PNG (made shortly after the revision is ready)`,
  }),
  search: endpoint({
    method: "GET",
    path: "/api/search",
    access: "library:view",
    query: searchParamsSchema,
    // Not compressed (no-transform): an answer is a few kilobytes, and gzip cost more of the server's
    // one thread (1.4 ms a request, bench:search profile) than the bytes cost a shop network.
    headers: { "Cache-Control": "private, no-store, no-transform" },
    answer: json<SearchResult & { tookMs: number }>(),
    who: "signed in",
    doc: `200 \`{ "hits": [ { "manualId", "revisionId", "manualTitle", "revisionLabel", "current", "page", "snippet", "score", "missing" } ], "total", "totalCapped", "partial", "missing", "goesTo": [ { "code", "manualId", "manualTitle", "revisionId", "revisionLabel", "current", "page", "heading" } ], "tookMs" }\`. \`q\`: words (typos forgiven, the last word also as a prefix), \`"phrases"\`, \`-excluded\` words; trade abbreviations and concept families (\`search/abbreviations.json\`: "ndt" finds penetrant, eddy current…) expanded. Pages with the words side by side rank first, then the words as typed above their stems and expansions. When fewer than \`limit\` pages have every word, \`partial\` is true and the hits go on with pages that have most of them (every-word pages first), each hit's \`missing\` naming the words it lacks; \`missing\` names the words no page has. An ATA code among the words (\`32-10-00\`, \`32-10\`, \`5-10\`) gives \`goesTo\`: the first page of that section in each manual whose headings have it. \`snippet\` is HTML-escaped with the matched words in \`<mark>\`. Only current revisions unless \`revision=\` or \`includeSuperseded=1\`. \`ata\` one or two digits (\`5\` is chapter 05). \`limit\` 1–50 (10), \`offset\` 0–1000; \`total\` counts up to 200 (\`totalCapped\` beyond). 422 for an empty query or a bad parameter`,
  }),
  changes: endpoint({
    method: "GET",
    path: "/api/revisions/:id/changes",
    access: "library:view",
    params: { id: uuidSegment("That revision") },
    answer: json<ComparisonDto>(),
    who: "signed in",
    doc: `200 \`{ "previousRevisionId", "pages": [ { "status": "unchanged\\|changed\\|moved\\|added\\|removed", "oldPage", "newPage", "similarity" } ], "summary": { "unchanged", "changed", "moved", "added", "removed" } }\`: the revision against the ready one before it (\`previousRevisionId\` null for a first revision), pages in the new revision's order with removed pages in their old place. Page numbers, labels, dates and running headers do not count as change. 404 until the comparison job has run (a moment after the revision is ready)`,
  }),
  keepOnCarts: endpoint({
    method: "PUT",
    path: "/api/manuals/:id/carts",
    access: "library:manage",
    params: { id: uuidSegment("That manual") },
    body: { kind: "json", schema: keepOnCartsSchema },
    answer: json<{ keepOnCarts: boolean }>(),
    who: "librarian, admin",
    doc: `\`{ "keepOnCarts": true\\|false }\` → 200: carts store the whole current PDF of this manual, not only the cited pages`,
  }),
};
