// The school's settings row, read on most requests (every screen tells times in its zone), so kept
// for a few seconds per process; a change is seen everywhere within that time.
import "server-only";
import { eq, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { schoolSettings } from "@/db/schema";
import type { Actor } from "@/lib/domain/access/permissions";
import type { SchoolSettingsDto } from "@/lib/contracts/endpoints/settings";
import { isTimeZone } from "@/lib/domain/time";
import { recordAudit } from "@/lib/server/audit";

const keepMs = 5_000;
let kept: { at: number; settings: SchoolSettingsDto } | null = null;

export async function getSchoolSettings(): Promise<SchoolSettingsDto> {
  if (kept && Date.now() - kept.at < keepMs) return kept.settings;
  const [row] = await getDb()
    .select({ timeZone: schoolSettings.timeZone, plannedHours: schoolSettings.plannedHours })
    .from(schoolSettings)
    .where(eq(schoolSettings.id, "school"));
  // A zone this runtime does not know (stored by another one) is told as UTC rather than failing every page.
  const settings = { timeZone: row && isTimeZone(row.timeZone) ? row.timeZone : "UTC", plannedHours: row?.plannedHours ?? {} };
  kept = { at: Date.now(), settings };
  return settings;
}

export async function schoolTimeZone(): Promise<string> {
  return (await getSchoolSettings()).timeZone;
}

/** Changes what is sent: the zone, and the planned hours of the sections named (`null` drops a section's plan). */
export async function updateSchoolSettings({
  actor,
  timeZone,
  plannedHours,
}: {
  actor: Actor;
  timeZone?: string;
  plannedHours?: Partial<Record<string, number | null>>;
}): Promise<SchoolSettingsDto> {
  await getDb().transaction(async (tx) => {
    await tx.insert(schoolSettings).values({ id: "school" }).onConflictDoNothing();
    const [row] = await tx.select().from(schoolSettings).where(eq(schoolSettings.id, "school")).for("update");
    const hours = { ...row!.plannedHours };
    for (const [section, h] of Object.entries(plannedHours ?? {})) {
      if (h === null || h === undefined) delete hours[section];
      else hours[section] = h;
    }
    await tx
      .update(schoolSettings)
      .set({ timeZone: timeZone ?? row!.timeZone, plannedHours: hours, updatedAt: sql`now()` })
      .where(eq(schoolSettings.id, "school"));
    await recordAudit(tx, {
      actorId: actor.id,
      action: "settings.updated",
      subjectType: "settings",
      subjectId: null,
      details: { ...(timeZone !== undefined ? { timeZone } : {}), ...(plannedHours !== undefined ? { plannedHours } : {}) },
    });
  });
  kept = null;
  return getSchoolSettings();
}
