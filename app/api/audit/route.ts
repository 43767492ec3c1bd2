import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { listAuditEvents } from "@/lib/server/audit";

export const GET = handle(api.audit.list, async ({ query }) => ({ events: await listAuditEvents(query) }));
