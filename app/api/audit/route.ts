import { listAuditEvents } from "@/lib/server/audit";
import { requireApiUser } from "@/app/_adapters/session";
import { parseWith, route } from "@/lib/server/http";
import { auditQuerySchema } from "@/lib/domain/validation/audit";

/** ?kind=accounts|classes|library|cards|assignments|runs&actor=&from=&to=&limit= */
export const GET = route(async (request) => {
  await requireApiUser("audit:view");
  const filter = parseWith(auditQuerySchema, Object.fromEntries(new URL(request.url).searchParams));
  return Response.json({ events: await listAuditEvents(filter) });
});
