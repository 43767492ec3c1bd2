// The fleet's run events, stored in the batch's transaction after the events themselves: the
// aircraft the student picked at the cart (`asset.named`) and what they found (`finding.filed`,
// its id the event's, so a batch sent again files nothing new).
import "server-only";
import { eq, inArray } from "drizzle-orm";
import type { Tx } from "@/db";
import { isUuid } from "@/lib/contracts/endpoint";
import { assets, runAssets } from "@/db/schema";
import type { Actor } from "@/lib/domain/access/permissions";
import { AppError } from "@/lib/domain/errors";
import { findingSchema } from "@/lib/domain/validation/fleet";
import type { RunEventInput } from "@/lib/domain/validation/runs";
import { fileFinding } from "@/lib/server/fleet/findings";

export async function applyFleetEvents(tx: Tx, actor: Actor, runId: string, events: readonly RunEventInput[], receivedAt: Date) {
  const named = events.filter((e) => e.type === "asset.named").sort((a, b) => a.clientTime.localeCompare(b.clientTime));
  const last = named.at(-1);
  if (last) {
    const ids = (Array.isArray(last.payload.assetIds) ? last.payload.assetIds : [])
      .filter((v): v is string => typeof v === "string")
      .slice(0, 10);
    // Ids the fleet does not know (an asset list older than the server's) are left out, not refused.
    const known = ids.length
      ? (
          await tx
            .select({ id: assets.id })
            .from(assets)
            .where(inArray(assets.id, ids.filter(isUuid)))
        ).map((r) => r.id)
      : [];
    await tx.delete(runAssets).where(eq(runAssets.runId, runId));
    if (known.length) await tx.insert(runAssets).values(known.map((assetId) => ({ runId, assetId, namedBy: actor.id })));
  }
  for (const e of events.filter((x) => x.type === "finding.filed")) {
    const input = findingSchema.safeParse({
      id: e.id,
      assetId: e.payload.assetId,
      runId,
      stepId: e.stepId,
      text: e.payload.text,
      photoKey: typeof e.payload.photoKey === "string" ? e.payload.photoKey : null,
      foundAt: e.clientTime,
    });
    // A write-up the server cannot file stays in the run's events, where the instructor reads it.
    if (!input.success) continue;
    try {
      await fileFinding(tx, { actor, input: input.data, receivedAt });
    } catch (error) {
      if (!(error instanceof AppError) || error.status >= 500) throw error;
    }
  }
}
