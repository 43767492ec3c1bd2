"use client";

import Link from "next/link";
import { useEffect, useState } from "react";
import { readCitingTarget, writeCitingTarget, type CitingTarget } from "@/lib/client/citing-target";

/**
 * On the library's own pages while a card draft waits for a page: says so, so an author who came
 * here from "Find it in the library…" keeps their bearings on the way to the reader (where the
 * citing panel is).
 */
export function CitingBanner({ userId }: { userId: string }) {
  const [target, setTarget] = useState<CitingTarget | null>(null);
  useEffect(() => {
    // localStorage exists only in the browser: read after mount.
    // eslint-disable-next-line react-hooks/set-state-in-effect
    setTarget(readCitingTarget(userId));
  }, [userId]);
  if (!target) return null;
  return (
    <div role="status" className="notice-todo flex flex-wrap items-center gap-3">
      <span className="mr-auto">
        Choosing a page for “{target.title}”. Open a manual, go to the page, and put it on the card from the reader&apos;s bar.
      </span>
      <Link href={`/cards/${target.cardId}/edit`} className="btn btn-secondary btn-small">
        Back to the card
      </Link>
      <button
        type="button"
        className="btn btn-secondary btn-small"
        onClick={() => {
          writeCitingTarget(userId, null);
          setTarget(null);
        }}
      >
        Stop choosing
      </button>
    </div>
  );
}
