"use client";

import { createContext, useContext, useEffect, useState, useSyncExternalStore } from "react";
import { cartData, openSession, syncer } from "@/lib/client/cart/cart";
import type { CartData, CartUser } from "@/lib/client/cart/store";

interface CartState {
  ready: boolean;
  user: CartUser | null;
  data: CartData | null;
  /** The server answered when the cart opened. */
  reached: boolean;
}

const CartContext = createContext<CartState>({ ready: false, user: null, data: null, reached: false });

/** Who the cart runs for: the signed-in user, or offline the one who signed in last on this laptop. */
export function CartProvider({ children }: { children: React.ReactNode }) {
  const [state, setState] = useState<CartState>({ ready: false, user: null, data: null, reached: false });
  useEffect(() => {
    let live = true;
    void openSession().then((session) => {
      if (!live) return;
      if (!session.user && session.online) {
        window.location.replace(`/sign-in?next=${encodeURIComponent(window.location.pathname + window.location.search)}`);
        return;
      }
      const data = session.user ? cartData(session.user.id) : null;
      setState({ ready: true, user: session.user, data, reached: session.online });
      if (data) void syncer(data).now();
    });
    return () => {
      live = false;
    };
  }, []);
  return <CartContext.Provider value={state}>{children}</CartContext.Provider>;
}

export const useCart = () => useContext(CartContext);

function subscribeOnline(onChange: () => void) {
  window.addEventListener("online", onChange);
  window.addEventListener("offline", onChange);
  return () => {
    window.removeEventListener("online", onChange);
    window.removeEventListener("offline", onChange);
  };
}

export const useOnline = () =>
  useSyncExternalStore(
    subscribeOnline,
    () => navigator.onLine,
    () => true,
  );

/** How many changes wait to be sent, kept current as they are queued and sent. */
export function useWaiting(data: CartData | null): number {
  const [count, setCount] = useState(0);
  useEffect(() => {
    if (!data) return;
    const read = () =>
      void Promise.all([data.pending(), data.pendingPhotos()]).then(
        ([e, p]) => setCount(e.length + p.length),
        () => setCount(0),
      );
    read();
    return data.onChange(read);
  }, [data]);
  return count;
}
