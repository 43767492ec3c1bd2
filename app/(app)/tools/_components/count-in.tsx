"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { FormResult } from "@/components/form-result";
import { ApiError, call } from "@/lib/client/api";
import { toolsApi } from "@/lib/contracts/endpoints/tools";
import type { CheckoutDto } from "@/lib/contracts/tools";

/**
 * Counting a loan back in: every tool it holds is ticked as back; untick what is not on the bench.
 * Anything missing opens a hold that keeps the student's run from being handed in.
 */
export function CountIn({ checkout, onCounted }: { checkout: CheckoutDto; onCounted: (said: { ok: boolean; message: string }) => void }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [back, setBack] = useState<Set<string>>(() => new Set(checkout.tools.map((t) => t.id)));
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<{ ok: boolean; message: string } | null>(null);
  const missing = checkout.tools.filter((t) => !back.has(t.id));
  const what = checkout.kit ? `kit ${checkout.kit.number}` : (checkout.tool?.number ?? "the loan");

  if (!open)
    return (
      <button type="button" className="btn btn-secondary" onClick={() => setOpen(true)}>
        Count in {what}
      </button>
    );
  return (
    <form
      className="flex flex-col gap-3"
      aria-label={`Count in ${what}`}
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        setResult(null);
        try {
          const { holds } = await call(toolsApi.returnCheckout, {
            params: { id: checkout.id },
            body: { missingToolIds: missing.map((t) => t.id) },
          });
          const what = checkout.kit ? `Kit ${checkout.kit.number}` : (checkout.tool?.number ?? "The loan");
          onCounted({
            ok: holds.length === 0,
            message: holds.length
              ? `${what} from ${checkout.userName} counted in. ${holds.map((h) => h.tool.number).join(", ")} missing: a hold is open until an instructor clears it.`
              : `${what} from ${checkout.userName} counted in: every tool is back.`,
          });
          router.refresh();
        } catch (error) {
          setResult({ ok: false, message: error instanceof ApiError ? error.message : "Not counted in: try again." });
        } finally {
          setBusy(false);
        }
      }}
    >
      <fieldset className="flex flex-col gap-1">
        <legend className="font-semibold">Tick each tool that is back on the bench</legend>
        {checkout.tools.map((t) => (
          <label key={t.id} className="flex min-h-11 items-center gap-3">
            <input
              type="checkbox"
              className="h-6 w-6"
              checked={back.has(t.id)}
              onChange={(e) =>
                setBack((s) => {
                  const next = new Set(s);
                  if (e.target.checked) next.add(t.id);
                  else next.delete(t.id);
                  return next;
                })
              }
            />
            <span>
              <strong className="font-mono">{t.number}</strong> {t.description}
            </span>
          </label>
        ))}
      </fieldset>
      {missing.length ? (
        <p className="notice-error">
          {missing.length === 1 ? "One tool is" : `${missing.length} tools are`} missing: counting in opens a hold, and {checkout.userName}
          &apos;s run cannot be handed in until an instructor clears it. Check the aircraft and the work area first.
        </p>
      ) : null}
      <div className="flex flex-wrap gap-3">
        <button type="submit" className={`btn ${missing.length ? "btn-danger" : "btn-primary"}`} disabled={busy}>
          {missing.length ? `Count in, ${missing.length} missing` : "Count in, all back"}
        </button>
        <button type="button" className="btn btn-secondary" onClick={() => setOpen(false)} disabled={busy}>
          Not now
        </button>
      </div>
      <FormResult result={result} />
    </form>
  );
}
