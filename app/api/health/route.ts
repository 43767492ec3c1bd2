import { sql } from "drizzle-orm";
import { getDb } from "@/db";

export const dynamic = "force-dynamic";

export async function GET() {
  try {
    await getDb().execute(sql`select 1`);
    return Response.json({ status: "ok", database: "ok" });
  } catch (error) {
    console.error("health check: database did not answer", error);
    return Response.json(
      { status: "unavailable", database: "unreachable", error: { code: "unavailable", message: "The database does not answer." } },
      { status: 503 },
    );
  }
}
