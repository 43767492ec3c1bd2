"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { toolsApi } from "@/lib/contracts/endpoints/tools";
import type { ToolStatus } from "@/lib/domain/tools/tool-room";

/** Taking a tool out of service (with why) or putting it back. */
export function ServiceForm({ toolId, status }: { toolId: string; status: ToolStatus }) {
  const router = useRouter();
  const [reason, setReason] = useState("");
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const out = status === "out_of_service";
  return (
    <form
      className="panel flex flex-col gap-3"
      aria-labelledby="service-title"
      onSubmit={async (e) => {
        e.preventDefault();
        if (!out && !reason.trim()) return setResult({ ok: false, message: "Say why the tool is out of service." });
        setBusy(true);
        try {
          await call(toolsApi.updateTool, {
            params: { id: toolId },
            body: out ? { status: "in_service" } : { status: "out_of_service", outOfServiceReason: reason },
          });
          setResult({
            ok: true,
            message: out ? "Back in service." : "Out of service: it is not lent, and no reading taken with it is recorded.",
          });
          setReason("");
          router.refresh();
        } catch (error) {
          setResult({ ok: false, message: error instanceof ApiError ? error.message : "Not changed: try again." });
        } finally {
          setBusy(false);
        }
      }}
    >
      <h2 id="service-title">{out ? "Put back in service" : "Take out of service"}</h2>
      <FormResult result={result} />
      {out ? null : (
        <label className="field">
          <span className="label">Why (damaged, lost, sent for repair…)</span>
          <input className="input" value={reason} maxLength={300} onChange={(e) => setReason(e.target.value)} />
        </label>
      )}
      <button type="submit" className={`btn self-start ${out ? "btn-primary" : "btn-danger"}`} disabled={busy}>
        {out ? "Put back in service" : "Take out of service"}
      </button>
    </form>
  );
}
