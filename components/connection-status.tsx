"use client";

import { useSyncExternalStore } from "react";

function subscribe(onChange: () => void) {
  window.addEventListener("online", onChange);
  window.addEventListener("offline", onChange);
  return () => {
    window.removeEventListener("online", onChange);
    window.removeEventListener("offline", onChange);
  };
}

/** Always on screen: whether this laptop reaches the network. The cart runner adds its waiting changes here. */
export function ConnectionStatus() {
  const online = useSyncExternalStore(
    subscribe,
    () => navigator.onLine,
    () => true,
  );
  return (
    <span role="status" aria-live="polite" className={`badge ${online ? "bg-ok-pale text-ok" : "bg-amber-pale text-ink"}`}>
      {online ? "Online" : "Offline"}
    </span>
  );
}
