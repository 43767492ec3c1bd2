import type { Readable } from "node:stream";

import type { ByteRange } from "@/lib/domain/library/range";

export type { ByteRange };

/**
 * Where files live. Keys are made by Hangarleaf (ids and fixed names), never taken from user input;
 * `assertKey` refuses anything else.
 */
export interface ObjectStore {
  readonly kind: "disk" | "s3";
  put(key: string, body: Readable, contentType?: string): Promise<void>;
  get(key: string, range?: ByteRange): Promise<{ body: Readable; size: number }>;
  /** Bytes stored under the key, or null when there is nothing. */
  size(key: string): Promise<number | null>;
  delete(key: string): Promise<void>;
  /** Runs `fn` with a path on local disk holding the object (tools such as poppler need one). */
  withLocalFile<T>(key: string, fn: (path: string) => Promise<T>): Promise<T>;
}

const keyPattern = /^[a-z0-9][a-z0-9_-]*(\/[a-z0-9][a-z0-9_.-]*)*$/;

export function assertKey(key: string): string {
  if (!keyPattern.test(key) || key.includes("..") || key.length > 300) {
    throw new Error(`refused storage key ${JSON.stringify(key)}`);
  }
  return key;
}

export const storageKeys = {
  revisionFile: (revisionId: string) => assertKey(`revisions/${revisionId}/document.pdf`),
  readerCopy: (revisionId: string) => assertKey(`revisions/${revisionId}/reader.pdf`),
  thumbnail: (revisionId: string, page: number) => assertKey(`revisions/${revisionId}/thumbnails/${page}.png`),
  /** The offline packet of a set of cited pages, named by the hash of that set. */
  packet: (hash: string) => assertKey(`packets/${hash}.pdf`),
  runPhoto: (runId: string, photoId: string) => assertKey(`runs/${runId}/photos/${photoId}`),
};
