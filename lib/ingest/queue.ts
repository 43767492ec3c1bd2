import { getQueue, queues } from "../jobs";

export async function queueIngest({ revisionId }: { revisionId: string }): Promise<void> {
  const boss = await getQueue();
  // A second job for the same revision (a double click, the sweeper) finds it claimed and skips.
  await boss.send(queues.ingestRevision.name, { revisionId });
}

export async function queueThumbnails({ revisionId }: { revisionId: string }): Promise<void> {
  const boss = await getQueue();
  await boss.send(queues.makeThumbnails.name, { revisionId });
}
