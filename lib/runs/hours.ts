// Hours on a run, from its events (pure). A run is worked in sittings: the time between two events
// counts only up to `idleMinutes`, so a card left open over lunch does not add an hour.
export const idleMinutes = 20;

export function activeMinutes(clientTimes: readonly string[], idle = idleMinutes): number {
  const times = clientTimes.map((t) => Date.parse(t)).filter(Number.isFinite).sort((a, b) => a - b);
  let ms = 0;
  for (let i = 1; i < times.length; i++) ms += Math.min(times[i]! - times[i - 1]!, idle * 60_000);
  return Math.round(ms / 60_000);
}
