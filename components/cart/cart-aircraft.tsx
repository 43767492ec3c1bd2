"use client";

import { useEffect, useState } from "react";
import type { CartAsset, CartData } from "@/lib/client/cart/store";
import { assetKindWords, type AssetKind } from "@/lib/domain/fleet/fleet";

/**
 * The aircraft this cart is at, picked once: each run offers it first, and search opens scoped to
 * what applies to its model. Kept on this laptop with the student's work (offline too).
 */
export function CartAircraft({ data }: { data: CartData }) {
  const [fleet, setFleet] = useState<CartAsset[]>([]);
  const [mine, setMine] = useState<string>("");
  useEffect(() => {
    const load = () =>
      void Promise.all([data.fleet(), data.aircraft()]).then(([assets, id]) => {
        setFleet(assets);
        setMine(id ?? "");
      });
    load();
    return data.onChange(load);
  }, [data]);
  if (!fleet.length) return null;
  const chosen = fleet.find((a) => a.id === mine);
  return (
    <section aria-label="This cart's aircraft" className="panel flex flex-col gap-3">
      <label className="field max-w-xl">
        <span className="label">The aircraft this cart is at</span>
        <select className="input text-lg" value={mine} onChange={(e) => void data.saveAircraft(e.target.value || null)}>
          <option value="">Not at an aircraft</option>
          {fleet.map((a) => (
            <option key={a.id} value={a.id}>
              {a.identifier} · {assetKindWords[a.kind as AssetKind] ?? a.kind} {a.model}
            </option>
          ))}
        </select>
      </label>
      {chosen ? (
        <div className="flex flex-wrap items-center gap-3">
          <p className="mr-auto">
            Runs offer <span className="font-mono font-bold">{chosen.identifier}</span> first.
            {chosen.status === "out_of_service" ? (
              <span className="font-bold text-danger"> WARNING: out of service: {chosen.statusReason}.</span>
            ) : null}
            {chosen.openFindingCount ? (
              <span className="font-semibold text-danger"> {chosen.openFindingCount} open finding(s) on it.</span>
            ) : null}
          </p>
          <a
            className="btn btn-secondary"
            href={`/search?model=${encodeURIComponent(chosen.model)}&for=${encodeURIComponent(chosen.identifier)}`}
          >
            Search what applies to {chosen.identifier}
          </a>
          <a
            className="btn btn-secondary"
            href={`/cards?model=${encodeURIComponent(chosen.model)}&for=${encodeURIComponent(chosen.identifier)}`}
          >
            Its task cards
          </a>
          <a className="btn btn-secondary" href={`/fleet/${chosen.id}`}>
            Its manuals and findings
          </a>
        </div>
      ) : null}
    </section>
  );
}
