import type { NoticeKind } from "@/lib/domain/validation/cards";
import { noticeLabels } from "@/lib/domain/validation/cards";

const style: Record<NoticeKind, string> = {
  warning: "border-danger bg-danger-pale",
  caution: "border-amber bg-amber-pale",
  note: "border-ink-soft bg-panel",
};
const meaning: Record<NoticeKind, string> = {
  warning: "can injure or kill",
  caution: "can damage equipment",
  note: "information",
};

/**
 * A WARNING, CAUTION or NOTE, in the trade's meaning: injury, damage, information. Always open:
 * a hazard notice is never behind a click.
 */
export function CardNotice({ kind, text }: { kind: NoticeKind; text: string }) {
  return (
    <div role="note" aria-label={`${noticeLabels[kind]}: ${meaning[kind]}`} className={`border-4 ${style[kind]} rounded-md px-4 py-3`}>
      <p className={`text-center text-lg font-extrabold tracking-widest ${kind === "warning" ? "text-danger" : "text-ink"}`}>
        {noticeLabels[kind]}
      </p>
      <p className="whitespace-pre-line font-semibold">{text}</p>
    </div>
  );
}
