// Hours on a run, from its events (pure). A run is worked in sittings: the time between two events
// counts only up to `idleMinutes`, so a card left open over lunch does not add an hour.
export const idleMinutes = 20;

/**
 * How long before its receipt an event may say it happened: a cart can work offline for a shop
 * session and send it all at the end, but not for days. Eight hours is a long school day (common
 * practice for a shift; our bound, not a published one).
 */
export const offlineHours = 8;

export function activeMinutes(clientTimes: readonly string[], idle = idleMinutes): number {
  const times = clientTimes
    .map((t) => Date.parse(t))
    .filter(Number.isFinite)
    .sort((a, b) => a - b);
  let ms = 0;
  for (let i = 1; i < times.length; i++) ms += Math.min(times[i]! - times[i - 1]!, idle * 60_000);
  return Math.round(ms / 60_000);
}

/**
 * Working time bounded by what the server saw. Each event counts at its cart stamp, moved into the
 * window it could honestly have happened in: not before the run was assigned, not before
 * `offlineHours` ahead of its receipt, and not after its receipt. So the total is at most the time
 * from the first receipt to the last plus one offline session, however the cart's clock was set;
 * an event not yet received counts at its stamp (the cart's own view).
 */
export function workingMinutes(
  events: readonly { clientTime: string; serverTime?: string | null }[],
  { assignedAt }: { assignedAt: string },
): number {
  const assigned = Date.parse(assignedAt);
  const times = events.map((e) => {
    const stamp = Date.parse(e.clientTime);
    if (!e.serverTime) return stamp;
    const received = Date.parse(e.serverTime);
    const earliest = Math.max(assigned, received - offlineHours * 3_600_000);
    return Math.min(Math.max(stamp, earliest), received);
  });
  return activeMinutes(times.filter(Number.isFinite).map((t) => new Date(t).toISOString()));
}
