"use client";

import { useEffect, useRef } from "react";

/**
 * Asks before leaving a page with work that is not stored yet: the browser's own question when
 * the tab closes or reloads, and a confirm when a link inside the app is followed (Next's links
 * change the page without an unload, so the browser would not ask). `isDirty` is read at the
 * moment of leaving, so it may look at refs.
 */
export function useLeaveGuard(isDirty: () => boolean, question = "Your last changes are not saved yet. Leave this page anyway?") {
  const dirty = useRef(isDirty);
  useEffect(() => {
    dirty.current = isDirty;
  });

  useEffect(() => {
    const beforeUnload = (event: BeforeUnloadEvent) => {
      if (dirty.current()) event.preventDefault();
    };
    const click = (event: MouseEvent) => {
      if (event.defaultPrevented || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return;
      const link = event.target instanceof Element ? event.target.closest("a[href]") : null;
      if (!(link instanceof HTMLAnchorElement) || link.target === "_blank" || link.hasAttribute("download")) return;
      const to = new URL(link.href, window.location.href);
      // Another site unloads this page, and beforeunload asks; the same page is no leaving.
      if (to.origin !== window.location.origin) return;
      if (to.pathname === window.location.pathname && to.search === window.location.search) return;
      if (!dirty.current()) return;
      if (!window.confirm(question)) {
        event.preventDefault();
        // Captured at the document, before React's own listener on the app's root follows the link.
        event.stopPropagation();
      }
    };
    window.addEventListener("beforeunload", beforeUnload);
    document.addEventListener("click", click, true);
    return () => {
      window.removeEventListener("beforeunload", beforeUnload);
      document.removeEventListener("click", click, true);
    };
  }, [question]);
}
