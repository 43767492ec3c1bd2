"use client";

import { useEffect } from "react";
import { clearSignOutPending, signOutPending } from "@/lib/cart/store";

/**
 * On every page: registers the service worker (under next dev /sw.js answers 404 and registration
 * quietly fails), and ends a session that a sign-out made offline could not end, so the next
 * person at the cart never continues in that account.
 */
export function ServiceWorker() {
  useEffect(() => {
    if ("serviceWorker" in navigator) void navigator.serviceWorker.register("/sw.js", { scope: "/" }).catch(() => undefined);
    void signOutPending()
      .then(async (pending) => {
        if (!pending) return;
        const ended = await fetch("/api/session", { method: "DELETE" }).then((r) => r.ok, () => false);
        if (!ended) return;
        await clearSignOutPending();
        if (!window.location.pathname.startsWith("/sign-in")) window.location.replace("/sign-in");
      })
      .catch(() => undefined);
  }, []);
  return null;
}
