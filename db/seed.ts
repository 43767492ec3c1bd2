// The demo school: an invented college with invented people. Idempotent: what exists is left as it
// is, so a second `npm start` adds nothing and keeps any change made through the app.
import { eq, inArray } from "drizzle-orm";
import { hashPassword } from "@/lib/server/auth/password";
import type { Role } from "@/lib/domain/access/permissions";
import { getEnv } from "@/lib/server/env";
import { getQueue } from "@/lib/server/jobs";
import { seedCards } from "./demo/seed-cards";
import { seedRuns } from "./demo/seed-runs";
import { seedLibrary } from "./demo/seed-library";
import { seedFleet } from "./demo/seed-fleet";
import { seedTools } from "./demo/seed-tools";
import { seedAttendance } from "./demo/seed-attendance";
import { standardExcerptCsv } from "./demo/standard-excerpt";
import { readStandardCsv } from "@/lib/domain/standard/elements";
import { closeDb, getDb } from "./index";
import { classes, classMembers, schoolSettings, standardElements, users } from "./schema";

const demoClasses = [
  {
    name: "AMT Day Cohort 2027",
    description: "Fernhollow Technical College, airframe and powerplant programme, day section (demo data).",
    startsOn: "2025-08-25",
    endsOn: "2027-05-14",
  },
  {
    name: "AMT Evening Cohort 2027",
    description: "Fernhollow Technical College, airframe and powerplant programme, evening section (demo data).",
    startsOn: "2025-09-08",
    endsOn: "2027-06-25",
  },
];

const demoUsers: { email: string; name: string; role: Role; classes: string[] }[] = [
  { email: "admin@hangarleaf.test", name: "Morgan Vale", role: "admin", classes: [] },
  { email: "instructor@hangarleaf.test", name: "Elena Brandt", role: "instructor", classes: ["AMT Day Cohort 2027"] },
  { email: "instructor2@hangarleaf.test", name: "Tomas Reyna", role: "instructor", classes: ["AMT Evening Cohort 2027"] },
  { email: "librarian@hangarleaf.test", name: "Ines Okoro", role: "librarian", classes: [] },
  { email: "student@hangarleaf.test", name: "Sam Whitlock", role: "student", classes: ["AMT Day Cohort 2027"] },
  { email: "student2@hangarleaf.test", name: "Jordan Pike", role: "student", classes: ["AMT Day Cohort 2027"] },
  { email: "student3@hangarleaf.test", name: "Riley Amsel", role: "student", classes: ["AMT Day Cohort 2027"] },
  { email: "student4@hangarleaf.test", name: "Noor Halvorsen", role: "student", classes: ["AMT Evening Cohort 2027"] },
  { email: "student5@hangarleaf.test", name: "Avery Lund", role: "student", classes: ["AMT Evening Cohort 2027"] },
];

/** The excerpt goes in only while the school has imported nothing: a real import is never mixed with it. */
async function seedStandardExcerpt(db: ReturnType<typeof getDb>): Promise<number> {
  const [any] = await db.select({ code: standardElements.code }).from(standardElements).limit(1);
  if (any) return 0;
  const { elements, refused } = readStandardCsv(standardExcerptCsv);
  if (refused.length) throw new Error(`the demo excerpt has refused rows: ${JSON.stringify(refused)}`);
  await db.insert(standardElements).values(elements.map((e) => ({ ...e, excerpt: true })));
  return elements.length;
}

async function main() {
  const db = getDb();
  const password = getEnv().HL_DEMO_PASSWORD;

  await db.insert(classes).values(demoClasses).onConflictDoNothing({ target: classes.name });

  const existing = await db
    .select({ email: users.email })
    .from(users)
    .where(
      inArray(
        users.email,
        demoUsers.map((u) => u.email),
      ),
    );
  const known = new Set(existing.map((u) => u.email));
  const missing = demoUsers.filter((u) => !known.has(u.email));
  if (missing.length) {
    const hash = await hashPassword(password); // one hash for all: demo accounts only
    await db
      .insert(users)
      .values(missing.map((u) => ({ email: u.email, name: u.name, role: u.role, status: "active" as const, passwordHash: hash })))
      .onConflictDoNothing();
  }

  const classRows = await db.select({ id: classes.id, name: classes.name }).from(classes);
  const classId = new Map(classRows.map((c) => [c.name, c.id]));
  for (const u of missing) {
    const [row] = await db.select({ id: users.id }).from(users).where(eq(users.email, u.email));
    const memberships = u.classes.map((name) => classId.get(name)).filter((id): id is string => !!id);
    if (row && memberships.length) {
      await db
        .insert(classMembers)
        .values(memberships.map((id) => ({ classId: id, userId: row.id })))
        .onConflictDoNothing();
    }
  }
  console.log(missing.length ? `seeded ${missing.length} demo accounts` : "demo accounts already present");
  const revisionsAdded = await seedLibrary(db);
  console.log(revisionsAdded ? `queued ${revisionsAdded} demo manual revisions for ingest` : "demo manuals already present");
  // The demo school keeps its hangar's clock, and plans its own hours per section (invented figures,
  // not a rule's minimums); an admin changes both under School settings.
  const zoned = await db
    .insert(schoolSettings)
    .values({ id: "school", timeZone: "America/Chicago", plannedHours: { General: 420, Airframe: 760, Powerplant: 760 } })
    .onConflictDoNothing()
    .returning();
  console.log(zoned.length ? "set the demo school's time zone" : "school settings already present");
  const elementsAdded = await seedStandardExcerpt(db);
  console.log(elementsAdded ? `seeded the standard's demo excerpt (${elementsAdded} elements)` : "standard elements already present");
  const cardsAdded = await seedCards(db);
  console.log(cardsAdded ? `seeded ${cardsAdded} demo task cards` : "demo task cards already present");
  const assignmentsAdded = await seedRuns(db);
  console.log(assignmentsAdded ? `seeded ${assignmentsAdded} demo assignments and their runs` : "demo assignments already present");
  const sessionsAdded = await seedAttendance(db);
  console.log(sessionsAdded ? `seeded ${sessionsAdded} demo class sessions with attendance` : "demo class sessions already present");
  const kitsAdded = await seedTools(db);
  console.log(kitsAdded ? `seeded the demo tool room (${kitsAdded} kits)` : "demo tool room already present");
  const assetsAdded = await seedFleet(db);
  console.log(assetsAdded ? `seeded the demo fleet (${assetsAdded} assets) and hangar plan` : "demo fleet already present");
  await (await getQueue()).stop({ graceful: false, wait: true });
  await closeDb();
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
