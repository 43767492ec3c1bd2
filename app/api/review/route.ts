import { z } from "zod";
import { requireApiUser } from "@/lib/auth/session";
import { route } from "@/lib/http";
import { runStatuses } from "@/lib/vocabulary";
import { listReviewQueue } from "@/lib/runs/runs";

const statusSchema = z.enum(runStatuses.filter((s) => s !== "not_started")).catch("submitted");

export const GET = route(async (request) => {
  const actor = await requireApiUser("runs:review");
  const status = statusSchema.parse(new URL(request.url).searchParams.get("status") ?? undefined);
  return Response.json({ runs: await listReviewQueue({ actor, status }) });
});
