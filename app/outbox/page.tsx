import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { Brand } from "@/components/brand";
import { requirePageUser } from "@/app/_adapters/session";
import { getEnv } from "@/lib/server/env";

export const metadata: Metadata = { title: "Outbox" };
export const dynamic = "force-dynamic";

interface OutboxMessage {
  id: string;
  receivedAt: string;
  to: string[];
  subject: string;
  text: string;
}

/** Mail text with its links made clickable; nothing else of the mail is rendered as markup. */
function TextWithLinks({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s<>"]+)/g);
  return (
    <p className="whitespace-pre-wrap break-words">
      {parts.map((part, i) =>
        /^https?:\/\//.test(part) ? (
          <a key={i} href={part}>
            {part}
          </a>
        ) : (
          part
        ),
      )}
    </p>
  );
}

/**
 * The local fake SMTP server's messages, for trying invitations and password resets without a
 * mail service. Exists only while that fake runs (HL_OUTBOX_URL), and only for a signed-in admin:
 * every reset link is here, so anyone else reading it could take over any account.
 */
export default async function OutboxPage() {
  const url = getEnv().HL_OUTBOX_URL;
  if (!url) notFound();
  await requirePageUser("outbox:view", "/outbox");
  let messages: OutboxMessage[] = [];
  let problem: string | null = null;
  try {
    const response = await fetch(`${url}/messages`, { cache: "no-store" });
    messages = ((await response.json()) as { messages: OutboxMessage[] }).messages;
  } catch {
    problem = "The local mail server does not answer. Is `npm start` still running?";
  }
  return (
    <div className="min-h-screen">
      <header className="bg-deck px-6 py-4">
        <Brand inverted />
      </header>
      <main id="main" className="mx-auto flex max-w-4xl flex-col gap-5 px-4 py-8">
        <h1>Outbox</h1>
        <p className="notice-ok">
          Local use only: these are the mails Hangarleaf sent to its stand-in mail server. A real installation sends through the
          school&apos;s SMTP server and has no outbox page.
        </p>
        {problem ? (
          <p className="notice-error" role="alert">
            {problem}
          </p>
        ) : null}
        {!problem && messages.length === 0 ? <p>No mail sent yet.</p> : null}
        <ol className="flex flex-col gap-4">
          {messages.map((m) => (
            <li key={m.id} className="panel flex flex-col gap-2">
              <h2>{m.subject}</h2>
              <p className="text-sm text-ink-soft">
                To {m.to.join(", ")} · {m.receivedAt.replace("T", " ").slice(0, 19)} UTC
              </p>
              <TextWithLinks text={m.text} />
            </li>
          ))}
        </ol>
      </main>
    </div>
  );
}
