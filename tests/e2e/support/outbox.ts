export const outboxUrl = process.env.HL_OUTBOX_URL ?? "http://127.0.0.1:2526";

export async function waitForMailTo(to: string, subject: RegExp): Promise<string> {
  const deadline = Date.now() + 20_000;
  while (Date.now() < deadline) {
    const response = await fetch(`${outboxUrl}/messages`);
    const { messages } = (await response.json()) as { messages: { to: string[]; subject: string; text: string }[] };
    const found = messages.find((m) => m.to.includes(to) && subject.exec(m.subject) !== null);
    if (found) return found.text;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`no mail to ${to}`);
}
