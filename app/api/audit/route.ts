import { z } from "zod";
import { listAuditEvents } from "@/lib/audit";
import { requireApiUser } from "@/lib/auth/session";
import { parseWith, route } from "@/lib/http";

const querySchema = z.object({ limit: z.coerce.number().int().min(1).max(1000).default(200) });

export const GET = route(async (request) => {
  await requireApiUser("audit:view");
  const { limit } = parseWith(querySchema, Object.fromEntries(new URL(request.url).searchParams));
  return Response.json({ events: await listAuditEvents({ limit }) });
});
