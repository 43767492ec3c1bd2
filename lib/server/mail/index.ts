import nodemailer, { type Transporter } from "nodemailer";
import { getEnv } from "@/lib/server/env";
import { sendJob } from "@/lib/server/jobs";
import type { MailMessage } from "@/lib/server/mail/messages";

/** Mail goes through the job queue: a slow or absent SMTP server never holds up a request. */
export async function queueMail(message: MailMessage): Promise<void> {
  await sendJob("sendMail", message);
}

let transport: Transporter | undefined;

/** Called by the worker for each queued mail. */
export async function deliverMail(message: MailMessage): Promise<void> {
  const env = getEnv();
  transport ??= nodemailer.createTransport(env.SMTP_URL);
  await transport.sendMail({ from: env.MAIL_FROM, ...message });
}
