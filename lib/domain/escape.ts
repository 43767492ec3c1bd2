// Escaping text for the two places it goes into something that parses it (pure; server and browser).

const htmlEntities: Record<string, string> = { "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" };

/** Text made safe to place in HTML, attribute values included. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => htmlEntities[c] ?? c);
}

/** Text matched literally inside a regular expression. */
export function escapeRegExp(value: string): string {
  return value.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}
