// The local stand-in for a real mail service: an SMTP server (smtp-server) that keeps every message
// it receives, and a small JSON API on loopback that the /outbox page and the tests read.
//   GET /messages        newest first
//   GET /messages/{id}
//   DELETE /messages     empties the outbox
import { randomUUID } from "node:crypto";
import { appendFileSync, existsSync, readFileSync, writeFileSync } from "node:fs";
import { createServer } from "node:http";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

const smtpPort = Number(process.env.HL_SMTP_PORT ?? 2525);
const httpPort = Number(process.env.HL_OUTBOX_PORT ?? 2526);
const file = process.env.HL_OUTBOX_FILE;
const maxMessages = 500;

interface StoredMessage {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

const messages: StoredMessage[] = [];
if (file && existsSync(file)) {
  for (const line of readFileSync(file, "utf8").split("\n")) {
    if (line.trim()) messages.push(JSON.parse(line) as StoredMessage);
  }
}

function keep(message: StoredMessage) {
  messages.push(message);
  if (messages.length > maxMessages) messages.splice(0, messages.length - maxMessages);
  if (file) appendFileSync(file, `${JSON.stringify(message)}\n`);
}

const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  size: 10 * 1024 * 1024,
  logger: false,
  onData(stream, session, callback) {
    simpleParser(stream)
      .then((parsed) => {
        keep({
          id: randomUUID(),
          receivedAt: new Date().toISOString(),
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
          to: session.envelope.rcptTo.map((r) => r.address),
          subject: parsed.subject ?? "",
          text: parsed.text ?? "",
          html: typeof parsed.html === "string" ? parsed.html : "",
        });
        callback();
      })
      .catch((error: Error) => callback(error));
  },
});
smtp.on("error", (error) => console.error("smtp error", error));
smtp.listen(smtpPort, "127.0.0.1", () => console.log(`fake SMTP server on 127.0.0.1:${smtpPort}`));

const api = createServer((request, response) => {
  const url = new URL(request.url ?? "/", "http://localhost");
  const send = (status: number, body: unknown) => {
    response.writeHead(status, { "content-type": "application/json" });
    response.end(JSON.stringify(body));
  };
  if (url.pathname === "/messages" && request.method === "GET") {
    return send(200, { messages: [...messages].reverse() });
  }
  if (url.pathname === "/messages" && request.method === "DELETE") {
    messages.length = 0;
    if (file) writeFileSync(file, "");
    return send(200, { messages: [] });
  }
  const one = /^\/messages\/([\w-]+)$/.exec(url.pathname);
  if (one && request.method === "GET") {
    const found = messages.find((m) => m.id === one[1]);
    return found ? send(200, found) : send(404, { error: { code: "not_found", message: "No such message." } });
  }
  send(404, { error: { code: "not_found", message: "Not found." } });
});
api.listen(httpPort, "127.0.0.1", () => console.log(`outbox API on http://127.0.0.1:${httpPort}/messages`));

const stop = () => {
  smtp.close(() => undefined);
  api.close(() => process.exit(0));
  setTimeout(() => process.exit(0), 2000).unref();
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
