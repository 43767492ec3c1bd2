import { randomUUID } from "node:crypto";
import { createReadStream, createWriteStream } from "node:fs";
import { mkdir, rename, rm, rmdir, stat } from "node:fs/promises";
import path from "node:path";
import type { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import { assertKey, type ByteRange, type ObjectStore } from "@/lib/server/storage/types";

export function diskStore(root: string): ObjectStore {
  const base = path.resolve(root);
  const full = (key: string) => path.join(base, ...assertKey(key).split("/"));

  return {
    kind: "disk",
    async put(key, body) {
      const target = full(key);
      await mkdir(path.dirname(target), { recursive: true });
      // Written beside the target and renamed: a reader never sees half a file.
      const partial = `${target}.${randomUUID()}.part`;
      try {
        await pipeline(body, createWriteStream(partial));
        await rename(partial, target);
      } catch (error) {
        await rm(partial, { force: true });
        throw error;
      }
    },
    async get(key, range?: ByteRange) {
      const file = full(key);
      const { size } = await stat(file);
      const body: Readable = range ? createReadStream(file, { start: range.start, end: range.end }) : createReadStream(file);
      return { body, size };
    },
    async size(key) {
      try {
        return (await stat(full(key))).size;
      } catch {
        return null;
      }
    },
    async delete(key) {
      const file = full(key);
      await rm(file, { force: true });
      // Leave no empty folder behind; a folder that still holds files stays.
      await rmdir(path.dirname(file)).catch(() => undefined);
    },
    async withLocalFile(key, fn) {
      return fn(full(key));
    },
  };
}
