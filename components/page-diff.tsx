import { diffWords } from "diff";

/**
 * Two page texts side by side, the words that differ marked: struck through on the old page,
 * underlined on the new one. Rendered as text, never as HTML.
 */
export function PageDiff({
  oldTitle,
  newTitle,
  oldText,
  newText,
}: {
  oldTitle: string;
  newTitle: string;
  oldText: string;
  newText: string | null;
}) {
  const parts = newText === null ? [] : diffWords(oldText, newText);
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <section className="panel" aria-label={oldTitle}>
        <h3 className="mb-2 font-bold">{oldTitle}</h3>
        <p className="whitespace-pre-line leading-relaxed">
          {newText === null
            ? oldText
            : parts.map((p, i) =>
                p.added ? null : p.removed ? (
                  <del key={i} className="bg-danger-pale text-danger decoration-2">
                    {p.value}
                  </del>
                ) : (
                  <span key={i}>{p.value}</span>
                ),
              )}
        </p>
      </section>
      <section className="panel" aria-label={newTitle}>
        <h3 className="mb-2 font-bold">{newTitle}</h3>
        {newText === null ? (
          <p className="hint">No page suggested.</p>
        ) : (
          <p className="whitespace-pre-line leading-relaxed">
            {parts.map((p, i) =>
              p.removed ? null : p.added ? (
                <ins key={i} className="bg-ok-pale font-semibold text-ok decoration-2">
                  {p.value}
                </ins>
              ) : (
                <span key={i}>{p.value}</span>
              ),
            )}
          </p>
        )}
      </section>
    </div>
  );
}
