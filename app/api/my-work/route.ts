import { requireApiUser } from "@/lib/auth/session";
import { route } from "@/lib/http";
import { listMyWork } from "@/lib/runs/runs";

export const GET = route(async () => {
  const actor = await requireApiUser("runs:do");
  return Response.json({ work: await listMyWork({ actor }) }, { headers: { "Cache-Control": "private, no-store" } });
});
