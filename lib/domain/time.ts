// Days and times as the school tells them: stored times are UTC, and every screen, mail and "is it
// overdue" reads them in the school's time zone (a setting). Pure: Intl does the zone arithmetic.

/** Whether the runtime knows this IANA zone ("Europe/Oslo", "America/Denver", "UTC"). */
export function isTimeZone(zone: string): boolean {
  if (!zone || zone.length > 64) return false;
  try {
    new Intl.DateTimeFormat("en-GB", { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

const formatters = new Map<string, Intl.DateTimeFormat>();
function partsIn(date: Date, zone: string) {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat("en-GB", {
      timeZone: isTimeZone(zone) ? zone : "UTC",
      year: "numeric",
      month: "2-digit",
      day: "2-digit",
      hour: "2-digit",
      minute: "2-digit",
      hourCycle: "h23",
    });
    formatters.set(zone, f);
  }
  const parts = Object.fromEntries(f.formatToParts(date).map((p) => [p.type, p.value]));
  return { day: `${parts.year}-${parts.month}-${parts.day}`, clock: `${parts.hour}:${parts.minute}` };
}

const toDate = (at: string | Date) => (typeof at === "string" ? new Date(at) : at);

/** The calendar day it is (or was) in the zone, YYYY-MM-DD: what due dates are compared with. */
export function dayIn(zone: string, at: string | Date = new Date()): string {
  return partsIn(toDate(at), zone).day;
}

/** "2026-12-02 14:05" in the zone. */
export function dateTimeIn(zone: string, at: string | Date): string {
  const p = partsIn(toDate(at), zone);
  return `${p.day} ${p.clock}`;
}

/** "14:05" in the zone. */
export function clockIn(zone: string, at: string | Date): string {
  return partsIn(toDate(at), zone).clock;
}

/** The zone's short name for a footnote ("CET", "MST", "UTC"), so a time read out of context says which clock. */
export function zoneLabel(zone: string, at: Date = new Date()): string {
  try {
    const name = new Intl.DateTimeFormat("en-US", { timeZone: zone, timeZoneName: "short" })
      .formatToParts(at)
      .find((p) => p.type === "timeZoneName")?.value;
    return name ?? zone;
  } catch {
    return "UTC";
  }
}
