import type { ReactNode } from "react";
import type { CardListStatus } from "@/lib/contracts/cards";
import type { PageStatus } from "@/lib/domain/revisions/compare";
import { runStatusLabels, type RevisionStatus, type RunStatus, type UserStatus } from "@/lib/domain/vocabulary";

// Every status word the screens show, and its colour, once. No "use client" and no hooks: server
// pages and client components both render it. Run, account and revision statuses are keyed by the
// lists of lib/domain/vocabulary.ts ("overdue" is the work status of a run past its due date), page
// and card states by their own types, so a status added to one of them fails the type check here
// until it has its words.

interface Look {
  label: string;
  tone: string;
}

/** Where one screen words a status its own way: the screen, and what it says (and shows) instead. */
export type StatusScreen = "run-page" | "review" | "library";

interface Entry extends Look {
  on?: Partial<Record<StatusScreen, Partial<Look>>>;
}

const ok = "bg-ok-pale text-ok";
const amber = "bg-amber-pale text-ink";
const danger = "bg-danger-pale text-danger";
const teal = "bg-teal-pale text-teal-dark";

const looks = {
  // Said to the student in My work; the run page adds what to do next, the review queue is the instructor's.
  run: {
    not_started: {
      label: runStatusLabels.not_started,
      tone: "bg-panel text-ink border border-ink-soft",
      on: { "run-page": { tone: teal } },
    },
    in_progress: { label: runStatusLabels.in_progress, tone: teal },
    returned: {
      label: runStatusLabels.returned,
      tone: danger,
      on: { "run-page": { label: "Sent back for rework: see your instructor's comment" } },
    },
    submitted: {
      label: runStatusLabels.submitted,
      tone: amber,
      on: { "run-page": { label: "Waiting for your instructor's inspection", tone: teal } },
    },
    signed_off: { label: runStatusLabels.signed_off, tone: ok },
    overdue: { label: "Past due", tone: "bg-danger text-white" },
  } satisfies Record<RunStatus | "overdue", Entry>,
  account: {
    active: { label: "Active", tone: ok },
    invited: { label: "Invited", tone: amber },
    deactivated: { label: "Deactivated", tone: danger },
  } satisfies Record<UserStatus, Entry>,
  // A revision on the manual's page; the library's list shows the newest upload's state.
  revision: {
    queued: { label: "Waiting to be read", tone: amber },
    processing: { label: "Being read", tone: amber },
    ready: { label: "Ready", tone: ok },
    failed: { label: "Failed", tone: danger, on: { library: { label: "Last upload failed" } } },
  } satisfies Record<RevisionStatus, Entry>,
  page: {
    unchanged: { label: "Unchanged", tone: "bg-panel text-ink-soft" },
    changed: { label: "Changed", tone: amber },
    moved: { label: "Moved", tone: teal },
    added: { label: "Added", tone: ok },
    removed: { label: "Removed", tone: danger },
  } satisfies Record<PageStatus, Entry>,
  card: {
    published: { label: "Published", tone: ok },
    draft: { label: "Draft", tone: amber },
    archived: { label: "Archived", tone: "bg-line text-ink" },
  } satisfies Record<CardListStatus, Entry>,
};

export type StatusKind = keyof typeof looks;
export type StatusOf<K extends StatusKind> = keyof (typeof looks)[K] & string;

export function statusLook<K extends StatusKind>(kind: K, status: StatusOf<K>, screen?: StatusScreen): Look {
  const entry = (looks[kind] as Record<string, Entry>)[status]!;
  const own = screen ? entry.on?.[screen] : undefined;
  return { label: own?.label ?? entry.label, tone: own?.tone ?? entry.tone };
}

export function statusLabel<K extends StatusKind>(kind: K, status: StatusOf<K>, screen?: StatusScreen): string {
  return statusLook(kind, status, screen).label;
}

/** The statuses of a kind in the order the screens list them (filters, summaries). */
export function statusesOf<K extends StatusKind>(kind: K): StatusOf<K>[] {
  return Object.keys(looks[kind]) as StatusOf<K>[];
}

/**
 * A status as a badge. `children` replace the label where a screen adds to it ("Published v3",
 * "Changed: 4"); `as="li"` for a list of badges.
 */
export function StatusBadge<K extends StatusKind>({
  kind,
  status,
  screen,
  as: Tag = "span",
  className,
  children,
  "data-testid": testId,
}: {
  kind: K;
  status: StatusOf<K>;
  screen?: StatusScreen;
  as?: "span" | "li";
  className?: string;
  children?: ReactNode;
  "data-testid"?: string;
}) {
  const look = statusLook(kind, status, screen);
  return (
    <Tag data-testid={testId} className={["badge", look.tone, className].filter(Boolean).join(" ")}>
      {children ?? look.label}
    </Tag>
  );
}
