"use client";

import { useQuery } from "@tanstack/react-query";
import { useState } from "react";
import { call } from "@/lib/client/api";
import { standardApi } from "@/lib/contracts/endpoints/standard";

/**
 * The certification standard's elements a step shows, by code, with a search by code or words
 * that adds a code to the step. The codes stay typeable: a school may map before it imports.
 */
export function ElementPicker({
  id,
  value,
  onChange,
  problem,
}: {
  id: string;
  value: string;
  onChange: (codes: string) => void;
  problem?: string;
}) {
  const [q, setQ] = useState("");
  const found = useQuery({
    queryKey: ["standard-elements", q],
    queryFn: () => call(standardApi.listElements, { query: { q } }),
    enabled: q.trim().length >= 2,
    staleTime: 60_000,
  });
  const codes = value
    .split(/[,\s]+/)
    .map((c) => c.trim().toUpperCase())
    .filter(Boolean);
  return (
    <div className="field sm:col-span-2">
      <label htmlFor={id} className="label">
        Standard elements this step shows (codes, such as AM.II.C.S2)
      </label>
      <input
        id={id}
        className="input font-mono"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={problem ? true : undefined}
      />
      {problem ? <span className="field-todo">{problem}</span> : null}
      <details>
        <summary className="inline-flex min-h-11 cursor-pointer items-center font-semibold">Find an element by its words</summary>
        <label className="field mt-2">
          <span className="label">Words or code</span>
          <input className="input" type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="rivet, torque, AM.II" />
        </label>
        <ul className="mt-2 flex flex-col gap-1" aria-live="polite">
          {(found.data?.elements ?? []).slice(0, 12).map((el) => (
            <li key={el.code} className="flex flex-wrap items-center gap-2">
              <button
                type="button"
                className="btn btn-secondary btn-small"
                disabled={codes.includes(el.code)}
                onClick={() => onChange([...codes, el.code].join(", "))}
              >
                {codes.includes(el.code) ? "Added" : `Add ${el.code}`}
              </button>
              <span>
                <span className="text-ink-soft">
                  {el.section} · {el.area} · {el.kind}:
                </span>{" "}
                {el.title}
              </span>
            </li>
          ))}
          {q.trim().length >= 2 && found.data && !found.data.elements.length ? <li>No element has those words.</li> : null}
        </ul>
      </details>
    </div>
  );
}
