"use client";

import { useQuery } from "@tanstack/react-query";
import { call } from "@/lib/client/api";
import { toolsApi } from "@/lib/contracts/endpoints/tools";

/**
 * Adds a tool-room kit or tool to the card's tool list as a line starting with its number, which
 * the cart then checks against what the student has out. Free-text lines stay allowed.
 */
export function ToolRoomPicker({ onPick }: { onPick: (line: string) => void }) {
  const kits = useQuery({ queryKey: ["kits"], queryFn: () => call(toolsApi.listKits), staleTime: 60_000 });
  const tools = useQuery({ queryKey: ["tools"], queryFn: () => call(toolsApi.listTools, { query: {} }), staleTime: 60_000 });
  const options = [
    ...(kits.data?.kits ?? []).map((k) => ({ value: `${k.number} ${k.name}`, label: `Kit ${k.number}, ${k.name}` })),
    ...(tools.data?.tools ?? [])
      .filter((t) => t.status === "in_service")
      .map((t) => ({
        value: `${t.number} ${t.description}`,
        label: `${t.number}, ${t.description}${t.calibrated ? " (calibrated)" : ""}`,
      })),
  ];
  return (
    <label className="field">
      <span className="label">Add from the tool room</span>
      <select
        className="input"
        value=""
        disabled={!options.length}
        onChange={(e) => {
          if (e.target.value) onPick(e.target.value);
        }}
      >
        <option value="">
          {kits.isPending || tools.isPending
            ? "Loading the tool room…"
            : options.length
              ? "Choose a kit or tool…"
              : "The tool room has nothing listed"}
        </option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
      <span className="hint">A line starting with a tool-room number is checked on the cart against what the student has out.</span>
    </label>
  );
}
