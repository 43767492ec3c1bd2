import type { Metadata } from "next";
import { Table } from "@/components/table";
import { requirePageUser } from "@/app/_adapters/session";
import { listElements } from "@/lib/server/standard";
import { ImportForm } from "./_components/import-form";

export const metadata: Metadata = { title: "Certification standard" };

const kindWords = { knowledge: "Knowledge", risk: "Risk management", skill: "Skill" } as const;

export default async function StandardPage() {
  await requirePageUser("standard:manage", "/standard");
  const { elements, excerpt } = await listElements();
  return (
    <div className="flex flex-col gap-6">
      <h1>Certification standard</h1>
      {excerpt ? (
        <p role="note" className="rounded-md border-4 border-dashed border-deck bg-teal-pale px-4 py-3 font-semibold">
          Elements marked &quot;(excerpt; verify)&quot; are the demo&apos;s excerpt, not the standard: codes and words from memory, to be
          verified against the current FAA-S-ACS-1. Import the school&apos;s own copy below; it replaces their words for the codes it has.
        </p>
      ) : null}
      <ImportForm />
      <section aria-labelledby="element-list" className="panel flex flex-col gap-3">
        <h2 id="element-list">Elements: {elements.length}</h2>
        <Table
          rows={elements}
          rowKey={(e) => e.code}
          empty="No element yet: import the school's CSV."
          columns={[
            { header: "Code", cell: (e) => <span className="font-mono font-semibold">{e.code}</span> },
            { header: "Section", cell: (e) => e.section },
            { header: "Area of operation", cell: (e) => e.area },
            { header: "Kind", cell: (e) => kindWords[e.kind] },
            { header: "Element", cell: (e) => e.title },
          ]}
        />
      </section>
    </div>
  );
}
