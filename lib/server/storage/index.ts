import { getEnv } from "@/lib/server/env";
import { diskStore } from "@/lib/server/storage/disk";
import { s3Store } from "@/lib/server/storage/s3";
import type { ObjectStore } from "@/lib/server/storage/types";

export { storageKeys, type ByteRange, type ObjectStore } from "@/lib/server/storage/types";

let store: ObjectStore | undefined;

/** The store chosen by HL_STORAGE; one per process. */
export function getStore(): ObjectStore {
  if (store) return store;
  const env = getEnv();
  store =
    env.HL_STORAGE === "s3"
      ? s3Store({
          bucket: env.S3_BUCKET,
          endpoint: env.S3_ENDPOINT,
          region: env.S3_REGION,
          accessKeyId: env.S3_ACCESS_KEY_ID,
          secretAccessKey: env.S3_SECRET_ACCESS_KEY,
          forcePathStyle: env.S3_FORCE_PATH_STYLE === "1",
        })
      : diskStore(env.HL_STORAGE_DIR);
  return store;
}
