import { databaseAnswers } from "@/lib/server/health";

export const dynamic = "force-dynamic";

export async function GET() {
  if (await databaseAnswers()) return Response.json({ status: "ok", database: "ok" });
  return Response.json(
    { status: "unavailable", database: "unreachable", error: { code: "unavailable", message: "The database does not answer." } },
    { status: 503 },
  );
}
