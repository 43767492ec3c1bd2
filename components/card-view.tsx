import Link from "next/link";
import { calculators } from "@/lib/domain/calc";
import { describeLimit } from "@/lib/domain/calc/limits";
import type { CardVersionDto } from "@/lib/contracts/cards";
import { sortNotices } from "@/lib/domain/validation/cards";
import { CalculatorPanel } from "./calculators/calculator-panel";
import { CardNotice } from "./card-notice";
import { LimitCheckField } from "./limit-check-field";
import { StepMarkdown } from "./step-markdown";

function List({ title, items }: { title: string; items: string[] }) {
  if (!items.length) return null;
  return (
    <section aria-label={title}>
      <h3 className="font-bold">{title}</h3>
      <ul className="ml-5 list-disc">
        {items.map((item) => (
          <li key={item}>{item}</li>
        ))}
      </ul>
    </section>
  );
}

/**
 * A card version as students see it: used by the card page and by the editor's preview, so the
 * preview is exactly the student's view. Notices come before the step they guard, in the trade's
 * order (WARNING, CAUTION, NOTE), and are never collapsed.
 */
export function CardView({ version }: { version: CardVersionDto }) {
  const facts = [
    version.ataChapter ? `ATA ${version.ataChapter}` : null,
    version.subjectName,
    version.applicability.length ? `Applies to ${version.applicability.join(", ")}` : null,
    version.estimatedMinutes ? `About ${version.estimatedMinutes} min` : null,
  ].filter(Boolean);
  return (
    <article className="flex flex-col gap-5" aria-label={`Task card ${version.title}`}>
      <header className="flex flex-col gap-1">
        <p className="text-sm font-bold uppercase tracking-wider text-ink-soft">
          Task card · version {version.number} ·{" "}
          {version.status === "published" ? `published ${version.publishedAt?.slice(0, 10) ?? ""}` : "draft, not yet for use"}
        </p>
        <h2 className="text-2xl">{version.title || "Untitled task card"}</h2>
        {facts.length ? <p className="text-ink-soft">{facts.join(" · ")}</p> : null}
      </header>
      <div className="grid gap-4 sm:grid-cols-3">
        <List title="Protective equipment" items={version.protectiveEquipment} />
        <List title="Tools" items={version.tools} />
        <List title="Consumables" items={version.consumables} />
      </div>
      <ol className="flex flex-col gap-4" aria-label="Steps">
        {version.steps.map((step, i) => (
          <li key={step.id} className="panel flex flex-col gap-3" aria-label={`Step ${i + 1}`}>
            <div className="flex flex-wrap items-center gap-2">
              <h3 className="mr-auto text-xl font-bold">Step {i + 1}</h3>
              {step.inspectionPoint ? <span className="badge bg-deck text-white">Inspection point: instructor buy-off</span> : null}
              {step.timerMinutes ? <span className="badge bg-teal-pale text-teal-dark">Timer {step.timerMinutes} min</span> : null}
            </div>
            {step.underRecheck ? (
              <p
                role="note"
                aria-label="Recheck pending"
                className="rounded-md border-4 border-dashed border-deck bg-teal-pale px-4 py-3 font-semibold"
              >
                A newer revision of the manual changed a page this step cites. Your instructor is rechecking this step: work from the
                current revision and ask your instructor before you go on.
              </p>
            ) : null}
            {sortNotices(step.notices).map((n, j) => (
              <CardNotice key={j} kind={n.kind} text={n.text} />
            ))}
            {step.text.trim() ? <StepMarkdown text={step.text} /> : <p className="hint">No instruction written yet.</p>}
            {step.measurement ? (
              <LimitCheckField
                id={`measure-${step.id}`}
                label={`${step.measurement.label} (limits ${describeLimit(step.measurement)})`}
                limit={step.measurement}
              />
            ) : null}
            {step.references.length ? (
              <div>
                <h4 className="font-semibold">Manual pages</h4>
                <ul className="flex flex-col gap-1">
                  {step.references.map((r) => (
                    <li key={`${r.revisionId}-${r.page}`} className="flex flex-wrap items-center gap-2">
                      <Link
                        href={`/library/${r.manualId}/${r.revisionId}/${r.page}${r.quote ? `?q=${encodeURIComponent(r.quote)}` : ""}`}
                        className="inline-flex min-h-11 items-center font-semibold"
                      >
                        {r.manualTitle}, {r.revisionLabel}, page {r.page}
                      </Link>
                      {r.current ? null : <span className="badge bg-danger-pale text-danger">superseded revision</span>}
                      {r.quote ? <q className="text-ink-soft">{r.quote}</q> : null}
                    </li>
                  ))}
                </ul>
              </div>
            ) : null}
            {step.calculator ? (
              <details className="rounded-md border-2 border-line p-3">
                <summary className="min-h-11 cursor-pointer py-2 font-semibold">
                  {calculators[step.calculator].title}: open the calculator
                </summary>
                <CalculatorPanel slug={step.calculator} headingLevel={4} />
              </details>
            ) : null}
          </li>
        ))}
        {version.steps.length === 0 ? <li className="hint">No steps yet.</li> : null}
      </ol>
    </article>
  );
}
