// The storage interface on both back ends: local disk, and S3 against the fake S3 server (s3rver)
// that `npm test` starts on loopback.
import { randomUUID } from "node:crypto";
import { mkdtempSync } from "node:fs";
import { readFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { Readable } from "node:stream";
import { describe, expect, it } from "vitest";
import { diskStore } from "@/lib/server/storage/disk";
import { s3Store } from "@/lib/server/storage/s3";
import type { ObjectStore } from "@/lib/server/storage/types";

async function text(stream: Readable): Promise<string> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.from(chunk as Buffer));
  return Buffer.concat(chunks).toString();
}

const endpoint = process.env.HL_TEST_S3_ENDPOINT;
const stores: [string, () => ObjectStore][] = [
  ["disk", () => diskStore(mkdtempSync(path.join(tmpdir(), "hl-store-")))],
  [
    "s3",
    () =>
      s3Store({
        bucket: "hangarleaf",
        endpoint,
        region: "us-east-1",
        accessKeyId: "S3RVER",
        secretAccessKey: "S3RVER",
        forcePathStyle: true,
      }),
  ],
];

describe.each(stores)("%s storage", (kind, make) => {
  it("stores a stream, reads it whole and by range, and deletes it", async () => {
    if (kind === "s3") expect(endpoint, "npm test starts the fake S3 server").toBeTruthy();
    const store = make();
    const key = `tests/${randomUUID()}/file.bin`;
    const body = "0123456789".repeat(2000);
    await store.put(key, Readable.from([body.slice(0, 7000), body.slice(7000)]));
    expect(await store.size(key)).toBe(body.length);
    const whole = await store.get(key);
    expect(whole.size).toBe(body.length);
    expect(await text(whole.body)).toBe(body);
    const part = await store.get(key, { start: 10, end: 24 });
    expect(part.size).toBe(body.length);
    expect(await text(part.body)).toBe(body.slice(10, 25));
    expect(await store.withLocalFile(key, (file) => readFile(file, "utf8"))).toBe(body);
    await store.delete(key);
    expect(await store.size(key)).toBeNull();
  });

  it("refuses keys that could leave its folder or bucket", async () => {
    await expect(make().put("../outside", Readable.from(["x"]))).rejects.toThrow(/refused/);
  });

  it("leaves nothing behind when the stream fails", async () => {
    const store = make();
    const key = `tests/${randomUUID()}/broken.bin`;
    const failing = new Readable({
      read() {
        this.push(Buffer.alloc(1024, 1));
        this.destroy(new Error("connection lost"));
      },
    });
    await expect(store.put(key, failing)).rejects.toThrow();
    expect(await store.size(key)).toBeNull();
  });
});
