import { listAuditEvents } from "@/lib/audit";
import { requireApiUser } from "@/lib/auth/session";
import { parseWith, route } from "@/lib/http";
import { auditQuerySchema } from "@/lib/validation/audit";

/** ?kind=accounts|classes|library|cards|assignments|runs&actor=&from=&to=&limit= */
export const GET = route(async (request) => {
  await requireApiUser("audit:view");
  const filter = parseWith(auditQuerySchema, Object.fromEntries(new URL(request.url).searchParams));
  return Response.json({ events: await listAuditEvents(filter) });
});
