// The hangar plan: places, and bookings of an asset at a place for a time. Two bookings of one
// asset or one place never overlap: the asset's row and the place's row are locked (asset first,
// then place) before the check, so two desks booking at once cannot both succeed. A change or a
// cancellation mails the instructors of the booking's class.
import "server-only";
import { and, asc, eq, gt, inArray, isNull, lt, ne, or } from "drizzle-orm";
import type { z } from "zod";
import { getDb, type Db, type Tx } from "@/db";
import { assets, bookings, classes, classMembers, places, users } from "@/db/schema";
import type { BookingDto, PlaceDto } from "@/lib/contracts/fleet";
import { can, type Actor } from "@/lib/domain/access/permissions";
import { AppError, databaseErrorCode } from "@/lib/domain/errors";
import {
  bookingProblem,
  bookingPurposeWords,
  type AssetKind,
  type AssetStatus,
  type BookingPurpose,
  type PlaceKind,
} from "@/lib/domain/fleet/fleet";
import { dateTimeIn } from "@/lib/domain/time";
import type { bookingSchema, createPlaceSchema, updateBookingSchema } from "@/lib/domain/validation/fleet";
import { recordAudit } from "@/lib/server/audit";
import { getEnv } from "@/lib/server/env";
import { queueMail } from "@/lib/server/mail";
import { bookingChangedMail } from "@/lib/server/mail/messages";
import { schoolTimeZone } from "@/lib/server/settings";

const bookingNotFound = () => new AppError("not_found", "That booking was not found.");

export async function listPlaces(): Promise<PlaceDto[]> {
  const rows = await getDb().select().from(places).orderBy(asc(places.kind), asc(places.name));
  return rows.map((p) => ({
    id: p.id,
    name: p.name,
    kind: p.kind as PlaceKind,
    takes: p.takes as AssetKind[],
    maxSpanMetres: p.maxSpanMetres,
  }));
}

export async function createPlace({ actor, input }: { actor: Actor; input: z.output<typeof createPlaceSchema> }) {
  try {
    return await getDb().transaction(async (tx) => {
      const [row] = await tx.insert(places).values(input).returning({ id: places.id });
      await recordAudit(tx, {
        actorId: actor.id,
        action: "place.created",
        subjectType: "place",
        subjectId: row!.id,
        details: { name: input.name },
      });
      return { id: row!.id };
    });
  } catch (error) {
    if (databaseErrorCode(error) === "23505")
      throw new AppError("conflict", `${input.name} is already a place.`, { fields: { name: "Already a place." } });
    throw error;
  }
}

const bookingSelect = {
  b: bookings,
  assetIdentifier: assets.identifier,
  assetKind: assets.kind,
  placeName: places.name,
  className: classes.name,
  createdByName: users.name,
};

const toDto = (r: {
  b: typeof bookings.$inferSelect;
  assetIdentifier: string;
  assetKind: string;
  placeName: string;
  className: string | null;
  createdByName: string;
}): BookingDto => ({
  id: r.b.id,
  assetId: r.b.assetId,
  assetIdentifier: r.assetIdentifier,
  assetKind: r.assetKind as AssetKind,
  placeId: r.b.placeId,
  placeName: r.placeName,
  classId: r.b.classId,
  className: r.className,
  purpose: r.b.purpose as BookingPurpose,
  note: r.b.note,
  startsAt: r.b.startsAt.toISOString(),
  endsAt: r.b.endsAt.toISOString(),
  createdByName: r.createdByName,
  cancelledAt: r.b.cancelledAt?.toISOString() ?? null,
});

function bookingQuery(db: Db | Tx) {
  return db
    .select(bookingSelect)
    .from(bookings)
    .innerJoin(assets, eq(assets.id, bookings.assetId))
    .innerJoin(places, eq(places.id, bookings.placeId))
    .leftJoin(classes, eq(classes.id, bookings.classId))
    .innerJoin(users, eq(users.id, bookings.createdBy));
}

/** Bookings not cancelled that touch [from, to) (the coming week when not given), by start. */
export async function listBookings({ from, to, assetId }: { from?: string; to?: string; assetId?: string } = {}): Promise<BookingDto[]> {
  const start = from ? new Date(from) : new Date(Date.now() - 86_400_000);
  const end = to ? new Date(to) : new Date(start.getTime() + 8 * 86_400_000);
  if (end.getTime() - start.getTime() > 93 * 86_400_000)
    throw new AppError("invalid", "Ask for at most three months of bookings at a time.");
  const rows = await bookingQuery(getDb())
    .where(
      and(
        isNull(bookings.cancelledAt),
        lt(bookings.startsAt, end),
        gt(bookings.endsAt, start),
        assetId ? eq(bookings.assetId, assetId) : undefined,
      ),
    )
    .orderBy(asc(bookings.startsAt))
    .limit(2000);
  return rows.map(toDto);
}

/** An instructor books for the classes they are staff of (or for no class); an admin for any. */
async function assertMayBookFor(db: Db | Tx, actor: Actor, classId: string | null) {
  if (!classId || can(actor, "classes:view-all")) return;
  const [member] = await db
    .select({ id: classMembers.userId })
    .from(classMembers)
    .where(and(eq(classMembers.classId, classId), eq(classMembers.userId, actor.id)));
  if (!member) throw new AppError("invalid", "Book for a class you teach.", { fields: { classId: "Not a class of yours." } });
}

async function checkBooking(tx: Tx, booking: { id?: string; assetId: string; placeId: string; startsAt: string; endsAt: string }) {
  const [asset] = await tx.select().from(assets).where(eq(assets.id, booking.assetId)).for("update");
  if (!asset) throw new AppError("invalid", "That asset is not in the fleet.", { fields: { assetId: "Not in the fleet." } });
  const [place] = await tx.select().from(places).where(eq(places.id, booking.placeId)).for("update");
  if (!place) throw new AppError("invalid", "That place is not in the hangar plan.", { fields: { placeId: "Not a place." } });
  const others = await bookingQuery(tx).where(
    and(
      isNull(bookings.cancelledAt),
      or(eq(bookings.assetId, booking.assetId), eq(bookings.placeId, booking.placeId)),
      lt(bookings.startsAt, new Date(booking.endsAt)),
      gt(bookings.endsAt, new Date(booking.startsAt)),
      booking.id ? ne(bookings.id, booking.id) : undefined,
    ),
  );
  const problem = bookingProblem(
    booking,
    { identifier: asset.identifier, kind: asset.kind as AssetKind, spanMetres: asset.spanMetres, status: asset.status as AssetStatus },
    { name: place.name, takes: place.takes, maxSpanMetres: place.maxSpanMetres },
    others.map(toDto),
    await schoolTimeZone(),
  );
  if (problem) {
    // Overlaps are conflicts with what is already booked; a place that cannot take the asset is a bad request.
    const overlap = others.length > 0 && !/does not take|spans|ends before/.test(problem);
    throw new AppError(overlap ? "conflict" : "invalid", problem, { fields: { [overlap ? "startsAt" : "placeId"]: problem } });
  }
  return { asset, place };
}

export async function createBooking({ actor, input }: { actor: Actor; input: z.output<typeof bookingSchema> }): Promise<BookingDto> {
  const id = await getDb().transaction(async (tx) => {
    await assertMayBookFor(tx, actor, input.classId);
    if (input.classId) {
      const [klass] = await tx.select({ id: classes.id }).from(classes).where(eq(classes.id, input.classId));
      if (!klass) throw new AppError("invalid", "That class was not found.", { fields: { classId: "Not a class." } });
    }
    const { asset, place } = await checkBooking(tx, input);
    const [row] = await tx
      .insert(bookings)
      .values({ ...input, startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt), createdBy: actor.id })
      .returning({ id: bookings.id });
    await recordAudit(tx, {
      actorId: actor.id,
      action: "booking.created",
      subjectType: "booking",
      subjectId: row!.id,
      details: { asset: asset.identifier, place: place.name, startsAt: input.startsAt, endsAt: input.endsAt, purpose: input.purpose },
    });
    return row!.id;
  });
  return getBooking(id);
}

async function getBooking(id: string): Promise<BookingDto> {
  const [row] = await bookingQuery(getDb()).where(eq(bookings.id, id));
  if (!row) throw bookingNotFound();
  return toDto(row);
}

/**
 * Moves, re-times or cancels a booking. Its maker, an instructor of its class, or an admin. The
 * instructors of its class (but the one making the change) are mailed what changed.
 */
export async function updateBooking({ actor, id, input }: { actor: Actor; id: string; input: z.output<typeof updateBookingSchema> }) {
  const db = getDb();
  const { before, after } = await db.transaction(async (tx) => {
    const [row] = await tx.select().from(bookings).where(eq(bookings.id, id)).for("update");
    if (!row) throw bookingNotFound();
    const staff =
      row.createdBy === actor.id ||
      can(actor, "classes:view-all") ||
      (row.classId !== null &&
        (await tx
          .select({ id: classMembers.userId })
          .from(classMembers)
          .where(and(eq(classMembers.classId, row.classId), eq(classMembers.userId, actor.id)))
          .then((r) => r.length > 0)));
    if (!staff) throw bookingNotFound();
    if (row.cancelledAt) throw new AppError("conflict", "This booking is cancelled already.");
    const before = toDto((await bookingQuery(tx).where(eq(bookings.id, id)))[0]!);
    if (input.cancel) {
      await tx.update(bookings).set({ cancelledAt: new Date(), cancelledBy: actor.id }).where(eq(bookings.id, id));
    } else {
      const next = {
        id,
        assetId: row.assetId,
        placeId: input.placeId ?? row.placeId,
        startsAt: input.startsAt ?? row.startsAt.toISOString(),
        endsAt: input.endsAt ?? row.endsAt.toISOString(),
      };
      if (Date.parse(next.endsAt) <= Date.parse(next.startsAt))
        throw new AppError("invalid", "The end comes after the start.", { fields: { endsAt: "The end comes after the start." } });
      await checkBooking(tx, next);
      await tx
        .update(bookings)
        .set({ placeId: next.placeId, startsAt: new Date(next.startsAt), endsAt: new Date(next.endsAt), note: input.note ?? row.note })
        .where(eq(bookings.id, id));
    }
    const after = toDto((await bookingQuery(tx).where(eq(bookings.id, id)))[0]!);
    await recordAudit(tx, {
      actorId: actor.id,
      action: input.cancel ? "booking.cancelled" : "booking.changed",
      subjectType: "booking",
      subjectId: id,
      details: {
        asset: before.assetIdentifier,
        from: `${before.placeName} ${before.startsAt}–${before.endsAt}`,
        to: input.cancel ? null : `${after.placeName} ${after.startsAt}–${after.endsAt}`,
        reason: input.reason,
      },
    });
    return { before, after };
  });
  // After the commit: nobody is told of a change that was rolled back.
  await mailBookingChange(db, actor, before, after, input.cancel ? input.reason : "");
  return after;
}

async function mailBookingChange(db: Db, actor: Actor, before: BookingDto, after: BookingDto, cancelReason: string) {
  if (!before.classId) return;
  const staff = await db
    .select({ email: users.email, name: users.name })
    .from(classMembers)
    .innerJoin(users, eq(users.id, classMembers.userId))
    .where(
      and(
        eq(classMembers.classId, before.classId),
        inArray(users.role, ["instructor", "admin"]),
        eq(users.status, "active"),
        ne(users.id, actor.id),
      ),
    );
  if (!staff.length) return;
  const [me] = await db.select({ name: users.name }).from(users).where(eq(users.id, actor.id));
  const zone = await schoolTimeZone();
  const when = (b: BookingDto) => `${b.placeName}, ${dateTimeIn(zone, b.startsAt)} to ${dateTimeIn(zone, b.endsAt)}`;
  for (const s of staff)
    await queueMail(
      bookingChangedMail({
        to: s.email,
        name: s.name,
        changedBy: me?.name ?? "Someone",
        asset: before.assetIdentifier,
        className: before.className ?? "",
        purpose: bookingPurposeWords[before.purpose],
        before: when(before),
        after: after.cancelledAt ? null : when(after),
        reason: cancelReason,
        link: `${getEnv().APP_URL}/hangar?week=${after.startsAt.slice(0, 10)}`,
      }),
    );
}

/** Bookings from now over the coming days: what an assignment can be done in. */
export function upcomingBookings(days = 21) {
  const now = Date.now();
  return listBookings({ from: new Date(now).toISOString(), to: new Date(now + days * 86_400_000).toISOString() });
}
