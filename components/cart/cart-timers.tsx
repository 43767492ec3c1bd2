"use client";

import { useCart } from "./cart-provider";
import { TimerWatch } from "./timer-watch";

export function CartTimers() {
  return <TimerWatch data={useCart().data} />;
}
