"use client";

import { useEffect, useState } from "react";
import type { CartData, TimerEntry } from "@/lib/client/cart/store";

/** A short two-tone ring through Web Audio (no sound file to cache). */
export function ring() {
  try {
    const audio = new AudioContext();
    [0, 0.35, 0.7].forEach((at, i) => {
      const osc = audio.createOscillator();
      const gain = audio.createGain();
      osc.frequency.value = i % 2 ? 660 : 880;
      gain.gain.setValueAtTime(0.4, audio.currentTime + at);
      gain.gain.exponentialRampToValueAtTime(0.001, audio.currentTime + at + 0.3);
      osc.connect(gain).connect(audio.destination);
      osc.start(audio.currentTime + at);
      osc.stop(audio.currentTime + at + 0.32);
    });
  } catch {
    // No audio on this laptop: the banner still shows.
  }
}

export function formatLeft(ms: number) {
  const s = Math.max(0, Math.ceil(ms / 1000));
  return `${Math.floor(s / 60)}:${String(s % 60).padStart(2, "0")}`;
}

/**
 * Watches every timer started on this cart, on any cart screen: a timer keeps running when the
 * student moves to another step or page (its end is a time, not a countdown), and rings once at the end.
 */
export function TimerWatch({ data }: { data: CartData | null }) {
  const [due, setDue] = useState<TimerEntry[]>([]);
  useEffect(() => {
    if (!data) return;
    const tick = async () => {
      const timers = await data.timers();
      const now = Date.now();
      const ended = timers.filter((t) => t.endsAt <= now);
      if (ended.length) {
        ring();
        setDue((d) => [...d, ...ended]);
        await data.setTimers((old) => old.filter((t) => t.endsAt > now));
      }
    };
    const id = setInterval(() => void tick().catch(() => undefined), 1000);
    return () => clearInterval(id);
  }, [data]);
  if (!due.length) return null;
  return (
    <div role="alert" className="fixed inset-x-0 bottom-0 z-40 border-t-8 border-amber bg-deck p-4 text-white">
      <div className="mx-auto flex max-w-5xl flex-wrap items-center gap-3">
        <p className="mr-auto text-xl font-bold">Time is up: {due.map((t) => t.label).join("; ")}</p>
        <a className="btn btn-primary" href={`/cart/run?id=${due[0]!.runId}`}>
          Go to the step
        </a>
        <button type="button" className="btn btn-secondary" onClick={() => setDue([])}>
          Dismiss
        </button>
      </div>
    </div>
  );
}
