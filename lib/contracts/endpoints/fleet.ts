// The fleet and hangar's endpoints (lib/contracts/endpoint.ts says how one is declared).
import { z } from "zod";
import { endpoint, json, uuidSegment } from "@/lib/contracts/endpoint";
import type { AssetDetailDto, AssetDto, BookingDto, FindingDto, PlaceDto } from "@/lib/contracts/fleet";
import {
  assetListQuerySchema,
  bookingListQuerySchema,
  bookingSchema,
  createAssetSchema,
  createPlaceSchema,
  decideFindingSchema,
  findingSchema,
  runAssetsSchema,
  updateAssetSchema,
  updateBookingSchema,
} from "@/lib/domain/validation/fleet";

const assetFields = `{ "id", "identifier", "kind": "aircraft\\|engine\\|propeller\\|component", "model", "serial", "status": "airworthy\\|instructional\\|ground_run\\|out_of_service", "statusReason", "location", "spanMetres", "installedOn": { "id", "identifier", "position" } \\| null, "openFindingCount" }`;
const bookingFields = `{ "id", "assetId", "assetIdentifier", "assetKind", "placeId", "placeName", "classId", "className", "purpose": "session\\|move_in\\|move_out", "note", "startsAt", "endsAt", "createdByName", "cancelledAt" }`;
const findingFields = `{ "id", "assetId", "assetIdentifier", "runId", "runTitle", "stepId", "stepNumber", "text", "photoKey", "reportedByName", "foundAt", "receivedAt", "decision", "decisionNote", "newAssignmentId", "closedAt", "closedByName" }`;

export interface RunAssetsDto {
  assets: { id: string; identifier: string; kind: string; model: string; status: string; statusReason: string }[];
  changes: { action: string; assetId: string; parentId: string; position: string; appliedAt: Date | null }[];
  openFindings: FindingDto[];
}

export const fleetApi = {
  listAssets: endpoint({
    method: "GET",
    path: "/api/assets",
    access: "fleet:view",
    query: assetListQuerySchema,
    answer: json<{ assets: AssetDto[] }>(),
    who: "signed in",
    doc: `\`?kind=\`, \`?q=\` words of the identifier, model or serial → 200 \`{ "assets": [ ${assetFields} ] }\` by kind and identifier`,
  }),
  createAsset: endpoint({
    method: "POST",
    path: "/api/assets",
    access: "fleet:manage",
    body: { kind: "json", schema: createAssetSchema },
    answer: json<{ asset: { id: string } }>(),
    status: 201,
    who: "admin",
    doc: `\`{ "identifier", "kind", "model", "serial"?, "status"?, "statusReason"?, "location"?, "spanMetres"? }\` → 201 \`{ "asset": { "id" } }\`. 409 an identifier already in the fleet (upper and lower case are the same)`,
  }),
  getAsset: endpoint({
    method: "GET",
    path: "/api/assets/:id",
    access: "fleet:view",
    params: { id: uuidSegment("That asset") },
    answer: json<{ asset: AssetDetailDto }>(),
    who: "signed in",
    doc: `200 \`{ "asset": ${assetFields.slice(0, -2)}, "installed": [ { "id", "identifier", "kind", "model", "position" } ], "history": [ { "asset", "parent", "position", "installedAt", "installedByName", "installedRun", "removedAt", "removedByName", "removedRun" } ], "openFindings": [ finding ], "closedFindings", "applies": { "manuals": [ { "id", "title", "applicability", "general" } ], "cards": [ … ] }, "work": [ { "runId", "title", "versionNumber", "studentName", "status", "date" } ], "bookings" } }\`: what is on it, what it was on, what applies to it (by model, and serial range where a document states one as \`MODEL s/n 1001-1200\`; a document naming no model is general), the student work on it`,
  }),
  updateAsset: endpoint({
    method: "PATCH",
    path: "/api/assets/:id",
    access: "fleet:manage",
    params: { id: uuidSegment("That asset") },
    body: { kind: "json", schema: updateAssetSchema },
    answer: json<{ asset: { id: string } }>(),
    who: "admin",
    doc: `\`{ "model"?, "serial"?, "status"?, "statusReason"?, "location"?, "spanMetres"? }\` → 200; audited (a status change as such). 422 out of service without a reason`,
  }),
  listPlaces: endpoint({
    method: "GET",
    path: "/api/places",
    access: "fleet:view",
    answer: json<{ places: PlaceDto[] }>(),
    who: "signed in",
    doc: `200 \`{ "places": [ { "id", "name", "kind": "bay\\|engine_stand\\|ndt_room\\|tie_down", "takes": [ asset kinds ], "maxSpanMetres" } ] }\``,
  }),
  createPlace: endpoint({
    method: "POST",
    path: "/api/places",
    access: "fleet:manage",
    body: { kind: "json", schema: createPlaceSchema },
    answer: json<{ place: { id: string } }>(),
    status: 201,
    who: "admin",
    doc: `\`{ "name", "kind", "takes"?: [ asset kinds ], "maxSpanMetres"? }\` → 201. 409 a name in use`,
  }),
  listBookings: endpoint({
    method: "GET",
    path: "/api/bookings",
    access: "fleet:view",
    query: bookingListQuerySchema,
    answer: json<{ bookings: BookingDto[] }>(),
    who: "signed in",
    doc: `\`?from=&to=\` (ISO times; the coming week when left out; at most 3 months), \`?assetId=\` → 200 \`{ "bookings": [ ${bookingFields} ] }\` not cancelled, by start`,
  }),
  createBooking: endpoint({
    method: "POST",
    path: "/api/bookings",
    access: "hangar:book",
    body: { kind: "json", schema: bookingSchema },
    answer: json<{ booking: BookingDto }>(),
    status: 201,
    who: "instructor (for classes they teach, or none), admin",
    doc: `\`{ "assetId", "placeId", "classId"?, "purpose"?: "session\\|move_in\\|move_out", "note"?, "startsAt", "endsAt" }\` → 201 \`{ "booking" }\`. 409 with the reason when the asset or the place is booked over that time ("Bay 2 already holds N-HL02 for Evening Cohort, …"); 422 a place that does not take that kind of asset, an aircraft wider than the bay, an end before the start, more than 14 days, a class one does not teach`,
  }),
  updateBooking: endpoint({
    method: "PATCH",
    path: "/api/bookings/:id",
    access: "hangar:book",
    params: { id: uuidSegment("That booking") },
    body: { kind: "json", schema: updateBookingSchema },
    answer: json<{ booking: BookingDto }>(),
    who: "its maker, an instructor of its class, admin (others: 404)",
    doc: `\`{ "placeId"?, "startsAt"?, "endsAt"?, "note"? }\` moves it (checked as a new one, 409 on an overlap), or \`{ "cancel": true, "reason" }\` cancels it → 200 \`{ "booking" }\`. The class's other instructors are mailed the change`,
  }),
  listFindings: endpoint({
    method: "GET",
    path: "/api/findings",
    access: "fleet:view",
    query: z.object({
      assetId: z.uuid().optional().catch(undefined),
      open: z.enum(["true", "false"]).optional().catch(undefined),
      mine: z.enum(["true"]).optional().catch(undefined),
    }),
    answer: json<{ findings: FindingDto[] }>(),
    who: "signed in",
    doc: `\`?assetId=\`, \`?open=true\\|false\`, \`?mine=true\` (those the instructor decides) → 200 \`{ "findings": [ ${findingFields} ] }\` newest first`,
  }),
  fileFinding: endpoint({
    method: "POST",
    path: "/api/findings",
    access: "findings:file",
    body: { kind: "json", schema: findingSchema },
    answer: json<{ finding: FindingDto }>(),
    status: 201,
    who: "students (on their own runs), instructors, admins",
    doc: `\`{ "id"? (UUID made on the cart), "assetId", "runId"?, "stepId"?, "text", "photoKey"?, "foundAt"? }\` → 201 \`{ "finding" }\`; the same id again → 200 with the finding as stored (stored once). A run of another student → 404; a step not on the run's card → 422. The cart files offline as a \`finding.filed\` run event with the same fields`,
  }),
  decideFinding: endpoint({
    method: "PATCH",
    path: "/api/findings/:id",
    access: "findings:decide",
    params: { id: uuidSegment("That finding") },
    body: { kind: "json", schema: decideFindingSchema },
    answer: json<{ finding: FindingDto }>(),
    who: "an instructor of the run's student (any instructor when filed without a run), admin",
    doc: `\`{ "decision": "fixed_in_run\\|new_card\\|deferred\\|out_of_service", "note"?, "newAssignmentId"? }\` → 200: closed with who and when; \`out_of_service\` puts the asset out of service with the note as the reason (deferred and out of service need the note). 409 already closed`,
  }),
  runAssets: endpoint({
    method: "GET",
    path: "/api/runs/:id/assets",
    access: "signed-in",
    params: { id: uuidSegment("That run") },
    answer: json<RunAssetsDto>(),
    who: "the run's student, its reviewers",
    doc: `200 \`{ "assets": [ { "id", "identifier", "kind", "model", "status", "statusReason" } ], "changes": [ { "action": "install\\|remove", "assetId", "parentId", "position", "appliedAt" } ], "openFindings" }\``,
  }),
  setRunAssets: endpoint({
    method: "PUT",
    path: "/api/runs/:id/assets",
    access: "signed-in",
    params: { id: uuidSegment("That run") },
    body: { kind: "json", schema: runAssetsSchema },
    answer: json<RunAssetsDto>(),
    who: "the run's student, its reviewers",
    doc: `\`{ "assetIds": [ … ], "changes"?: [ { "action": "install\\|remove", "assetId", "parentId", "position"? } ] }\` → 200: the assets the run works on (replacing those named) and the installations it makes or undoes (an engine change: the old one removed, the new one installed), written on the assets when the run is signed off (naming the run and the instructor; the sign-off is refused with 409 if the assets moved since). 422 an asset not in the fleet or a change that cannot be (an engine still on another airframe); 409 once signed off. The cart also names them offline with an \`asset.named\` run event \`{ "assetIds" }\``,
  }),
};
