"use client";

import { useState } from "react";
import { FormResult } from "@/components/form-result";
import { Table } from "@/components/table";
import type { CheckoutDto } from "@/lib/contracts/tools";
import { CountIn } from "./count-in";

/**
 * The loans out now, each with its count-in. What a count-in found is said above the list, which
 * stays when the counted loan leaves it on refresh.
 */
export function OutNow({ out, dueText }: { out: CheckoutDto[]; dueText: Record<string, string> }) {
  const [said, setSaid] = useState<{ ok: boolean; message: string } | null>(null);
  return (
    <>
      <FormResult result={said} />
      <Table
        rows={out}
        rowKey={(c) => c.id}
        empty="Nothing is out."
        columns={[
          {
            header: "Lent",
            cell: (c) => (
              <span>
                <strong className="font-mono">{c.kit?.number ?? c.tool?.number}</strong> {c.kit?.name ?? c.tool?.description}
              </span>
            ),
          },
          { header: "To", cell: (c) => [c.userName, c.teamNote].filter(Boolean).join(", with ") },
          { header: "For", cell: (c) => (c.runTitle ? `Run: ${c.runTitle}` : "The day") },
          {
            header: "Due back",
            cell: (c) => (c.overdue ? <strong className="text-danger">{dueText[c.id]} · past due</strong> : dueText[c.id]),
          },
          { header: "Count in", cell: (c) => <CountIn checkout={c} onCounted={setSaid} /> },
        ]}
      />
    </>
  );
}
