import { randomUUID } from "node:crypto";
import { createWriteStream } from "node:fs";
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { DeleteObjectCommand, GetObjectCommand, HeadObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { Upload } from "@aws-sdk/lib-storage";
import { assertKey, type ObjectStore } from "@/lib/server/storage/types";

export interface S3Options {
  bucket: string;
  endpoint?: string;
  region: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  forcePathStyle: boolean;
}

export function s3Store(options: S3Options): ObjectStore {
  const client = new S3Client({
    region: options.region,
    endpoint: options.endpoint,
    forcePathStyle: options.forcePathStyle,
    credentials:
      options.accessKeyId && options.secretAccessKey
        ? { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey }
        : undefined,
  });
  const Bucket = options.bucket;

  const isMissing = (error: unknown) => {
    const e = error as { name?: string; $metadata?: { httpStatusCode?: number } };
    return e.name === "NotFound" || e.name === "NoSuchKey" || e.$metadata?.httpStatusCode === 404;
  };

  const store: ObjectStore = {
    kind: "s3",
    async put(key, body, contentType = "application/octet-stream") {
      // Multipart upload in 8 MiB parts: the body streams through, whatever its length.
      const upload = new Upload({
        client,
        params: { Bucket, Key: assertKey(key), Body: body, ContentType: contentType },
        partSize: 8 * 1024 * 1024,
        queueSize: 2,
      });
      await upload.done();
    },
    async get(key, range) {
      const result = await client.send(
        new GetObjectCommand({ Bucket, Key: assertKey(key), Range: range ? `bytes=${range.start}-${range.end}` : undefined }),
      );
      const total = range
        ? Number(/\/(\d+)$/.exec(result.ContentRange ?? "")?.[1] ?? result.ContentLength ?? 0)
        : Number(result.ContentLength ?? 0);
      return { body: result.Body as Readable, size: total };
    },
    async size(key) {
      try {
        const head = await client.send(new HeadObjectCommand({ Bucket, Key: assertKey(key) }));
        return Number(head.ContentLength ?? 0);
      } catch (error) {
        if (isMissing(error)) return null;
        throw error;
      }
    },
    async delete(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: assertKey(key) }));
    },
    async withLocalFile(key, fn) {
      const dir = await mkdtemp(path.join(tmpdir(), "hangarleaf-s3-"));
      const file = path.join(dir, `${randomUUID()}.bin`);
      try {
        const { body } = await store.get(key);
        await pipeline(body, createWriteStream(file));
        return await fn(file);
      } finally {
        await rm(dir, { recursive: true, force: true });
      }
    },
  };
  return store;
}
