"use client";

import { useRouter } from "next/navigation";
import { useEffect } from "react";

/**
 * While a revision of this manual is queued or being read, the page renders itself again every few
 * seconds: its pages count up and it turns ready (or failed) without a reload. Nothing is polled
 * once every revision is settled, as the server stops rendering this component.
 */
export function RefreshWhileReading({ every = 3000 }: { every?: number }) {
  const router = useRouter();
  useEffect(() => {
    const timer = setInterval(() => {
      if (document.visibilityState === "visible") router.refresh();
    }, every);
    return () => clearInterval(timer);
  }, [router, every]);
  return null;
}
