// A local S3-compatible server (s3rver) on loopback, for trying and testing the S3 storage path.
// Credentials are s3rver's fixed pair S3RVER / S3RVER.
//   HL_S3_PORT (default 4568), HL_S3_DIR (default .data/s3), bucket "hangarleaf"
import { mkdirSync } from "node:fs";
import S3rver from "s3rver";

const port = Number(process.env.HL_S3_PORT ?? 4568);
const directory = process.env.HL_S3_DIR ?? ".data/s3";
mkdirSync(directory, { recursive: true });

const server = new S3rver({
  address: "127.0.0.1",
  port,
  directory,
  silent: true,
  configureBuckets: [{ name: process.env.S3_BUCKET ?? "hangarleaf", configs: [] }],
});

server
  .run()
  .then(() => console.log(`fake S3 server on http://127.0.0.1:${port}`))
  .catch((error: unknown) => {
    console.error(error);
    process.exit(1);
  });

const stop = () => {
  void server.close().finally(() => process.exit(0));
  setTimeout(() => process.exit(0), 2000).unref();
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
