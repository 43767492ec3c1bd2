// The school's fleet and hangar (pure): what the words are, what applies to an asset (effectivity),
// when a booking cannot stand, and what an installation change may do.
import { clockIn, dateTimeIn, zoneLabel } from "@/lib/domain/time";

export const assetKinds = ["aircraft", "engine", "propeller", "component"] as const;
export type AssetKind = (typeof assetKinds)[number];
export const assetStatuses = ["airworthy", "instructional", "ground_run", "out_of_service"] as const;
export type AssetStatus = (typeof assetStatuses)[number];
export const placeKinds = ["bay", "engine_stand", "ndt_room", "tie_down"] as const;
export type PlaceKind = (typeof placeKinds)[number];
export const bookingPurposes = ["session", "move_in", "move_out"] as const;
export type BookingPurpose = (typeof bookingPurposes)[number];
export const findingDecisions = ["fixed_in_run", "new_card", "deferred", "out_of_service"] as const;
export type FindingDecision = (typeof findingDecisions)[number];

export const assetKindWords: Record<AssetKind, string> = {
  aircraft: "Aircraft",
  engine: "Engine",
  propeller: "Propeller",
  component: "Component",
};
export const assetStatusWords: Record<AssetStatus, string> = {
  airworthy: "Airworthy",
  instructional: "Instructional only",
  ground_run: "Ground-run only",
  out_of_service: "Out of service",
};
export const placeKindWords: Record<PlaceKind, string> = {
  bay: "Bay",
  engine_stand: "Engine stand",
  ndt_room: "NDT room",
  tie_down: "Tie-down",
};
export const bookingPurposeWords: Record<BookingPurpose, string> = { session: "Class session", move_in: "Move in", move_out: "Move out" };
export const findingDecisionWords: Record<FindingDecision, string> = {
  fixed_in_run: "Fixed in this run",
  new_card: "New card assigned",
  deferred: "Deferred",
  out_of_service: "Asset out of service",
};

/**
 * An applicability entry as documents write it: a model ("HT-20"), or a model with a serial range
 * ("HT-20 s/n 1001-1200", en dash or hyphen). Anything else is a model name as written.
 */
export function readApplicability(entry: string): { model: string; from: number | null; to: number | null } {
  const m = /^(.*?)\s+s\/?n\s*(\d+)\s*[-–]\s*(\d+)\s*$/i.exec(entry.trim());
  if (!m) return { model: entry.trim(), from: null, to: null };
  const a = Number(m[2]);
  const b = Number(m[3]);
  return { model: m[1]!.trim(), from: Math.min(a, b), to: Math.max(a, b) };
}

const sameModel = (a: string, b: string) => a.trim().replace(/\s+/g, " ").toLowerCase() === b.trim().replace(/\s+/g, " ").toLowerCase();

/**
 * Whether a document (manual or card) applies to an asset. A document that names no model is
 * general (standard practices, say) and applies to every asset; one that names models applies
 * when one matches the asset's model and, where a serial range is given, the asset's serial
 * number (its last digits) falls inside it. A serial that is not a number matches no range.
 */
export function appliesTo(
  applicability: readonly string[],
  asset: { model: string; serial: string },
): { applies: boolean; general: boolean } {
  if (!applicability.length) return { applies: true, general: true };
  // The serial's last run of digits: "HT20-1107" is 1107.
  const serial = /(\d+)\D*$/.exec(asset.serial.trim());
  const applies = applicability.some((entry) => {
    const a = readApplicability(entry);
    if (!sameModel(a.model, asset.model)) return false;
    if (a.from === null) return true;
    return serial !== null && Number(serial[1]) >= a.from && Number(serial[1]) <= a.to!;
  });
  return { applies, general: false };
}

export interface Span {
  startsAt: string;
  endsAt: string;
}
export const overlaps = (a: Span, b: Span) =>
  Date.parse(a.startsAt) < Date.parse(b.endsAt) && Date.parse(b.startsAt) < Date.parse(a.endsAt);

export interface BookingForCheck extends Span {
  id?: string;
  assetId: string;
  placeId: string;
}

/**
 * Why a booking cannot stand, or null. Checked against the place (what it takes, how wide) and
 * the bookings not cancelled that touch the same asset or the same place.
 */
export function bookingProblem(
  booking: BookingForCheck,
  asset: { identifier: string; kind: AssetKind; spanMetres: number | null; status: AssetStatus },
  place: { name: string; takes: readonly string[]; maxSpanMetres: number | null },
  others: readonly (BookingForCheck & { assetIdentifier: string; placeName: string; className: string | null })[],
  /** The school's zone: the reason tells times on its clock. */
  zone = "UTC",
): string | null {
  if (Date.parse(booking.endsAt) <= Date.parse(booking.startsAt)) return "The booking ends before it starts.";
  if (place.takes.length && !place.takes.includes(asset.kind))
    return `${place.name} does not take ${/^[aeiou]/.test(asset.kind) ? "an" : "a"} ${asset.kind}: it takes ${place.takes.join(", ")}.`;
  if (place.maxSpanMetres !== null && asset.spanMetres !== null && asset.spanMetres > place.maxSpanMetres)
    return `${asset.identifier} spans ${asset.spanMetres} m; ${place.name} takes at most ${place.maxSpanMetres} m.`;
  const when = (b: Span) => `${dateTimeIn(zone, b.startsAt)} to ${clockIn(zone, b.endsAt)} ${zoneLabel(zone, new Date(b.startsAt))}`;
  for (const o of others) {
    if (o.id && o.id === booking.id) continue;
    if (!overlaps(booking, o)) continue;
    const who = o.className ? ` for ${o.className}` : "";
    if (o.assetId === booking.assetId) return `${asset.identifier} is already booked in ${o.placeName}${who}, ${when(o)}.`;
    if (o.placeId === booking.placeId) return `${place.name} already holds ${o.assetIdentifier}${who}, ${when(o)}.`;
  }
  return null;
}

/** What may be installed on what: an engine on an aircraft, a propeller on an engine or an aircraft, a component on anything. */
const mountsOn: Record<AssetKind, readonly AssetKind[]> = {
  aircraft: [],
  engine: ["aircraft"],
  propeller: ["engine", "aircraft"],
  component: ["aircraft", "engine", "propeller", "component"],
};

/** Why an installation change cannot be written, or null. `current` is the asset's open installation. */
export function installationProblem(
  change: { action: "install" | "remove" },
  asset: { id: string; identifier: string; kind: AssetKind },
  parent: { id: string; identifier: string; kind: AssetKind },
  current: { parentId: string; parentIdentifier: string } | null,
): string | null {
  if (asset.id === parent.id) return "An asset cannot be installed on itself.";
  if (change.action === "install") {
    if (!mountsOn[asset.kind].includes(parent.kind))
      return `${assetKindWords[asset.kind]} ${asset.identifier} does not go on ${assetKindWords[parent.kind].toLowerCase()} ${parent.identifier}.`;
    if (current) return `${asset.identifier} is still on ${current.parentIdentifier}: record its removal first.`;
    return null;
  }
  if (!current || current.parentId !== parent.id)
    return `${asset.identifier} is not installed on ${parent.identifier}${current ? ` (it is on ${current.parentIdentifier})` : ""}.`;
  return null;
}

/** The seven days (Monday first) of the week holding `day` (YYYY-MM-DD), as calendar days. */
export function weekOf(day: string): string[] {
  const d = new Date(`${day}T12:00:00Z`);
  const monday = d.getTime() - ((d.getUTCDay() + 6) % 7) * 86_400_000;
  return Array.from({ length: 7 }, (_, i) => new Date(monday + i * 86_400_000).toISOString().slice(0, 10));
}
