"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { ApiError, call } from "@/lib/client/api";
import { libraryApi } from "@/lib/contracts/endpoints/library";

export function RetryButton({ revisionId, label }: { revisionId: string; label: string }) {
  const router = useRouter();
  const [state, setState] = useState<{ busy: boolean; message?: string }>({ busy: false });
  return (
    <span className="flex flex-col gap-1">
      <button
        type="button"
        className="btn btn-secondary btn-small"
        disabled={state.busy}
        aria-label={`Try reading ${label} again`}
        onClick={async () => {
          setState({ busy: true });
          try {
            await call(libraryApi.retryRevision, { params: { id: revisionId } });
            setState({ busy: false, message: "Queued again." });
            router.refresh();
          } catch (error) {
            setState({ busy: false, message: error instanceof ApiError ? error.message : "Not queued." });
          }
        }}
      >
        Try again
      </button>
      {state.message ? (
        <span role="status" className="text-sm">
          {state.message}
        </span>
      ) : null}
    </span>
  );
}
