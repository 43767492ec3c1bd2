"use client";

import dynamic from "next/dynamic";
import { useState } from "react";
import type { PacketPages, StepDto } from "./use-run";

const PacketPage = dynamic(() => import("../packet-page"), { ssr: false, loading: () => <p role="status">Opening the page…</p> });

/** The manual pages a step cites: from the offline packet when stored, else a link while online. */
export function StepReferences({
  references,
  packet,
  packetPages,
  online,
}: {
  references: StepDto["references"];
  packet: Blob | null;
  packetPages: PacketPages;
  online: boolean;
}) {
  const [openPage, setOpenPage] = useState<number | null>(null);
  return (
    <div className="flex flex-col gap-2">
      <h3 className="font-semibold">Manual pages</h3>
      <div className="flex flex-wrap gap-2">
        {references.map((r) => {
          const inPacket = packetPages.find((p) => p.revisionId === r.revisionId && p.page === r.page);
          const key = inPacket?.packetPage ?? -r.page;
          return packet && inPacket ? (
            <button
              key={key}
              type="button"
              className="btn btn-secondary"
              aria-expanded={openPage === key}
              onClick={() => setOpenPage(openPage === key ? null : key)}
            >
              {openPage === key ? "Hide" : "Show"} page {r.page} · {r.manualTitle}, {r.revisionLabel}
            </button>
          ) : online ? (
            <a key={key} className="btn btn-secondary" href={`/library/${r.manualId}/${r.revisionId}/${r.page}`}>
              Open page {r.page} · {r.manualTitle}, {r.revisionLabel}
            </a>
          ) : (
            <span key={key} className="hint">
              Page {r.page} of {r.manualTitle} is not stored on this laptop.
            </span>
          );
        })}
      </div>
      {references.some((r) => !r.current) ? (
        <p className="notice-error">
          Superseded:{" "}
          {references
            .filter((r) => !r.current)
            .map((r) => `page ${r.page} of ${r.manualTitle}, ${r.revisionLabel}`)
            .join("; ")}
          . A newer revision of the manual is current; ask your instructor before you follow this page.
        </p>
      ) : null}
      {packet && openPage && openPage > 0 ? <PacketPage file={packet} page={openPage} label={`Cited manual page`} /> : null}
    </div>
  );
}
