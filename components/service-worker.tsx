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
    if (!("serviceWorker" in navigator)) return;
    let stopped = false;
    let timer: ReturnType<typeof setTimeout> | undefined;
    // An install fails as a whole when one precached file does not arrive (a busy server, a cart
    // on flaky Wi-Fi), and the browser does not try again until the next page load. Try again here
    // a few times, so a cart that stays on one page still ends up working offline.
    const register = (attempt: number) => {
      if (stopped) return;
      navigator.serviceWorker
        .register("/sw.js", { scope: "/" })
        .then((registration) => {
          const installing = registration.installing;
          installing?.addEventListener("statechange", () => {
            if (installing.state === "redundant" && !registration.active && attempt < 4)
              timer = setTimeout(() => register(attempt + 1), 3000 * attempt);
          });
        })
        .catch(() => undefined);
    };
    register(1);
    return () => {
      stopped = true;
      clearTimeout(timer);
    };
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
