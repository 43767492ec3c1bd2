"use client";

import { useEffect } from "react";

/** Registers the service worker. Under next dev /sw.js answers 404 and registration quietly fails. */
export function ServiceWorker() {
  useEffect(() => {
    if (!("serviceWorker" in navigator)) return;
    void navigator.serviceWorker.register("/sw.js", { scope: "/" }).catch(() => undefined);
  }, []);
  return null;
}
