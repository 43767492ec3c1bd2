import { z } from "zod";
import { requireApiUser } from "@/app/_adapters/session";
import { route } from "@/lib/server/http";
import { runStatuses } from "@/lib/domain/vocabulary";
import { listReviewQueue } from "@/lib/server/runs/queries";

const statusSchema = z.enum(runStatuses.filter((s) => s !== "not_started")).catch("submitted");

export const GET = route(async (request) => {
  const actor = await requireApiUser("runs:review");
  const status = statusSchema.parse(new URL(request.url).searchParams.get("status") ?? undefined);
  return Response.json({ runs: await listReviewQueue({ actor, status }) });
});
