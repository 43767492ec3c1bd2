// Integration tests talk to the real server and database that `npm test` starts. Run alone, they
// say what is missing instead of failing one by one.
export default function requireServer() {
  for (const name of ["HL_BASE_URL", "DATABASE_URL", "HL_OUTBOX_URL"]) {
    if (!process.env[name]) {
      throw new Error(`${name} is not set: run the integration tests through \`npm test\`, which starts the server.`);
    }
  }
}
