// An ATA code typed as a search ("32-10-00", "32-10") goes to that section of the manuals in scope:
// the first page whose heading starts with the code, as ATA-numbered manuals head each page
// ("32-10-00 MAIN LANDING GEAR - INSPECTION"; lib/domain/library/outline.ts reads the same
// headings for a manual's contents). Read from PostgreSQL whichever engine searches the words:
// the pages are always there.
import { sql } from "drizzle-orm";
import { getDb } from "@/db";
import type { SearchJump } from "@/lib/contracts/search";
import type { AtaSection } from "./query";

/** At most this many manuals' sections in an answer (a code is rarely in more than a few). */
export const sectionLimit = 5;

export async function findSections(section: AtaSection, revisionIds: string[]): Promise<SearchJump[]> {
  if (!revisionIds.length || !/^\d{2}-\d{2}(-\d{2})?$/.test(section.code)) return [];
  const scope = sql.raw(`array[${revisionIds.map((id) => `'${id.replace(/[^0-9a-f-]/gi, "").toLowerCase()}'`).join(",")}]::text[]`);
  // The heading index narrows to pages whose heading has the code's numbers side by side; the
  // pattern keeps those where it stands as a code of its own (not 132-10, not 32-101), the first
  // thing on the line or after a word such as "SECTION".
  const pattern = `(^|[^0-9-])${section.code}(?![0-9])`;
  const rows = await getDb().execute<{
    manual_id: string;
    manual_title: string;
    revision_id: string;
    revision_label: string;
    current: boolean;
    page: number;
    heading: string;
  }>(sql`
    with first as (
      select p.revision_id, min(p.page_number) as page from pages p
      where p.heading_vector @@ phraseto_tsquery('english', ${section.code}) and p.heading ~ ${pattern}
        and p.revision_id::text = any(${scope})
      group by p.revision_id)
    select m.id as manual_id, m.title as manual_title, r.id as revision_id, r.label as revision_label,
           (m.current_revision_id = r.id) as current, f.page, p.heading
    from first f
    join pages p on p.revision_id = f.revision_id and p.page_number = f.page
    join revisions r on r.id = f.revision_id
    join manuals m on m.id = r.manual_id
    order by (m.current_revision_id = r.id) desc, m.title, r.revision_date desc
    limit ${sectionLimit}`);
  return rows.rows.map((row) => ({
    code: section.code,
    manualId: row.manual_id,
    manualTitle: row.manual_title,
    revisionId: row.revision_id,
    revisionLabel: row.revision_label,
    current: row.current,
    page: row.page,
    heading: row.heading,
  }));
}
