// What the worker does for each job of lib/server/jobs.ts. A handler gets the payload already checked
// against its job's schema; what it throws is retried by pg-boss.
import { ingestRevision } from "@/lib/server/ingest/ingest-revision";
import { makeReaderCopy, makeThumbnails } from "@/lib/server/ingest/thumbnails";
import type { JobName, JobPayload } from "@/lib/server/jobs";
import { deliverMail } from "@/lib/server/mail";
import { compareRevision } from "@/lib/server/revisions/impact";

export const handlers: { [K in JobName]: (payload: JobPayload<K>) => Promise<void> } = {
  sendMail: async (message) => {
    await deliverMail(message);
    console.log(`sent "${message.subject}" to ${message.to}`);
  },
  ingestRevision: async ({ revisionId }) => {
    await ingestRevision({ revisionId });
  },
  makeThumbnails: async (payload) => {
    const packed = await makeReaderCopy(payload);
    console.log(`revision ${payload.revisionId}: reader copy ${packed ? "made" : "not made"}, ${await makeThumbnails(payload)} thumbnails`);
  },
  compareRevision: async (payload) => {
    const outcome = await compareRevision(payload);
    if (outcome.flagged)
      console.log(`revision ${payload.revisionId}: ${outcome.flagged} citations to recheck, ${outcome.mailed} instructors told`);
  },
};
