// ATA chapters as the trade writes them: two digits. People type "5" for chapter 05; every form
// and filter reads it the same way.

/** "5" is chapter 05; anything else is returned trimmed, for the schema to judge. */
export function ataChapterOf(text: string): string {
  const t = text.trim();
  return /^\d$/.test(t) ? `0${t}` : t;
}
