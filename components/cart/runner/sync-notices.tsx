"use client";

import { syncer } from "@/lib/client/cart/cart";
import type { CartData, RefusedItem } from "@/lib/client/cart/store";

/** Changes made on this laptop that the server refused: they are not part of the run. */
export function RefusedChanges({ refused }: { refused: RefusedItem[] }) {
  if (!refused.length) return null;
  return (
    <div role="alert" className="notice-error">
      <p className="font-semibold">
        The school&apos;s server refused {refused.length} {refused.length === 1 ? "change" : "changes"} made on this laptop:{" "}
        {refused.at(-1)!.reason}
      </p>
      <p>Tell your instructor; those changes are not part of the run.</p>
    </div>
  );
}

export function SyncNow({ data, online }: { data: CartData; online: boolean }) {
  if (!online) return null;
  return (
    <button type="button" className="btn btn-secondary self-start" onClick={() => void syncer(data).now()}>
      Send waiting changes now
    </button>
  );
}
