import { sendJob } from "@/lib/server/jobs";

export async function queueIngest({ revisionId }: { revisionId: string }): Promise<void> {
  // A second job for the same revision (a double click, the sweeper) finds it claimed and skips.
  await sendJob("ingestRevision", { revisionId });
}

export async function queueThumbnails({ revisionId }: { revisionId: string }): Promise<void> {
  await sendJob("makeThumbnails", { revisionId });
}
