"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, call } from "@/lib/client/api";
import { libraryApi } from "@/lib/contracts/endpoints/library";

/** A librarian's switch: carts store the whole current PDF of this manual, not only cited pages. */
export function KeepOnCarts({ manualId, kept }: { manualId: string; kept: boolean }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  return (
    <div className="flex flex-wrap items-center gap-3">
      <button
        type="button"
        className="btn btn-secondary"
        aria-pressed={kept}
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          setMessage(null);
          try {
            await call(libraryApi.keepOnCarts, { params: { id: manualId }, body: { keepOnCarts: !kept } });
            router.refresh();
          } catch (error) {
            setMessage(error instanceof ApiError ? error.message : "Not changed.");
          } finally {
            setBusy(false);
          }
        }}
      >
        {kept ? "✓ Kept whole on carts" : "Keep the whole manual on carts"}
      </button>
      <span className="hint">
        {kept ? "Carts store the whole current PDF for the cards that cite it." : "Carts store only the pages task cards cite."}
      </span>
      {message ? (
        <span role="alert" className="notice-error">
          {message}
        </span>
      ) : null}
    </div>
  );
}
