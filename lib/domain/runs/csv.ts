// CSV for spreadsheets (pure). RFC 4180 quoting; a cell that starts like a formula (= + - @, tab,
// CR) is prefixed with an apostrophe, so a name typed as "=HYPERLINK(...)" stays text (OWASP's
// advice on CSV injection).
export function csvCell(value: unknown): string {
  let text = value == null ? "" : String(value);
  if (/^[=+\-@\t\r]/.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

export function toCsv(header: readonly string[], rows: readonly (readonly unknown[])[]): string {
  return [header, ...rows].map((row) => row.map(csvCell).join(",")).join("\r\n") + "\r\n";
}
