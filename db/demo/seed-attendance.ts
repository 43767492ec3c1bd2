// Demo class sessions for the day cohort: two past sessions with their registers (one closed, with
// a correction), so hours and attendance show on a fresh start. Invented; idempotent.
import { and, eq } from "drizzle-orm";
import type { Db } from "@/db";
import { attendanceEntries, classMembers, classSessions, classes, users } from "@/db/schema";

export async function seedAttendance(db: Db): Promise<number> {
  const [klass] = await db.select({ id: classes.id }).from(classes).where(eq(classes.name, "AMT Day Cohort 2027"));
  const [teacher] = await db.select({ id: users.id }).from(users).where(eq(users.email, "instructor@hangarleaf.test"));
  if (!klass || !teacher) return 0;
  const [any] = await db.select({ id: classSessions.id }).from(classSessions).where(eq(classSessions.classId, klass.id)).limit(1);
  if (any) return 0;
  const students = await db
    .select({ id: users.id, email: users.email })
    .from(classMembers)
    .innerJoin(users, eq(users.id, classMembers.userId))
    .where(and(eq(classMembers.classId, klass.id), eq(users.role, "student")));
  const day = (offset: number, hour: number) => {
    const d = new Date(Date.now() + offset * 86_400_000);
    d.setUTCHours(hour, 0, 0, 0);
    return d;
  };
  await db.transaction(async (tx) => {
    const [sheet, gear] = await tx
      .insert(classSessions)
      .values([
        {
          classId: klass.id,
          startsAt: day(-2, 14),
          minutes: 240,
          section: "Airframe",
          subject: "Sheet metal shop: splice patches",
          createdBy: teacher.id,
          closedAt: day(-2, 19),
          closedBy: teacher.id,
        },
        {
          classId: klass.id,
          startsAt: day(-1, 14),
          minutes: 180,
          section: "General",
          subject: "Penetrant inspection in the NDT room",
          createdBy: teacher.id,
        },
      ])
      .returning({ id: classSessions.id });
    const by = (email: string) => students.find((s) => s.email === email)?.id;
    const rows: (typeof attendanceEntries.$inferInsert)[] = [];
    for (const s of students) {
      rows.push({ sessionId: sheet!.id, userId: s.id, status: "present", minutes: 240, recordedBy: teacher.id, recordedAt: day(-2, 15) });
      rows.push({ sessionId: gear!.id, userId: s.id, status: "present", minutes: 180, recordedBy: teacher.id, recordedAt: day(-1, 15) });
    }
    const jordan = by("student2@hangarleaf.test");
    if (jordan) {
      // Marked present, corrected after closing: arrived late (both entries stay).
      rows.push({
        sessionId: sheet!.id,
        userId: jordan,
        status: "late",
        minutes: 190,
        correctionReason: "Arrived 50 minutes late (bus); seen on the shop sign-in sheet",
        recordedBy: teacher.id,
        recordedAt: day(-2, 20),
      });
    }
    const riley = by("student3@hangarleaf.test");
    if (riley)
      rows.push({
        sessionId: gear!.id,
        userId: riley,
        status: "excused",
        minutes: 0,
        makeup: "Penetrant card in the NDT room next week",
        recordedBy: teacher.id,
        recordedAt: day(-1, 16),
      });
    await tx.insert(attendanceEntries).values(rows);
  });
  return 2;
}
