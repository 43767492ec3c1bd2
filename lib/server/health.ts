import "server-only";
import { sql } from "drizzle-orm";
import { getDb } from "@/db";

/** Whether the database answers: what /api/health reports (503 when it does not). */
export async function databaseAnswers(): Promise<boolean> {
  try {
    await getDb().execute(sql`select 1`);
    return true;
  } catch (error) {
    console.error("health check: database did not answer", error);
    return false;
  }
}
