// What the fleet and hangar's forms and routes take. One schema per body, shared by the form and the handler.
import { z } from "zod";
import { assetKinds, assetStatuses, bookingPurposes, findingDecisions, placeKinds } from "@/lib/domain/fleet/fleet";

const words = (what: string, max: number) =>
  z
    .string({ error: `Give ${what}.` })
    .trim()
    .min(1, `Give ${what}.`)
    .max(max, `Use at most ${max} characters for ${what}.`);
const optionalText = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`).optional().default("");
const span = z
  .number({ error: "The span is a number of metres." })
  .positive("The span is more than 0 m.")
  .max(100, "No school aircraft spans more than 100 m.")
  .nullable()
  .optional()
  .default(null);
const instant = (what: string) => z.iso.datetime({ offset: true, error: `${what} is a date and time, such as 2026-12-07T08:00:00-06:00.` });

export const createAssetSchema = z.object({
  identifier: words("the registration or school number", 30),
  kind: z.enum(assetKinds, { error: "An asset is an aircraft, an engine, a propeller or a component." }),
  model: words("the model", 60),
  serial: optionalText(40),
  status: z.enum(assetStatuses, { error: "Choose a status." }).optional().default("instructional"),
  statusReason: optionalText(300),
  location: optionalText(80),
  spanMetres: span,
});

export const updateAssetSchema = z
  .object({
    model: words("the model", 60).optional(),
    serial: z.string().trim().max(40).optional(),
    status: z.enum(assetStatuses, { error: "Choose a status." }).optional(),
    statusReason: z.string().trim().max(300, "Use at most 300 characters.").optional(),
    location: z.string().trim().max(80, "Use at most 80 characters.").optional(),
    spanMetres: span.optional(),
  })
  .strict()
  .refine((a) => a.status !== "out_of_service" || (a.statusReason ?? "").length > 0, {
    message: "Say why it is out of service: everyone starting a run on it reads this.",
    path: ["statusReason"],
  });

export const assetListQuerySchema = z.object({
  kind: z.enum(assetKinds).optional().catch(undefined),
  q: z.string().trim().max(60).optional().catch(undefined),
});

export const createPlaceSchema = z.object({
  name: words("the place's name", 60),
  kind: z.enum(placeKinds, { error: "A place is a bay, an engine stand, the NDT room or a tie-down." }),
  takes: z.array(z.enum(assetKinds)).max(4).optional().default([]),
  maxSpanMetres: span,
});

export const bookingSchema = z
  .object({
    assetId: z.uuid("Choose the asset."),
    placeId: z.uuid("Choose the place."),
    classId: z.uuid("Choose a class.").nullable().optional().default(null),
    purpose: z.enum(bookingPurposes, { error: "A booking is a class session, a move in or a move out." }).optional().default("session"),
    note: optionalText(300),
    startsAt: instant("The start"),
    endsAt: instant("The end"),
  })
  .refine((b) => Date.parse(b.endsAt) > Date.parse(b.startsAt), { message: "The end comes after the start.", path: ["endsAt"] })
  .refine((b) => Date.parse(b.endsAt) - Date.parse(b.startsAt) <= 14 * 86_400_000, {
    message: "A booking lasts at most 14 days; book a longer stay in parts.",
    path: ["endsAt"],
  });

/** A change of a booking: where, when, or cancelling it (with why, told to the classes affected). */
export const updateBookingSchema = z
  .object({
    placeId: z.uuid("Choose the place.").optional(),
    startsAt: instant("The start").optional(),
    endsAt: instant("The end").optional(),
    note: z.string().trim().max(300).optional(),
    cancel: z.boolean().optional(),
    reason: z.string().trim().max(300, "Use at most 300 characters.").optional().default(""),
  })
  .strict()
  .refine((b) => !b.cancel || b.reason.length > 0, {
    message: "Say why it is cancelled: the instructors affected are told.",
    path: ["reason"],
  });

export const bookingListQuerySchema = z.object({
  from: z.iso.datetime({ offset: true }).optional().catch(undefined),
  to: z.iso.datetime({ offset: true }).optional().catch(undefined),
  assetId: z.uuid().optional().catch(undefined),
});

export const findingSchema = z.object({
  /** Made on the cart, so a finding sent twice is stored once. */
  id: z.uuid("A finding's id is a UUID made on the cart.").optional(),
  assetId: z.uuid("Choose the aircraft or part it was found on."),
  runId: z.uuid().nullable().optional().default(null),
  stepId: z.uuid().nullable().optional().default(null),
  text: words("what was found (where, what it looks like)", 2000),
  photoKey: z.string().trim().max(200).nullable().optional().default(null),
  foundAt: z.iso.datetime({ offset: true }).optional(),
});

export const decideFindingSchema = z
  .object({
    decision: z.enum(findingDecisions, { error: "Choose what happens: fixed in the run, a new card, deferred, or out of service." }),
    note: optionalText(1000),
    newAssignmentId: z.uuid().nullable().optional().default(null),
  })
  .refine((d) => d.decision !== "deferred" || d.note.length > 0, { message: "Say until when or why it is deferred.", path: ["note"] })
  .refine((d) => d.decision !== "out_of_service" || d.note.length > 0, {
    message: "Say why the asset is out of service: everyone starting a run on it reads this.",
    path: ["note"],
  });

export const runAssetsSchema = z.object({
  assetIds: z.array(z.uuid("An asset id is a UUID.")).max(10, "Name at most 10 assets on one run."),
  /** Installations the run makes or undoes, written on the assets when it is signed off (removals first). */
  changes: z
    .array(
      z.object({
        action: z.enum(["install", "remove"], { error: "A change installs or removes." }),
        assetId: z.uuid("Choose what is installed or removed."),
        parentId: z.uuid("Choose what it goes on or comes off."),
        position: optionalText(40),
      }),
    )
    .max(6, "At most 6 installation changes on one run.")
    .optional()
    .default([]),
});
