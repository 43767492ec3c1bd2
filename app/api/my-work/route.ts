import { requireApiUser } from "@/app/_adapters/session";
import { route } from "@/lib/server/http";
import { listMyWork } from "@/lib/server/runs/queries";

export const GET = route(async () => {
  const actor = await requireApiUser("runs:do");
  return Response.json({ work: await listMyWork({ actor }) }, { headers: { "Cache-Control": "private, no-store" } });
});
