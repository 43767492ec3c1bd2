"use client";

import Link from "next/link";
import { useEffect, useState } from "react";
import { useCart, useOnline } from "@/components/cart/cart-provider";
import { WorkList } from "@/components/cart/work-list";
import { refreshWork } from "@/lib/client/cart/cart";
import type { WorkItemDto } from "@/lib/contracts/runs";

export default function MyWorkPage() {
  const { ready, data, user } = useCart();
  const online = useOnline();
  const [work, setWork] = useState<{ items: WorkItemDto[]; savedAt: string; timeZone?: string } | null | undefined>(undefined);
  const [problem, setProblem] = useState<string | null>(null);
  useEffect(() => {
    if (!data) return;
    void data.work().then((stored) => setWork(stored ?? null));
    void refreshWork(data).then(
      () => data.work().then((stored) => setWork(stored ?? null)),
      () => setProblem("The school's server did not answer: this is your work as last stored on this laptop."),
    );
  }, [data]);
  if (!ready) return <p role="status">Opening…</p>;
  if (!data || !user) return <p className="notice-error">Nothing is stored on this laptop yet. Connect to the network and sign in once.</p>;
  if (user.role !== "student") {
    return (
      <p className="panel">
        My work lists the task cards assigned to a student. Instructors review runs from <Link href="/review">Review</Link>.
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-3xl">My work</h1>
      {problem && !online ? <p className="notice-error">{problem}</p> : null}
      {work === undefined ? (
        <p role="status">Loading…</p>
      ) : (
        <WorkList data={data} items={work?.items ?? []} savedAt={work?.savedAt ?? null} timeZone={work?.timeZone ?? "UTC"} />
      )}
    </div>
  );
}
