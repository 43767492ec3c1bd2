"use client";

import { useEffect } from "react";
import { endPendingSignOut } from "@/lib/client/cart/cart";

/**
 * Registered from the cart's pages only: a student opens "My work" online before working offline,
 * and that visit installs it. Elsewhere (the reader above all) the first visit does not compete
 * with 3.5 MB of precaching. Under next dev /sw.js answers 404 and registration quietly fails.
 */
export function ServiceWorker() {
  useEffect(() => {
    if ("serviceWorker" in navigator) void navigator.serviceWorker.register("/sw.js", { scope: "/" }).catch(() => undefined);
  }, []);
  return null;
}

/**
 * On every page: ends a session that a sign-out made offline could not end, so the next person at
 * the cart never continues in that account.
 */
export function PendingSignOut() {
  useEffect(() => {
    void endPendingSignOut()
      .then((result) => {
        if (result === "ended" && !window.location.pathname.startsWith("/sign-in")) window.location.replace("/sign-in");
      })
      .catch(() => undefined);
  }, []);
  return null;
}
