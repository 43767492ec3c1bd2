// The school's copy of the certification standard: importing its CSV, finding elements, and a
// student's coverage from the card versions of their runs.
import "server-only";
import { and, asc, eq, ilike, inArray, or, sql } from "drizzle-orm";
import { getDb } from "@/db";
import { assignments, runs, signOffs, standardElements, taskCardVersions, users } from "@/db/schema";
import type { ClassCoverageDto, CoverageDto, ElementDto } from "@/lib/contracts/standard";
import type { Actor } from "@/lib/domain/access/permissions";
import { AppError } from "@/lib/domain/errors";
import {
  coverageOf,
  sections,
  elementKinds,
  readStandardCsv,
  type CoverageStatus,
  type ElementKind,
  type StandardElement,
} from "@/lib/domain/standard/elements";
import { recordAudit } from "@/lib/server/audit";
import { readBodyText } from "@/lib/server/http";
import { activeStudentsOf, classOfStaff, readsRecordOf } from "@/lib/server/runs/scope";

const maxCsvBytes = 2 * 1024 * 1024;

const toDto = (e: typeof standardElements.$inferSelect): ElementDto => ({
  code: e.code,
  kind: e.kind as ElementKind,
  title: e.title,
  section: e.section,
  area: `${e.areaLetter}. ${e.areaTitle}`,
});

/** The CSV from the request: a text/csv body, or a multipart form's `file` part. */
export async function csvFromRequest(request: Request): Promise<string> {
  const type = (request.headers.get("content-type") ?? "").toLowerCase();
  const declared = Number(request.headers.get("content-length") ?? 0);
  if (declared > maxCsvBytes) throw new AppError("payload_too_large", "The file is over 2 MB: a standard's elements fit in far less.");
  if (type.startsWith("text/csv") || type.startsWith("text/plain")) return readBodyText(request, maxCsvBytes);
  if (type.startsWith("multipart/form-data")) {
    const body = await readBodyText(request, maxCsvBytes + 64 * 1024);
    const form = await new Response(body, { headers: { "content-type": request.headers.get("content-type")! } }).formData().catch(() => {
      throw new AppError("bad_request", "The form could not be read.");
    });
    const file = form.get("file");
    if (!file || typeof file === "string")
      throw new AppError("invalid", "Attach the CSV as the file.", { fields: { file: "Choose the CSV file." } });
    return file.text();
  }
  throw new AppError("unsupported_media_type", "Send the standard as a CSV file (text/csv), or as a form with the file.");
}

/** Stores what the CSV holds; rows refused are listed with their line. Elements are never deleted. */
export async function importStandard({ actor, csv }: { actor: Actor; csv: string }) {
  const { elements, refused } = readStandardCsv(csv);
  if (!elements.length) return { imported: 0, updated: 0, refused };
  return getDb().transaction(async (tx) => {
    const known = new Set(
      (
        await tx
          .select({ code: standardElements.code })
          .from(standardElements)
          .where(
            inArray(
              standardElements.code,
              elements.map((e) => e.code),
            ),
          )
      ).map((r) => r.code),
    );
    for (let i = 0; i < elements.length; i += 500) {
      const chunk = elements.slice(i, i + 500).map((e: StandardElement) => ({ ...e, excerpt: false }));
      await tx
        .insert(standardElements)
        .values(chunk)
        .onConflictDoUpdate({
          target: standardElements.code,
          set: {
            section: sql`excluded.section`,
            areaLetter: sql`excluded.area_letter`,
            areaTitle: sql`excluded.area_title`,
            kind: sql`excluded.kind`,
            number: sql`excluded.number`,
            title: sql`excluded.title`,
            excerpt: false,
            updatedAt: new Date(),
          },
        });
    }
    const updated = elements.filter((e) => known.has(e.code)).length;
    const imported = elements.length - updated;
    await recordAudit(tx, {
      actorId: actor.id,
      action: "standard.imported",
      subjectType: "standard",
      details: { imported, updated, refused: refused.length },
    });
    return { imported, updated, refused };
  });
}

export async function listElements({ q, kind }: { q?: string; kind?: ElementKind } = {}): Promise<{
  elements: ElementDto[];
  excerpt: boolean;
}> {
  const words = (q ?? "").trim();
  // LIKE's own characters typed in the words match themselves.
  const literal = words.replace(/[\\%_]/g, (c) => `\\${c}`);
  const rows = await getDb()
    .select()
    .from(standardElements)
    .where(
      and(
        kind ? eq(standardElements.kind, kind) : undefined,
        words
          ? or(
              ilike(standardElements.code, `${literal}%`),
              ilike(standardElements.title, `%${literal}%`),
              ilike(standardElements.areaTitle, `%${literal}%`),
            )
          : undefined,
      ),
    )
    .orderBy(asc(standardElements.section), asc(standardElements.areaLetter), asc(standardElements.kind), asc(standardElements.number))
    .limit(words ? 200 : 5000);
  const [flag] = await getDb()
    .select({ excerpt: sql<boolean>`coalesce(bool_or(${standardElements.excerpt}), false)` })
    .from(standardElements);
  // The standard's own order: General, Airframe, Powerplant (I, II, III), not the alphabet's.
  const order = Object.values(sections) as string[];
  rows.sort(
    (a, b) =>
      order.indexOf(a.section) - order.indexOf(b.section) ||
      a.areaLetter.localeCompare(b.areaLetter) ||
      elementKinds.indexOf(a.kind as ElementKind) - elementKinds.indexOf(b.kind as ElementKind) ||
      a.number - b.number,
  );
  return { elements: rows.map(toDto), excerpt: flag?.excerpt ?? false };
}

/** Codes the standard does not have, of those given: publishing a card that maps to them is refused. */
export async function unknownElementCodes(codes: readonly string[]): Promise<string[]> {
  const wanted = [...new Set(codes)];
  if (!wanted.length) return [];
  const rows = await getDb().select({ code: standardElements.code }).from(standardElements).where(inArray(standardElements.code, wanted));
  const known = new Set(rows.map((r) => r.code));
  return wanted.filter((c) => !known.has(c));
}

type Db = ReturnType<typeof getDb>;

/** Each student's runs as coverage reads them, with what the records name about each run. */
async function coverageRunsOf(db: Db, studentIds: readonly string[]) {
  if (!studentIds.length) return [];
  const rows = await db
    .select({
      studentId: runs.studentId,
      runId: runs.id,
      status: runs.status,
      steps: taskCardVersions.steps,
      title: taskCardVersions.title,
      versionNumber: taskCardVersions.number,
      signedAt: signOffs.signedAt,
      revisions: signOffs.revisionsCited,
      instructorName: users.name,
      withdrawnAt: assignments.withdrawnAt,
    })
    .from(runs)
    .innerJoin(assignments, eq(assignments.id, runs.assignmentId))
    .innerJoin(taskCardVersions, eq(taskCardVersions.id, runs.versionId))
    .leftJoin(signOffs, eq(signOffs.runId, runs.id))
    .leftJoin(users, eq(users.id, signOffs.instructorId))
    .where(inArray(runs.studentId, [...studentIds]));
  // A withdrawn run that was not signed off practised nothing the school counts.
  return rows.filter((r) => r.status === "signed_off" || !r.withdrawnAt);
}

const forCoverage = (r: Awaited<ReturnType<typeof coverageRunsOf>>[number]) => ({
  runId: r.runId,
  signedOff: r.status === "signed_off",
  started: r.status !== "not_started",
  codes: ((r.steps as { elements?: unknown }[]) ?? []).flatMap((s) => (Array.isArray(s.elements) ? (s.elements as string[]) : [])),
  signedAt: r.signedAt?.toISOString() ?? null,
});

/** Every element's status for the student, with the run that demonstrated or practised it. */
export async function studentCoverage({ actor, studentId }: { actor: Actor; studentId: string }): Promise<CoverageDto> {
  const db = getDb();
  const [student] = await db.select({ id: users.id, name: users.name, role: users.role }).from(users).where(eq(users.id, studentId));
  if (!student || student.role !== "student" || !(await readsRecordOf(db, actor, studentId)))
    throw new AppError("not_found", "That student was not found.");
  const { elements, excerpt } = await listElements();
  const counted = await coverageRunsOf(db, [studentId]);
  const byRun = new Map(counted.map((r) => [r.runId, r]));
  const statuses = coverageOf(elements, counted.map(forCoverage));
  const totals: CoverageDto["totals"] = {};
  const out = elements.map((e, i) => {
    const s = statuses[i]!;
    const run = s.runId ? byRun.get(s.runId) : undefined;
    const section = (totals[e.section] ??= Object.fromEntries(
      elementKinds.map((k) => [k, { demonstrated: 0, practised: 0, missing: 0 } as Record<CoverageStatus, number>]),
    ) as Record<ElementKind, Record<CoverageStatus, number>>);
    section[e.kind][s.status]++;
    return {
      ...e,
      status: s.status,
      runId: s.runId,
      run: run
        ? {
            title: run.title,
            versionNumber: run.versionNumber,
            signedAt: run.signedAt?.toISOString() ?? null,
            instructorName: run.signedAt ? run.instructorName : null,
            revisions: ((run.revisions ?? []) as { manualTitle: string; label: string }[]).map((r) => `${r.manualTitle} ${r.label}`),
          }
        : null,
    };
  });
  return { student: { id: student.id, name: student.name }, excerpt, elements: out, totals };
}

/**
 * A class as a grid: each active student against the standard's elements (skill elements unless
 * another kind is asked for), and the elements no student has demonstrated yet: the gaps.
 */
export async function classCoverage({
  actor,
  classId,
  kind = "skill",
  section,
}: {
  actor: Actor;
  classId: string;
  kind?: ElementKind;
  section?: string;
}): Promise<ClassCoverageDto> {
  const db = getDb();
  const klass = await classOfStaff(db, actor, classId);
  const students = await activeStudentsOf(db, classId);
  const { elements: all, excerpt } = await listElements({ kind });
  const elements = section ? all.filter((e) => e.section === section) : all;
  const counted = await coverageRunsOf(
    db,
    students.map((s) => s.id),
  );
  const rows = students.map((s) => {
    const statuses = coverageOf(elements, counted.filter((r) => r.studentId === s.id).map(forCoverage));
    const count = (status: CoverageStatus) => statuses.filter((x) => x.status === status).length;
    return {
      id: s.id,
      name: s.name,
      statuses: Object.fromEntries(statuses.map((x) => [x.code, x.status])) as Record<string, CoverageStatus>,
      demonstrated: count("demonstrated"),
      practised: count("practised"),
      missing: count("missing"),
    };
  });
  const gaps = elements.filter((e) => !rows.some((r) => r.statuses[e.code] === "demonstrated")).map((e) => e.code);
  return { class: klass, excerpt, kind, elements, students: rows, gaps };
}
