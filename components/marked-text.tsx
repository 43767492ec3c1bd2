/**
 * A snippet from the search API: HTML-escaped text with <mark> around the matched words. Rendered
 * by splitting on the marks, never as HTML, so nothing in a manual's text can become markup.
 */
export function MarkedText({ snippet }: { snippet: string }) {
  const unescape = (s: string) =>
    s.replace(/&(amp|lt|gt|quot|#39);/g, (_, e: string) => ({ amp: "&", lt: "<", gt: ">", quot: '"', "#39": "'" })[e] ?? "");
  const parts = snippet.split(/(<mark>.*?<\/mark>)/g);
  return (
    <>
      {parts.map((part, i) =>
        part.startsWith("<mark>") ? (
          <mark key={i} className="bg-amber px-0.5 text-ink">
            {unescape(part.slice(6, -7))}
          </mark>
        ) : (
          <span key={i}>{unescape(part)}</span>
        ),
      )}
    </>
  );
}
