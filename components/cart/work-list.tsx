"use client";

import MiniSearch from "minisearch";
import { useEffect, useMemo, useState } from "react";
import type { CartData } from "@/lib/client/cart/store";
import { CartAircraft } from "@/components/cart/cart-aircraft";
import { StatusBadge } from "@/components/status-badge";
import type { WorkItemDto } from "@/lib/contracts/runs";
import { dateTimeIn, zoneLabel } from "@/lib/domain/time";

interface Doc {
  id: string;
  runId: string;
  step: number | null;
  title: string;
  where: string;
  text: string;
}

/** "My work" grouped by what is left to do, with a search over the cards and pages stored here. */
export function WorkList({
  data,
  items,
  savedAt,
  timeZone,
}: {
  data: CartData;
  items: WorkItemDto[];
  savedAt: string | null;
  timeZone: string;
}) {
  const groups: { title: string; items: WorkItemDto[] }[] = [
    { title: "Open", items: items.filter((w) => !["submitted", "signed_off"].includes(w.status)) },
    { title: "Waiting for inspection", items: items.filter((w) => w.status === "submitted") },
    { title: "Signed off", items: items.filter((w) => w.status === "signed_off") },
  ];
  return (
    <div className="flex flex-col gap-6">
      <CartAircraft data={data} />
      <OfflineSearch data={data} items={items} />
      {groups.map((g) => (
        <section key={g.title} aria-label={g.title} className="flex flex-col gap-2">
          <h2 className="text-2xl">
            {g.title} <span className="text-base font-normal text-ink-soft">({g.items.length})</span>
          </h2>
          {g.items.length === 0 ? <p className="hint">Nothing here.</p> : null}
          <ul className="flex flex-col gap-3">
            {g.items.map((w) => (
              <li key={w.runId}>
                <a
                  href={`/cart/run?id=${w.runId}`}
                  className="panel flex flex-wrap items-center gap-x-4 gap-y-1 no-underline hover:bg-teal-pale focus:bg-teal-pale"
                >
                  <span className="mr-auto flex flex-col">
                    <span className="text-xl font-bold text-ink">{w.title}</span>
                    <span className="text-ink-soft">
                      {[`Version ${w.versionNumber}`, w.subjectName, w.dueOn ? `due ${w.dueOn}` : null, w.note || null]
                        .filter(Boolean)
                        .join(" · ")}
                    </span>
                    {w.newerVersion ? (
                      <span className="text-sm font-semibold text-ink">
                        Version {w.newerVersion} is published; this assignment keeps version {w.versionNumber}.
                      </span>
                    ) : null}
                  </span>
                  <StatusBadge kind="run" status={w.workStatus} className="text-base" />
                </a>
              </li>
            ))}
          </ul>
        </section>
      ))}
      {savedAt ? (
        <p className="hint">
          Stored on this laptop {dateTimeIn(timeZone, savedAt)} {zoneLabel(timeZone)}.
        </p>
      ) : null}
    </div>
  );
}

/** Search across the cards and cited pages stored on this laptop; works offline (MiniSearch). */
function OfflineSearch({ data, items }: { data: CartData; items: WorkItemDto[] }) {
  const [docs, setDocs] = useState<Doc[]>([]);
  const [query, setQuery] = useState("");
  useEffect(() => {
    void (async () => {
      const made: Doc[] = [];
      for (const w of items) {
        const run = await data.run(w.runId);
        if (!run) continue;
        made.push({ id: `${w.runId}:card`, runId: w.runId, step: null, title: w.title, where: "task card", text: run.version.title });
        run.version.steps.forEach((s, i) =>
          made.push({
            id: `${w.runId}:${s.id}`,
            runId: w.runId,
            step: i + 1,
            title: w.title,
            where: `step ${i + 1}`,
            text: [s.text, ...s.notices.map((n) => n.text)].join(" "),
          }),
        );
        for (const p of run.packet?.pages ?? []) {
          const step = run.version.steps.findIndex((s) => s.references.some((r) => r.revisionId === p.revisionId && r.page === p.page));
          made.push({
            id: `${w.runId}:page:${p.revisionId}:${p.page}`,
            runId: w.runId,
            step: step >= 0 ? step + 1 : null,
            title: w.title,
            where: `${p.manualTitle} ${p.revisionLabel}, page ${p.page}`,
            text: p.text,
          });
        }
      }
      setDocs(made);
    })();
  }, [data, items]);
  const index = useMemo(() => {
    const mini = new MiniSearch<Doc>({
      fields: ["title", "text"],
      storeFields: ["runId", "step", "title", "where", "text"],
      searchOptions: { prefix: true, fuzzy: 0.2, boost: { title: 2 } },
    });
    mini.addAll(docs);
    return mini;
  }, [docs]);
  const hits = query.trim().length >= 2 ? index.search(query).slice(0, 8) : [];
  return (
    <section aria-label="Search my cards" className="flex flex-col gap-2">
      <label htmlFor="cart-search" className="label">
        Search my cards and their manual pages (works offline)
      </label>
      <input
        id="cart-search"
        type="search"
        className="input text-lg"
        value={query}
        onChange={(e) => setQuery(e.target.value)}
        placeholder="for example: safety wire"
      />
      {query.trim().length >= 2 ? (
        hits.length ? (
          <ul className="flex flex-col gap-2" aria-label="Search results">
            {hits.map((h) => (
              <li key={h.id}>
                <a
                  href={`/cart/run?id=${h.runId}${h.step ? `&step=${h.step}` : ""}`}
                  className="panel flex flex-col no-underline hover:bg-teal-pale"
                >
                  <span className="font-bold text-ink">{h.title}</span>
                  <span className="text-ink-soft">{h.where}</span>
                </a>
              </li>
            ))}
          </ul>
        ) : (
          <p className="hint">Nothing stored here matches.</p>
        )
      ) : null}
    </section>
  );
}
