"use client";

import { useCallback, useEffect, useMemo, useState } from "react";
import { record, refreshRun } from "@/lib/client/cart/cart";
import type { CartData, RefusedItem } from "@/lib/client/cart/store";
import type { RunDetailDto } from "@/lib/contracts/runs";
import { foldRun, type RunEvent, type RunEventType } from "@/lib/domain/runs/fold";

export type StepDto = RunDetailDto["version"]["steps"][number];
export type StepState = ReturnType<typeof foldRun>["steps"][string];
export type PacketPages = NonNullable<RunDetailDto["packet"]>["pages"];
export type Act = (type: RunEventType, options?: { stepId?: string | null; payload?: Record<string, unknown> }) => Promise<void>;

/**
 * One run as the cart holds it: what is stored (detail, events still waiting, the offline packet,
 * changes the server refused), read again whenever the store changes and once fresh from the
 * server, folded with the waiting events counted last. `detail` is undefined while reading and
 * null when the run is not stored here.
 */
export function useRun(data: CartData, runId: string) {
  const [detail, setDetail] = useState<RunDetailDto | null | undefined>(undefined);
  const [pending, setPending] = useState<RunEvent[]>([]);
  const [packet, setPacket] = useState<Blob | null>(null);
  const [refused, setRefused] = useState<RefusedItem[]>([]);

  const load = useCallback(
    () =>
      Promise.all([data.run(runId), data.pending(), data.packet(runId), data.refused()]).then(([stored, queued, blob, refused]) => {
        setRefused(refused.filter((r) => r.runId === runId));
        setDetail(stored ?? null);
        setPending(
          queued.filter((p) => p.runId === runId).map((p) => ({ ...p.event, userId: data.userId, type: p.event.type as RunEventType })),
        );
        setPacket((old) => old ?? blob ?? null); // a new Blob each read would reload the page view
      }),
    [data, runId],
  );

  useEffect(() => {
    void load();
    // Fresh from the server when it answers; what is stored otherwise.
    void refreshRun(data, runId).then(load, () => undefined);
    return data.onChange(() => void load());
  }, [data, runId, load]);

  const state = useMemo(() => {
    if (!detail) return null;
    const steps = detail.version.steps.map((s) => ({
      id: s.id,
      inspectionPoint: s.inspectionPoint,
      measurement: s.measurement,
      timerMinutes: s.timerMinutes,
    }));
    return foldRun([...detail.events, ...pending], steps, new Set(detail.reviewers));
  }, [detail, pending]);

  const act: Act = useCallback(
    async (type: RunEventType, options: { stepId?: string | null; payload?: Record<string, unknown> } = {}) => {
      if (!detail) return;
      await record(data, detail, type, options);
    },
    [data, detail],
  );

  return { detail, pending, packet, refused, state, act };
}

/** The clock for running timers: ticks every second while one runs, stands still otherwise. */
export function useNow(active: boolean) {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    if (!active) return;
    const id = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(id);
  }, [active]);
  return now;
}
