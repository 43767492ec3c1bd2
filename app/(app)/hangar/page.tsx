import type { Metadata } from "next";
import Link from "next/link";
import { requirePageUser } from "@/app/_adapters/session";
import { can } from "@/lib/domain/access/permissions";
import { bookingPurposeWords, placeKindWords, weekOf } from "@/lib/domain/fleet/fleet";
import { clockIn, dayIn } from "@/lib/domain/time";
import { listClasses } from "@/lib/server/classes";
import { listAssets } from "@/lib/server/fleet/assets";
import { listBookings, listPlaces } from "@/lib/server/fleet/bookings";
import { schoolTimeZone } from "@/lib/server/settings";
import { BookingForm } from "./_components/booking-form";

export const metadata: Metadata = { title: "Hangar plan" };

const weekday = (day: string) =>
  new Date(`${day}T12:00:00Z`).toLocaleDateString("en-US", { weekday: "short", day: "numeric", month: "short", timeZone: "UTC" });

export default async function HangarPage({ searchParams }: { searchParams: Promise<{ week?: string }> }) {
  const user = await requirePageUser("fleet:view", "/hangar");
  const zone = await schoolTimeZone();
  const { week } = await searchParams;
  const days = weekOf(/^\d{4}-\d{2}-\d{2}$/.test(week ?? "") ? week! : dayIn(zone));
  const from = new Date(`${days[0]}T00:00:00Z`).getTime() - 86_400_000;
  const [places, bookings, assets, classes] = await Promise.all([
    listPlaces(),
    listBookings({ from: new Date(from).toISOString(), to: new Date(from + 9 * 86_400_000).toISOString() }),
    listAssets(),
    can(user, "hangar:book") ? listClasses({ actor: user }) : Promise.resolve([]),
  ]);
  const shown = bookings.filter((b) => days.includes(dayIn(zone, b.startsAt)));
  const step = (n: number) => {
    const d = new Date(`${days[0]}T12:00:00Z`);
    d.setUTCDate(d.getUTCDate() + n * 7);
    return d.toISOString().slice(0, 10);
  };
  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb">
        <Link href="/fleet" className="inline-flex min-h-11 items-center">
          Fleet
        </Link>
      </nav>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="mr-auto">Hangar plan: week of {weekday(days[0]!)}</h1>
        <Link href={`/hangar?week=${step(-1)}`} className="btn btn-secondary">
          ← Week before
        </Link>
        <Link href={`/hangar?week=${step(1)}`} className="btn btn-secondary">
          Week after →
        </Link>
      </div>
      <section aria-label="The week by place" className="panel overflow-x-auto">
        <table className="data-table">
          <caption className="sr-only">Bookings by place and day; times on the school&apos;s clock</caption>
          <thead>
            <tr>
              <th scope="col">Place</th>
              {days.map((d) => (
                <th key={d} scope="col">
                  {weekday(d)}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {places.map((p) => (
              <tr key={p.id}>
                <th scope="row">
                  <span className="font-bold">{p.name}</span>
                  <span className="block text-sm text-ink-soft">
                    {placeKindWords[p.kind]}
                    {p.maxSpanMetres ? ` · up to ${p.maxSpanMetres} m` : ""}
                  </span>
                </th>
                {days.map((d) => (
                  <td key={d} className="align-top">
                    <ul className="flex flex-col gap-1">
                      {shown
                        .filter((b) => b.placeId === p.id && dayIn(zone, b.startsAt) === d)
                        .map((b) => (
                          <li
                            key={b.id}
                            className={`rounded border-l-4 px-2 py-1 text-sm ${b.purpose === "session" ? "border-teal bg-teal-pale" : "border-amber bg-amber-pale"}`}
                          >
                            <span className="font-bold">
                              {clockIn(zone, b.startsAt)}–{clockIn(zone, b.endsAt)}
                            </span>{" "}
                            <Link href={`/fleet/${b.assetId}`} className="font-mono font-bold">
                              {b.assetIdentifier}
                            </Link>
                            <span className="block">
                              {b.purpose === "session" ? (b.className ?? "No class") : bookingPurposeWords[b.purpose]}
                              {b.note ? ` · ${b.note}` : ""}
                            </span>
                          </li>
                        ))}
                    </ul>
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      {can(user, "hangar:book") ? (
        <BookingForm
          assets={assets.map((a) => ({ id: a.id, label: `${a.identifier} · ${a.model}`, kind: a.kind }))}
          places={places.map((p) => ({ id: p.id, label: p.name }))}
          classes={classes.map((c) => ({ id: c.id, label: c.name }))}
          defaultDay={days[0]!}
        />
      ) : null}
    </div>
  );
}
