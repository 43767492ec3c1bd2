// The demo fleet and hangar: invented trainers, engines, a propeller and a magneto with invented
// identifiers and serials, three bays, a stand row, the NDT room and a tie-down, a week of bookings,
// the engine change of Noor Halvorsen's signed-off run (E-401 off HL-TR3, E-402 on) in the assets'
// history, and two open findings. Idempotent: once the fleet has an asset, nothing is added.
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db";
import {
  assetInstallations,
  assets,
  bookings,
  classes,
  findings,
  places,
  runAssetChanges,
  runAssets,
  runs,
  signOffs,
  taskCardVersions,
  users,
} from "@/db/schema";

const demoAssets = [
  {
    identifier: "HL-TR1",
    kind: "aircraft",
    model: "HT-20",
    serial: "HT20-1107",
    status: "instructional",
    location: "Bay 1",
    spanMetres: 10.4,
  },
  { identifier: "HL-TR2", kind: "aircraft", model: "HT-20", serial: "HT20-1142", status: "airworthy", location: "Bay 2", spanMetres: 10.4 },
  {
    identifier: "HL-TR3",
    kind: "aircraft",
    model: "HT-32T",
    serial: "HT32-0017",
    status: "ground_run",
    location: "Bay 3",
    spanMetres: 13.1,
  },
  {
    identifier: "E-201",
    kind: "engine",
    model: "HP-180",
    serial: "HP180-5521",
    status: "instructional",
    location: "On HL-TR1",
    spanMetres: null,
  },
  {
    identifier: "E-401",
    kind: "engine",
    model: "TF-400",
    serial: "TF4-0211",
    status: "instructional",
    location: "Stand 1",
    spanMetres: null,
  },
  {
    identifier: "E-402",
    kind: "engine",
    model: "TF-400",
    serial: "TF4-0230",
    status: "instructional",
    location: "On HL-TR3",
    spanMetres: null,
  },
  {
    identifier: "P-11",
    kind: "propeller",
    model: "FP-72",
    serial: "FP72-0933",
    status: "instructional",
    location: "On E-201",
    spanMetres: null,
  },
  {
    identifier: "M-12",
    kind: "component",
    model: "SM-4",
    serial: "SM4-2210",
    status: "instructional",
    location: "On E-201",
    spanMetres: null,
  },
] as const;

const demoPlaces = [
  { name: "Bay 1", kind: "bay", takes: ["aircraft"], maxSpanMetres: 12 },
  { name: "Bay 2", kind: "bay", takes: ["aircraft"], maxSpanMetres: 12 },
  { name: "Bay 3", kind: "bay", takes: ["aircraft"], maxSpanMetres: 14 },
  { name: "Stand 1", kind: "engine_stand", takes: ["engine"], maxSpanMetres: null },
  { name: "Stand 2", kind: "engine_stand", takes: ["engine"], maxSpanMetres: null },
  { name: "NDT room", kind: "ndt_room", takes: ["engine", "propeller", "component"], maxSpanMetres: null },
  { name: "Tie-down A", kind: "tie_down", takes: ["aircraft"], maxSpanMetres: 16 },
];

const days = (n: number) => n * 86_400_000;

export async function seedFleet(db: Db): Promise<number> {
  const [any] = await db.select({ id: assets.id }).from(assets).limit(1);
  if (any) return 0;
  const people = new Map((await db.select({ id: users.id, email: users.email }).from(users)).map((u) => [u.email, u.id]));
  const admin = people.get("admin@hangarleaf.test");
  const day = people.get("instructor@hangarleaf.test");
  const evening = people.get("instructor2@hangarleaf.test");
  if (!admin || !day || !evening) return 0;
  const classIds = new Map((await db.select({ id: classes.id, name: classes.name }).from(classes)).map((c) => [c.name, c.id]));
  await db.transaction(async (tx) => {
    const assetRows = await tx
      .insert(assets)
      .values(demoAssets.map((a) => ({ ...a, serial: a.serial })))
      .returning({ id: assets.id, identifier: assets.identifier });
    const asset = new Map(assetRows.map((a) => [a.identifier, a.id]));
    const placeRows = await tx
      .insert(places)
      .values(demoPlaces.map((p) => ({ ...p, takes: [...p.takes] })))
      .returning({ id: places.id, name: places.name });
    const place = new Map(placeRows.map((p) => [p.name, p.id]));

    // What is on what, installed before the school's records began here (no run named).
    const long = new Date(Date.now() - days(200));
    await tx.insert(assetInstallations).values([
      { assetId: asset.get("E-201")!, parentId: asset.get("HL-TR1")!, position: "Engine", installedAt: long, installedBy: admin },
      { assetId: asset.get("P-11")!, parentId: asset.get("E-201")!, position: "Propeller flange", installedAt: long, installedBy: admin },
      { assetId: asset.get("M-12")!, parentId: asset.get("E-201")!, position: "Left magneto", installedAt: long, installedBy: admin },
      { assetId: asset.get("E-401")!, parentId: asset.get("HL-TR3")!, position: "Engine", installedAt: long, installedBy: admin },
    ]);

    // The engine change, from Noor Halvorsen's signed-off run of the turbine removal card (seed-runs.ts).
    const [change] = await tx
      .select({ runId: runs.id, signedAt: signOffs.signedAt, instructorId: signOffs.instructorId })
      .from(runs)
      .innerJoin(signOffs, eq(signOffs.runId, runs.id))
      .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
      .where(
        and(
          eq(taskCardVersions.title, "Turbine engine removal and installation on the stand"),
          eq(runs.studentId, people.get("student4@hangarleaf.test")!),
        ),
      );
    if (change) {
      const at = change.signedAt;
      await tx
        .update(assetInstallations)
        .set({ removedAt: at, removedBy: change.instructorId, removedRunId: change.runId })
        .where(eq(assetInstallations.assetId, asset.get("E-401")!));
      await tx.insert(assetInstallations).values({
        assetId: asset.get("E-402")!,
        parentId: asset.get("HL-TR3")!,
        position: "Engine",
        installedAt: at,
        installedBy: change.instructorId,
        installedRunId: change.runId,
      });
      await tx.insert(runAssets).values(
        ["HL-TR3", "E-401", "E-402"].map((id) => ({
          runId: change.runId,
          assetId: asset.get(id)!,
          namedBy: people.get("student4@hangarleaf.test")!,
        })),
      );
      await tx.insert(runAssetChanges).values([
        {
          runId: change.runId,
          action: "remove",
          assetId: asset.get("E-401")!,
          parentId: asset.get("HL-TR3")!,
          position: "Engine",
          appliedAt: at,
        },
        {
          runId: change.runId,
          action: "install",
          assetId: asset.get("E-402")!,
          parentId: asset.get("HL-TR3")!,
          position: "Engine",
          appliedAt: at,
        },
      ]);
    } else {
      await tx.insert(assetInstallations).values({ assetId: asset.get("E-402")!, parentId: asset.get("HL-TR1")!, installedBy: admin });
    }

    // The runs the demo's notes name an aircraft for.
    const runOf = async (title: string, email: string) =>
      (
        await tx
          .select({ id: runs.id })
          .from(runs)
          .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
          .where(and(eq(taskCardVersions.title, title), eq(runs.studentId, people.get(email)!)))
      )[0]?.id;
    const aileron = await runOf("Aileron control cable tension check", "student3@hangarleaf.test");
    const gear = await runOf("Main landing gear inspection on jacks", "student2@hangarleaf.test");
    if (aileron)
      await tx
        .insert(runAssets)
        .values({ runId: aileron, assetId: asset.get("HL-TR1")!, namedBy: people.get("student3@hangarleaf.test")! });
    if (gear)
      await tx.insert(runAssets).values({ runId: gear, assetId: asset.get("HL-TR2")!, namedBy: people.get("student2@hangarleaf.test")! });

    // A week of bookings from this week's Monday: mornings 08:00–12:00 and evenings 18:00–21:00 on
    // the demo school's clock (America/Chicago, UTC−6 in winter), written in UTC.
    const now = new Date();
    const monday = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate()) - days((now.getUTCDay() + 6) % 7);
    const at = (dayOffset: number, hourUtc: number) => new Date(monday + days(dayOffset) + hourUtc * 3_600_000);
    const dayClass = classIds.get("AMT Day Cohort 2027") ?? null;
    const eveningClass = classIds.get("AMT Evening Cohort 2027") ?? null;
    const rows: (typeof bookings.$inferInsert)[] = [];
    for (const d of [0, 1, 2, 3, 4]) {
      rows.push({
        assetId: asset.get("HL-TR1")!,
        placeId: place.get("Bay 1")!,
        classId: dayClass,
        startsAt: at(d, 14),
        endsAt: at(d, 18),
        createdBy: day,
        note: "Flight controls and rigging",
      });
      rows.push({
        assetId: asset.get("HL-TR2")!,
        placeId: place.get("Bay 2")!,
        classId: eveningClass,
        startsAt: at(d, 24),
        endsAt: at(d, 27),
        createdBy: evening,
        note: "Landing gear and brakes",
      });
    }
    rows.push({
      assetId: asset.get("E-401")!,
      placeId: place.get("Stand 1")!,
      classId: eveningClass,
      purpose: "move_in",
      startsAt: at(0, 13),
      endsAt: at(0, 14),
      createdBy: evening,
      note: "From Bay 3 after the engine change",
    });
    rows.push({
      assetId: asset.get("HL-TR3")!,
      placeId: place.get("Bay 3")!,
      classId: eveningClass,
      startsAt: at(1, 24),
      endsAt: at(1, 27),
      createdBy: evening,
      note: "Engine ground-run preparation",
    });
    rows.push({
      assetId: asset.get("M-12")!,
      placeId: place.get("NDT room")!,
      classId: dayClass,
      startsAt: at(2, 18),
      endsAt: at(2, 21),
      createdBy: day,
      note: "Penetrant inspection practice",
    });
    await tx.insert(bookings).values(rows);

    // Two open findings: one from a run at the aircraft, one from the stand row.
    const found = new Date(Date.now() - days(1));
    await tx.insert(findings).values([
      {
        assetId: asset.get("HL-TR1")!,
        runId: aileron ?? null,
        text: "Smoking rivet (dark ring) at the left aileron hinge bracket, third rivet from the outboard end.",
        reportedBy: people.get("student3@hangarleaf.test")!,
        foundAt: found,
        receivedAt: found,
      },
      {
        assetId: asset.get("E-401")!,
        text: "Oil seep at the accessory gearbox mounting pad, about 2 cm wet area; no drips.",
        reportedBy: people.get("student4@hangarleaf.test")!,
        foundAt: found,
        receivedAt: found,
      },
    ]);
  });
  return demoAssets.length;
}
