import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { fileFindingNow, listFindings } from "@/lib/server/fleet/findings";

export const GET = handle(api.fleet.listFindings, async ({ actor, query }) => ({
  findings: await listFindings({
    actor,
    assetId: query.assetId,
    open: query.open === undefined ? undefined : query.open === "true",
    mine: query.mine === "true",
  }),
}));

/** 201 for a new finding; 200 with the stored one when its id was filed before. */
export const POST = handle(api.fleet.fileFinding, async ({ actor, body }) => {
  const { finding, created } = await fileFindingNow({ actor, input: body });
  return created ? { finding } : Response.json({ finding }, { status: 200 });
});
