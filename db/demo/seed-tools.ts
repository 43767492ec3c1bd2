// The demo tool room: invented kits and tools with invented numbers, two torque wrenches (one past
// its calibration), a kit out on a run, and a kit counted back in a tool short (an open hold on
// Jordan Pike's landing gear run). Idempotent: once the tool room has a kit, nothing is added.
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { assignments, runs, taskCardVersions, toolCalibrations, toolCheckouts, toolHolds, toolKits, tools, users } from "@/db/schema";
import { addDays } from "@/lib/domain/tools/tool-room";

const today = () => new Date().toISOString().slice(0, 10);

const kits = [
  { number: "K-01", name: "Sheet-metal toolbox 1", location: "Tool room, shelf A" },
  { number: "K-02", name: "Landing gear kit", location: "Tool room, shelf B" },
  { number: "K-03", name: "Rigging kit", location: "Tool room, shelf B" },
];

/** `due`: days from the seed's day to the calibration due date (negative: past due). */
const demoTools: { number: string; description: string; kit?: string; interval?: number; due?: number }[] = [
  { number: "T-101", description: "Micrometer, 0-1 in", kit: "K-01", interval: 365, due: 140 },
  { number: "T-102", description: "Rivet gun, 3X", kit: "K-01" },
  { number: "T-103", description: "Bucking bar, 1 lb", kit: "K-01" },
  { number: "T-104", description: "Rivet gauge, diameter and height", kit: "K-01" },
  { number: "T-105", description: "Deburring tool", kit: "K-01" },
  { number: "T-201", description: "Jack pad set", kit: "K-02" },
  { number: "T-202", description: "Magnifying glass, 10x", kit: "K-02" },
  { number: "T-203", description: "Cotter pin puller", kit: "K-02" },
  { number: "T-301", description: "Cable tensiometer with riser chart", kit: "K-03", interval: 365, due: 21 },
  { number: "T-302", description: "Rigging pins, set of 4", kit: "K-03" },
  { number: "TW-1", description: "Torque wrench, 0-250 in-lb", interval: 365, due: 90 },
  { number: "TW-2", description: "Torque wrench, 0-250 in-lb", interval: 365, due: -12 },
];

export async function seedTools(db: Db): Promise<number> {
  const [any] = await db.select({ id: toolKits.id }).from(toolKits).limit(1);
  if (any) return 0;
  const people = new Map((await db.select({ id: users.id, email: users.email }).from(users)).map((u) => [u.email, u.id]));
  const librarian = people.get("librarian@hangarleaf.test");
  if (!librarian) return 0;
  await db.transaction(async (tx) => {
    const kitRows = await tx.insert(toolKits).values(kits).returning({ id: toolKits.id, number: toolKits.number });
    const kitId = new Map(kitRows.map((k) => [k.number, k.id]));
    const toolRows = await tx
      .insert(tools)
      .values(
        demoTools.map((t) => ({
          number: t.number,
          description: t.description,
          kitId: t.kit ? kitId.get(t.kit)! : null,
          calibrated: t.interval !== undefined,
          calibrationIntervalDays: t.interval ?? null,
          calibrationDueOn: t.due !== undefined ? addDays(today(), t.due) : null,
        })),
      )
      .returning({ id: tools.id, number: tools.number, kitId: tools.kitId });
    const toolId = new Map(toolRows.map((t) => [t.number, t.id]));
    // Each precision tool's last certificate (invented lab and numbers).
    await tx.insert(toolCalibrations).values(
      demoTools
        .filter((t) => t.interval !== undefined)
        .map((t, i) => ({
          toolId: toolId.get(t.number)!,
          calibratedOn: addDays(today(), t.due! - t.interval!),
          calibratedBy: "Fernhollow metrology bench (demo)",
          certificate: `FH-CAL-${2400 + i}`,
          nextDueOn: addDays(today(), t.due!),
          recordedBy: librarian,
        })),
    );
    const inKit = (number: string) => toolRows.filter((t) => t.kitId === kitId.get(number)).map((t) => t.id);
    const runOf = async (email: string, title: string) => {
      const [row] = await tx
        .select({ id: runs.id })
        .from(runs)
        .innerJoin(assignments, eq(assignments.id, runs.assignmentId))
        .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
        .where(and(eq(runs.studentId, people.get(email) ?? ""), eq(taskCardVersions.title, title)));
      return row?.id ?? null;
    };
    const hour = 3_600_000;
    // Out now: the rigging kit on Riley Amsel's cable tension run.
    const riley = people.get("student3@hangarleaf.test");
    if (riley)
      await tx.insert(toolCheckouts).values({
        kitId: kitId.get("K-03")!,
        userId: riley,
        runId: await runOf("student3@hangarleaf.test", "Aileron control cable tension check"),
        toolIds: inKit("K-03"),
        dueAt: new Date(Date.now() + 6 * hour),
        checkedOutAt: new Date(Date.now() - hour),
        checkedOutBy: librarian,
      });
    // Back this morning without the magnifying glass: a hold on Jordan Pike's landing gear run.
    const jordan = people.get("student2@hangarleaf.test");
    if (jordan) {
      const runId = await runOf("student2@hangarleaf.test", "Main landing gear inspection on jacks");
      const [loan] = await tx
        .insert(toolCheckouts)
        .values({
          kitId: kitId.get("K-02")!,
          userId: jordan,
          runId,
          toolIds: inKit("K-02"),
          dueAt: new Date(Date.now() - 2 * hour),
          checkedOutAt: new Date(Date.now() - 5 * hour),
          checkedOutBy: librarian,
          returnedAt: new Date(Date.now() - 3 * hour),
          returnedBy: librarian,
        })
        .returning({ id: toolCheckouts.id });
      await tx.insert(toolHolds).values({
        checkoutId: loan!.id,
        toolId: toolId.get("T-202")!,
        userId: jordan,
        runId,
        openedAt: new Date(Date.now() - 3 * hour),
        openedBy: librarian,
      });
    }
  });
  return kits.length;
}
