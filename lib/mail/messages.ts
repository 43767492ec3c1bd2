// The mails Hangarleaf sends, as plain text with a simple HTML twin. Pure functions.
import { z } from "zod";

export const mailMessageSchema = z.object({
  to: z.string().min(3),
  subject: z.string().min(1).max(200),
  text: z.string(),
  html: z.string(),
});
export type MailMessage = z.infer<typeof mailMessageSchema>;

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c] ?? c);
}

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
      [
        `Hello ${input.name},`,
        `${input.invitedBy} has made you a Hangarleaf account as ${input.role}. Choose your password to start.`,
      ],
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
