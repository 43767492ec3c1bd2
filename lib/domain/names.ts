// How a person is shown where space is short: the initials a paper card's box would hold.

/** "Jonas Weber" → "JW"; "Ana María de la Cruz" → "AMDLC" is too long, so at most three letters. */
export function initialsOf(name: string): string {
  const words = name.split(/\s+/).filter(Boolean);
  const letters = words.map((w) => [...w][0]!.toLocaleUpperCase());
  return (letters.length > 3 ? [...letters.slice(0, 2), letters.at(-1)!] : letters).join("") || "?";
}
