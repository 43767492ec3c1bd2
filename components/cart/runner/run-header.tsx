import { StatusBadge } from "@/components/status-badge";
import { dateTimeIn } from "@/lib/domain/time";
import type { RunDetailDto } from "@/lib/contracts/runs";
import type { RunEvent, RunStatus } from "@/lib/domain/runs/fold";

/**
 * The top of the run: the card's title and status, what the student must know before the steps
 * (a newer version, the instructor's comment, the sign-off) and the lists to gather first.
 */
export function RunHeader({ detail, status, returned }: { detail: RunDetailDto; status: RunStatus; returned: RunEvent | undefined }) {
  const version = detail.version;
  return (
    <>
      <header className="flex flex-col gap-1">
        <p className="text-sm font-bold uppercase tracking-wider text-ink-soft">Task card · version {version.number}</p>
        <h1 className="text-3xl">{version.title}</h1>
        <p className="text-ink-soft">
          {[
            detail.run.dueOn ? `Due ${detail.run.dueOn}` : null,
            detail.run.note || null,
            version.estimatedMinutes ? `About ${version.estimatedMinutes} min` : null,
          ]
            .filter(Boolean)
            .join(" · ")}
        </p>
        <p>
          <StatusBadge kind="run" status={status} screen="run-page" className="text-base" data-testid="run-status" />
        </p>
      </header>

      {detail.run.newerVersion ? (
        <p role="note" className="rounded-md border-4 border-dashed border-deck bg-teal-pale px-4 py-3 font-semibold">
          Version {detail.run.newerVersion} of this card is published. This assignment uses version {version.number}, as it was given; ask
          your instructor before you switch.
        </p>
      ) : null}
      {returned && status !== "signed_off" ? (
        <div role="note" aria-label="Instructor's comment" className="rounded-md border-4 border-danger bg-danger-pale px-4 py-3">
          <p className="font-bold">Sent back for rework by your instructor</p>
          <p className="whitespace-pre-line text-lg">{String(returned.payload?.comment ?? "")}</p>
        </div>
      ) : null}
      {detail.signOff ? (
        <p role="note" className="rounded-md border-4 border-ok bg-ok-pale px-4 py-3 text-lg font-semibold">
          Signed off by {detail.signOff.instructorName} on {dateTimeIn(detail.timeZone ?? "UTC", detail.signOff.signedAt)}.
          {detail.signOff.comment ? ` “${detail.signOff.comment}”` : ""}
        </p>
      ) : null}

      <div className="grid gap-3 sm:grid-cols-3">
        <RunTools detail={detail} />
        {[
          ["Protective equipment", version.protectiveEquipment],
          ["Consumables", version.consumables],
        ].map(([title, items]) =>
          (items as string[]).length ? (
            <section key={title as string} aria-label={title as string} className="panel">
              <h2 className="text-lg font-bold">{title as string}</h2>
              <ul className="ml-5 list-disc">
                {(items as string[]).map((item) => (
                  <li key={item}>{item}</li>
                ))}
              </ul>
            </section>
          ) : null,
        )}
      </div>
    </>
  );
}

const lineWords = { have: "you have it out", missing: "not checked out to you", free_text: "" } as const;

/**
 * The card's tools, each line naming a tool-room number checked against what the student has out
 * ("have" / "missing"), so a missing wrench is fetched before the work starts, not half way.
 */
function RunTools({ detail }: { detail: RunDetailDto }) {
  const lines = detail.tools?.lines ?? detail.version.tools.map((text) => ({ text, number: null, status: "free_text" as const }));
  const out = detail.tools?.checkedOut ?? [];
  if (!lines.length && !out.length) return null;
  return (
    <section aria-label="Tools" className="panel">
      <h2 className="text-lg font-bold">Tools</h2>
      <ul className="flex flex-col gap-1">
        {lines.map((line) => (
          <li key={line.text} className="flex gap-2">
            <span
              aria-hidden
              className={`font-bold ${line.status === "have" ? "text-ok" : line.status === "missing" ? "text-danger" : ""}`}
            >
              {line.status === "have" ? "✓" : line.status === "missing" ? "✗" : "•"}
            </span>
            <span>
              {line.text}
              {line.status !== "free_text" ? (
                <span className={line.status === "missing" ? " font-semibold text-danger" : " text-ink-soft"}>
                  {" "}
                  ({lineWords[line.status]})
                </span>
              ) : null}
            </span>
          </li>
        ))}
      </ul>
      {out.length ? (
        <p className="hint mt-2">Checked out to you: {out.map((t) => t.number).join(", ")}.</p>
      ) : detail.tools ? (
        <p className="hint mt-2">Nothing is checked out to you at the tool room.</p>
      ) : null}
    </section>
  );
}
