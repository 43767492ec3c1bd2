import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CardNotice } from "@/components/card-notice";
import { StepMarkdown } from "@/components/step-markdown";
import { describeLimit } from "@/lib/domain/calc/limits";
import { requirePageUser } from "@/app/_adapters/session";
import { isUuid } from "@/lib/server/http";
import { getRunDetail } from "@/lib/server/runs/queries";
import { sortNotices } from "@/lib/domain/validation/cards";
import { reopenedStepIds, type Reading } from "@/lib/domain/runs/fold";
import { initialsOf } from "@/lib/domain/names";
import { clockIn, dateTimeIn, zoneLabel } from "@/lib/domain/time";
import { ReviewActions } from "../_components/review-actions";
import { ToolHolds } from "@/components/tool-holds";
import { can } from "@/lib/domain/access/permissions";
import { notFoundOnMissing } from "@/app/_adapters/not-found";

export const metadata: Metadata = { title: "Review a run" };

const eventLabel: Record<string, string> = {
  "step.checked": "marked done",
  "step.unchecked": "undid",
  "value.recorded": "recorded a reading",
  "note.added": "added a note",
  "photo.added": "added a photo",
  "timer.started": "started the timer",
  "timer.stopped": "stopped the timer",
  "inspection.called": "called the instructor to",
  "inspection.bought_off": "bought off",
  "run.submitted": "handed in",
  "run.returned": "sent the run back for rework",
  "run.signed_off": "signed off",
};

const verdict = (r: Reading) =>
  r.judgement.status === "in" ? "within limits" : r.judgement.status === "out" ? "OUT OF LIMITS" : "not understood";

export default async function ReviewRunPage({ params }: { params: Promise<{ runId: string }> }) {
  const { runId } = await params;
  const user = await requirePageUser("runs:review", `/review/${runId}`);
  if (!isUuid(runId)) notFound();
  const detail = await getRunDetail({ actor: user, runId }).catch(notFoundOnMissing);
  const { version, state, run } = detail;
  const stepNumber = new Map(version.steps.map((s, i) => [s.id, i + 1]));
  const zone = detail.timeZone;
  const shortTime = (iso: string) => dateTimeIn(zone, iso);
  const names = new Map(detail.events.map((e) => [e.userId, e.userName]));
  const nameOf = (id: string) => names.get(id) ?? (id === run.studentId ? run.studentName : "someone");
  const lateById = new Map(state.late.map((l) => [l.id, l]));
  const ignoredById = new Map(state.ignored.map((i) => [i.id, i.reason]));
  const revisions = [...new Map(version.steps.flatMap((s) => s.references).map((r) => [r.revisionId, r])).values()];
  return (
    <div className="flex flex-col gap-5">
      <nav aria-label="Breadcrumb">
        <Link href="/review" className="inline-flex min-h-11 items-center">
          Review
        </Link>
      </nav>
      <header className="flex flex-col gap-1">
        <h1>
          {run.studentName}: {version.title}
        </h1>
        <p className="text-ink-soft">
          Version {version.number} · {run.subjectName ?? "no subject"} · {run.dueOn ? `due ${run.dueOn}` : "no due date"}{" "}
          {run.note ? `· ${run.note}` : ""}
        </p>
        <p>
          Manual revisions cited:{" "}
          {revisions.map((r) => `${r.manualTitle} ${r.revisionLabel}${r.current ? "" : " (superseded)"}`).join("; ") || "none"}
        </p>
      </header>
      {detail.signOff ? (
        <p role="note" className="rounded-md border-4 border-ok bg-ok-pale px-4 py-3 font-semibold">
          Signed off by {detail.signOff.instructorName} on {shortTime(detail.signOff.signedAt)} {zoneLabel(zone)} (version{" "}
          {detail.signOff.versionNumber}). The record cannot change.
        </p>
      ) : null}

      {detail.tools.holds.length ? (
        <section aria-labelledby="run-holds" className="panel flex flex-col gap-3">
          <h2 id="run-holds">Held: a tool lent for this work is missing</h2>
          <ToolHolds
            holds={detail.tools.holds}
            canClear={can(user, "tools:clear-holds")}
            openedAt={Object.fromEntries(detail.tools.holds.map((h) => [h.id, shortTime(h.openedAt)]))}
          />
        </section>
      ) : null}

      <ReviewActions
        runId={runId}
        status={state.status}
        who={`${run.studentName}'s run of "${version.title}" (version ${version.number})`}
        steps={version.steps.map((s, i) => {
          const st = state.steps[s.id]!;
          return {
            id: s.id,
            number: i + 1,
            checked: st.checked,
            boughtOff: !!st.boughtOff,
            inspectionPoint: s.inspectionPoint,
            outOfLimits: !!st.value && st.value.judgement.status !== "in",
          };
        })}
      />

      <section aria-label="Steps" className="flex flex-col gap-3">
        <h2>Steps</h2>
        <ol className="flex flex-col gap-3">
          {version.steps.map((step, i) => {
            const s = state.steps[step.id]!;
            return (
              <li key={step.id} className={`panel flex flex-col gap-2 border-l-8 ${s.checked ? "border-l-ok" : "border-l-line"}`}>
                <div className="flex flex-wrap items-center gap-2">
                  <h3 className="mr-auto text-lg font-bold">
                    Step {i + 1} {s.checked ? "· done" : "· not done"}
                  </h3>
                  {s.checkedBy ? <span className="badge bg-panel text-ink">Done by {initialsOf(nameOf(s.checkedBy))}</span> : null}
                  {s.reopened && !s.checked ? <span className="badge bg-danger-pale text-danger">Reopened for rework</span> : null}
                  {step.inspectionPoint ? (
                    <span className="badge bg-deck text-white">
                      {s.boughtOff ? "Bought off" : s.called ? `Buy-off called for ${shortTime(s.called.at)}` : "Inspection point"}
                    </span>
                  ) : null}
                </div>
                {sortNotices(step.notices).map((n, j) => (
                  <CardNotice key={j} kind={n.kind} text={n.text} />
                ))}
                <StepMarkdown text={step.text} />
                {step.measurement ? (
                  <div className="flex flex-col gap-1">
                    <p className={s.value ? (s.value.judgement.status === "in" ? "notice-ok" : "notice-error") : "hint"}>
                      {step.measurement.label} (limits {describeLimit(step.measurement)}):{" "}
                      {s.value
                        ? `${s.value.text}, ${verdict(s.value)}. ${s.value.judgement.message}${s.value.tool ? ` Taken with ${s.value.tool}.` : ""}`
                        : s.readings.length
                          ? "no reading since the step was reopened"
                          : "no reading recorded"}
                    </p>
                    {s.readings.length > 1 || (s.readings.length === 1 && !s.value) ? (
                      <table className="text-sm">
                        <caption className="text-left font-semibold">Every reading of this step, oldest first</caption>
                        <thead>
                          <tr>
                            <th className="pr-4 text-left">When (cart)</th>
                            <th className="pr-4 text-left">Reading</th>
                            <th className="text-left">Verdict</th>
                          </tr>
                        </thead>
                        <tbody>
                          {s.readings.map((r, j) => (
                            <tr key={j} className={r.judgement.status === "in" ? "" : "font-bold text-danger"}>
                              <td className="pr-4 font-mono">{shortTime(r.at)}</td>
                              <td className="pr-4">
                                {r.text}
                                {r.tool ? ` (${r.tool})` : ""}
                              </td>
                              <td>{verdict(r)}</td>
                            </tr>
                          ))}
                        </tbody>
                      </table>
                    ) : null}
                  </div>
                ) : null}
                {s.timer ? (
                  <p>
                    Timer {s.timer.minutes} min started {clockIn(zone, s.timer.startedAt)}
                    {s.timer.stoppedAt ? `, stopped ${clockIn(zone, s.timer.stoppedAt)}` : ""}
                  </p>
                ) : null}
                {s.notes.map((n, j) => (
                  <p key={j} className="rounded border border-line bg-paper px-3 py-2">
                    Note: {n.text}
                  </p>
                ))}
                {s.photos.length ? (
                  <div className="flex flex-wrap gap-2">
                    {s.photos.map((p) =>
                      detail.photos.some((x) => x.id === p.key) ? (
                        <a key={p.key} href={`/api/runs/${runId}/photos/${p.key}`} target="_blank" rel="noreferrer">
                          {/* eslint-disable-next-line @next/next/no-img-element -- a stored photo behind the API, not a static asset */}
                          <img
                            src={`/api/runs/${runId}/photos/${p.key}`}
                            alt={`Photo of step ${i + 1}`}
                            className="h-32 rounded border border-line object-cover"
                          />
                        </a>
                      ) : (
                        <span key={p.key} className="hint">
                          A photo is still on the cart, not sent yet.
                        </span>
                      ),
                    )}
                  </div>
                ) : null}
              </li>
            );
          })}
        </ol>
      </section>

      <section aria-label="Everything that happened" className="panel">
        <h2>Everything that happened</h2>
        <ol className="flex flex-col gap-1">
          {detail.events.map((e) => {
            const late = lateById.get(e.id);
            const setAside = ignoredById.get(e.id);
            return (
              <li key={e.id} className="text-sm">
                <span className="font-mono">{shortTime(e.clientTime)}</span> · {e.userName} {eventLabel[e.type] ?? e.type}
                {e.stepId ? ` step ${stepNumber.get(e.stepId) ?? "?"}` : ""}
                {typeof e.payload?.value === "string" ? `: ${e.payload.value}` : ""}
                {typeof e.payload?.comment === "string" && e.payload.comment ? `: “${e.payload.comment}”` : ""}
                {e.type === "run.returned" && reopenedStepIds(e.payload).length
                  ? ` (to do again: step ${reopenedStepIds(e.payload)
                      .map((id) => stepNumber.get(id) ?? "?")
                      .join(", ")})`
                  : ""}
                {late ? (
                  <strong className="ml-2 rounded border border-line px-1">
                    {`arrived after the ${late.after} of ${shortTime(late.at)}${e.serverTime ? ` (received ${shortTime(e.serverTime)})` : ""}`}
                  </strong>
                ) : null}
                {setAside ? (
                  <span className="ml-2 hint">{`not counted: ${late ? setAside.replace(/^arrived after the [^:]+: /, "") : setAside}`}</span>
                ) : null}
              </li>
            );
          })}
          {detail.events.length === 0 ? <li>Nothing yet.</li> : null}
        </ol>
        {state.ignored.length ? (
          <p className="hint mt-2">
            {state.ignored.length} event(s) set aside and not part of the record: each says why above. Times are the cart&apos;s clock (
            {zoneLabel(zone)}); an event the server received after a buy-off, hand-in or sign-off never changes what was reviewed.
          </p>
        ) : null}
      </section>
    </div>
  );
}
