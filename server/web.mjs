// The web process: Next.js behind a thin Node HTTP server of our own, for the one thing `next
// start` cannot do: tell the app who is on the socket. Next fills X-Forwarded-For from the socket
// only when the client did not send one, so a client could name any address it liked and dodge
// sign-in throttling. Here the header is always rewritten (see edge.mjs). An address with broken
// percent-encoding is answered here too (400, the API's error shape): Next would re-encode it.
//   node server/web.mjs [--dev]     PORT picks the port; HL_TRUSTED_PROXIES names proxies to believe
import http from "node:http";
import path from "node:path";
import { fileURLToPath } from "node:url";
import next from "next";
import { clientAddressOf, hasBrokenEncoding, parseTrustedProxies } from "./edge.mjs";

const dev = process.argv.includes("--dev");
const port = Number(process.env.PORT ?? 3000);
const dir = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const trusted = parseTrustedProxies(process.env.HL_TRUSTED_PROXIES);

const app = next({ dev, dir, port, hostname: "localhost" });
await app.prepare();
const handle = app.getRequestHandler();

const server = http.createServer((request, response) => {
  if (hasBrokenEncoding(request.url ?? "/")) {
    const message = "The address has broken percent-encoding (such as %E0%A4 cut short).";
    response.writeHead(400, { "content-type": "application/json; charset=utf-8" });
    response.end(JSON.stringify({ error: { code: "bad_request", message } }));
    return;
  }
  request.headers["x-forwarded-for"] = clientAddressOf(request.socket.remoteAddress, request.headers["x-forwarded-for"], trusted);
  void handle(request, response);
});
server.keepAliveTimeout = 65_000; // past common load balancers' idle timeout, as next start does
server.listen(port, () => console.log(`web server on port ${port}${trusted.size ? `, trusting proxies ${[...trusted].join(", ")}` : ""}`));

const stop = () => server.close(() => process.exit(0));
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
