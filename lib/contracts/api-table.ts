// The README's API table, made from the endpoint declarations (`npm run api:table` writes it; the
// unit test api-contract.test.ts fails when the README's copy is stale).
import { shownPath, type Endpoint } from "@/lib/contracts/endpoint";

export const tableStart = "<!-- api-table: made by `npm run api:table` from lib/contracts/endpoints; do not edit by hand -->";
export const tableEnd = "<!-- /api-table -->";

export function renderApiTable(endpoints: Endpoint[]): string {
  const rows = endpoints.map((e) => `| \`${e.method} ${shownPath(e)}\` | ${e.who} | ${e.doc} |`);
  return [tableStart, "| method and path | who | body → answer |", "| --- | --- | --- |", ...rows, tableEnd].join("\n");
}

/** The README with its table replaced (or the same text when it is current). */
export function withApiTable(readme: string, table: string): string {
  const start = readme.indexOf(tableStart);
  const end = readme.indexOf(tableEnd);
  if (start < 0 || end < start) throw new Error("The README has no api-table markers.");
  return readme.slice(0, start) + table + readme.slice(end + tableEnd.length);
}

export function currentApiTable(readme: string): string | null {
  const start = readme.indexOf(tableStart);
  const end = readme.indexOf(tableEnd);
  return start < 0 || end < start ? null : readme.slice(start, end + tableEnd.length);
}
