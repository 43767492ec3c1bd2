import { handle } from "@/app/_adapters/handle";
import { api } from "@/lib/contracts/endpoints";
import { databaseAnswers } from "@/lib/server/health";

export const dynamic = "force-dynamic";

export const GET = handle(api.session.health, async () => {
  if (await databaseAnswers()) return { status: "ok" as const, database: "ok" as const };
  return Response.json(
    { status: "unavailable", database: "unreachable", error: { code: "unavailable", message: "The database does not answer." } },
    { status: 503 },
  );
});
