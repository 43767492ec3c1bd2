"use client";

import { useSyncExternalStore } from "react";
import { useCart, useOnline } from "@/components/cart/cart-provider";
import { Runner } from "@/components/cart/runner/runner";

// /cart/run?id=… : the run is named in the query, so one precached page serves every run offline.
export default function RunPage() {
  const { ready, data } = useCart();
  const online = useOnline();
  const runId = useSyncExternalStore(
    () => () => undefined,
    () => new URLSearchParams(window.location.search).get("id") ?? "",
    () => null,
  );
  if (!ready || runId === null) return <p role="status">Opening…</p>;
  if (!data) return <NoUser />;
  if (!/^[0-9a-f-]{36}$/i.test(runId)) {
    return (
      <p className="notice-error">
        No run named here. <a href="/cart">Back to my work</a>
      </p>
    );
  }
  return <Runner data={data} runId={runId} online={online} />;
}

function NoUser() {
  return <p className="notice-error">Nothing is stored on this laptop yet. Connect to the network and sign in once.</p>;
}
