// The mails Hangarleaf sends, as plain text with a simple HTML twin. Pure functions.
import { z } from "zod";
import { escapeHtml } from "@/lib/domain/escape";

export const mailMessageSchema = z.object({
  to: z.string().min(3),
  subject: z.string().min(1).max(200),
  text: z.string(),
  html: z.string(),
});
export type MailMessage = z.infer<typeof mailMessageSchema>;

function withLink(paragraphs: string[], link: { label: string; href: string }, after: string[]) {
  const text = [...paragraphs, `${link.label}: ${link.href}`, ...after, "— Hangarleaf"].join("\n\n");
  const html = [
    ...paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    `<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p>`,
    ...after.map((p) => `<p>${escapeHtml(p)}</p>`),
    "<p>— Hangarleaf</p>",
  ].join("\n");
  return { text, html };
}

export function invitationMail(input: { to: string; name: string; invitedBy: string; link: string; role: string }): MailMessage {
  return {
    to: input.to,
    subject: "You are invited to Hangarleaf",
    ...withLink(
      [`Hello ${input.name},`, `${input.invitedBy} has made you a Hangarleaf account as ${input.role}. Choose your password to start.`],
      { label: "Choose your password", href: input.link },
      ["The link works for 7 days and once only. If you did not expect this, ignore this mail."],
    ),
  };
}

export function passwordResetMail(input: { to: string; name: string; link: string }): MailMessage {
  return {
    to: input.to,
    subject: "Reset your Hangarleaf password",
    ...withLink(
      [`Hello ${input.name},`, "Someone asked to reset the password of your Hangarleaf account."],
      { label: "Choose a new password", href: input.link },
      ["The link works for 1 hour and once only. If it was not you, ignore this mail: your password stays as it is."],
    ),
  };
}

export interface ImpactCard {
  title: string;
  link: string;
  steps: { number: number; page: number; status: string; suggested: number | null }[];
}

const statusWords: Record<string, string> = { changed: "changed", moved: "moved", removed: "is gone" };

/** One mail per instructor per revision: the cards and steps whose cited pages the revision touched. */
export function revisionImpactMail(input: {
  to: string;
  name: string;
  manualTitle: string;
  revisionLabel: string;
  previousLabel: string;
  cards: ImpactCard[];
  changesLink: string;
}): MailMessage {
  const count = input.cards.reduce((n, c) => n + c.steps.length, 0);
  const lines = (card: ImpactCard) =>
    card.steps.map(
      (s) =>
        `Step ${s.number}: page ${s.page} of ${input.previousLabel} ${statusWords[s.status] ?? s.status}${s.suggested ? `; suggested page ${s.suggested} of ${input.revisionLabel}` : "; no similar page found"}`,
    );
  const intro = [
    `Hello ${input.name},`,
    `${input.manualTitle} ${input.revisionLabel} is now the current revision. ${count === 1 ? "One page" : `${count} pages`} your published task cards cite changed, moved or went. Students keep seeing a notice on those steps until you recheck them.`,
  ];
  const text = [
    ...intro,
    ...input.cards.map((c) => [c.title, ...lines(c).map((l) => `  - ${l}`), `  Recheck: ${c.link}`].join("\n")),
    `What changed in ${input.revisionLabel}: ${input.changesLink}`,
    "— Hangarleaf",
  ].join("\n\n");
  const html = [
    ...intro.map((p) => `<p>${escapeHtml(p)}</p>`),
    ...input.cards.map(
      (c) =>
        `<h3>${escapeHtml(c.title)}</h3><ul>${lines(c)
          .map((l) => `<li>${escapeHtml(l)}</li>`)
          .join("")}</ul><p><a href="${escapeHtml(c.link)}">Recheck ${escapeHtml(c.title)}</a></p>`,
    ),
    `<p><a href="${escapeHtml(input.changesLink)}">What changed in ${escapeHtml(input.revisionLabel)}</a></p>`,
    "<p>— Hangarleaf</p>",
  ].join("\n");
  return {
    to: input.to,
    subject: `${input.manualTitle} ${input.revisionLabel}: ${input.cards.length === 1 ? "a task card" : `${input.cards.length} task cards`} to recheck`,
    text,
    html,
  };
}

/** A student at the aircraft asks for the instructor: an inspection point waits for buy-off. */
export function buyOffCallMail(input: {
  to: string;
  name: string;
  studentName: string;
  title: string;
  stepNumber: number;
  note: string;
  link: string;
}): MailMessage {
  const where = input.note ? ` (${input.note})` : "";
  return {
    to: input.to,
    subject: `${input.studentName} is waiting for a buy-off: step ${input.stepNumber} of ${input.title}`,
    ...withLink(
      [
        `Hello ${input.name},`,
        `${input.studentName} has done step ${input.stepNumber} of "${input.title}"${where}, an inspection point, and asks you to come and buy it off. The later steps wait until you do.`,
      ],
      { label: "Open the buy-off queue", href: input.link },
      [],
    ),
  };
}

/** A tool-room loan not counted back in by its due time: to the student, and to their instructors. */
export function toolsOverdueMail(input: {
  to: string;
  name: string;
  studentName: string;
  forStudent: boolean;
  what: string;
  dueAt: string;
  tools: string[];
  link: string;
}): MailMessage {
  const whose = input.forStudent ? "You have" : `${input.studentName} has`;
  return {
    to: input.to,
    subject: input.forStudent ? `Bring back ${input.what} to the tool room` : `${input.studentName} has not brought back ${input.what}`,
    ...withLink(
      [
        `Hello ${input.name},`,
        `${whose} not brought ${input.what} back to the tool room. It was due at ${input.dueAt}.`,
        `It holds: ${input.tools.join("; ")}.`,
        "A tool left in an engine or a wing is foreign-object damage waiting to happen: check the work area, then count the tools back in at the desk.",
      ],
      { label: "Open the tool room", href: input.link },
      [],
    ),
  };
}

export function bookingChangedMail(input: {
  to: string;
  name: string;
  changedBy: string;
  asset: string;
  className: string;
  purpose: string;
  before: string;
  after: string | null;
  reason: string;
  link: string;
}): MailMessage {
  const what = `${input.purpose} with ${input.asset}${input.className ? ` for ${input.className}` : ""}`;
  return {
    to: input.to,
    subject: input.after ? `Booking moved: ${input.asset}` : `Booking cancelled: ${input.asset}`,
    ...withLink(
      [
        `Hello ${input.name},`,
        input.after
          ? `${input.changedBy} changed the booking: ${what}. It was ${input.before}; it is now ${input.after}.`
          : `${input.changedBy} cancelled the booking: ${what}, ${input.before}.${input.reason ? ` Why: ${input.reason}` : ""}`,
        "Check the cards assigned for that session and tell the students where to go.",
      ],
      { label: "Open the hangar plan", href: input.link },
      [],
    ),
  };
}
