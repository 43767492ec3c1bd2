// Which card draft the reader cites pages into: kept in the browser, per user, so a shared cart
// never offers one instructor's draft to another.
export interface CitingTarget {
  cardId: string;
  title: string;
  stepId?: string;
}

const key = (userId: string) => `hangarleaf.citing.${userId}`;

export function readCitingTarget(userId: string): CitingTarget | null {
  try {
    const raw = window.localStorage.getItem(key(userId));
    const value = raw ? (JSON.parse(raw) as Partial<CitingTarget>) : null;
    return value && typeof value.cardId === "string" && typeof value.title === "string" ? (value as CitingTarget) : null;
  } catch {
    return null;
  }
}

export function writeCitingTarget(userId: string, target: CitingTarget | null) {
  try {
    if (target) window.localStorage.setItem(key(userId), JSON.stringify(target));
    else window.localStorage.removeItem(key(userId));
  } catch {
    // Private windows may refuse storage; citing from the reader is then unavailable, nothing else.
  }
}
