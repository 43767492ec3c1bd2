"use client";

import { useCart, useOnline, useWaiting } from "./cart-provider";

/** Always on the cart's screen: online or offline, and how many changes wait to be sent. */
export function CartStatus() {
  const { data, user } = useCart();
  const online = useOnline();
  const waiting = useWaiting(data);
  return (
    <div className="flex items-center gap-3">
      <span
        role="status"
        aria-live="polite"
        data-testid="cart-status"
        className={`badge text-base ${online ? "bg-ok-pale text-ok" : "bg-amber-pale text-ink"}`}
      >
        {online ? "Online" : "Offline"} ·{" "}
        {waiting === 0 ? "all changes sent" : `${waiting} ${waiting === 1 ? "change waits" : "changes wait"} to be sent`}
      </span>
      {user ? <span className="font-semibold">{user.name}</span> : null}
    </div>
  );
}
