import { Brand } from "@/components/brand";
import { CartProvider } from "@/components/cart/cart-provider";
import { CartStatus } from "@/components/cart/cart-status";
import { CartTimers } from "@/components/cart/cart-timers";
import { SafetyNotice } from "@/components/safety-notice";
import { ServiceWorker } from "@/components/service-worker";
import { SignOutButton } from "@/components/sign-out-button";

// The cart: pages that work without network. Static shells (precached by the service worker) that
// read who is signed in and all their data on the client; nothing here is rendered per user.
export default function CartLayout({ children }: { children: React.ReactNode }) {
  return (
    <CartProvider>
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-white focus:p-3">
        Skip to content
      </a>
      <header className="bg-deck text-white">
        <div className="mx-auto flex max-w-5xl flex-wrap items-center gap-x-5 gap-y-2 px-4 py-2">
          {/* Plain links on purpose: leaving the cart is a full page load, which the service worker
              answers with "my work" when offline instead of a failed client-side fetch. */}
          {/* eslint-disable-next-line @next/next/no-html-link-for-pages */}
          <a href="/" className="no-underline" aria-label="Hangarleaf home">
            <Brand inverted />
          </a>
          <nav aria-label="Cart">
            <a href="/cart" className="inline-flex min-h-11 items-center rounded px-3 text-lg font-semibold text-white">
              My work
            </a>
          </nav>
          <div className="ml-auto flex items-center gap-3">
            <CartStatus />
            <SignOutButton />
          </div>
        </div>
      </header>
      <div className="mx-auto max-w-5xl px-4 pt-3">
        <SafetyNotice compact />
      </div>
      <main id="main" className="mx-auto max-w-5xl px-4 py-6">
        {children}
      </main>
      <CartTimers />
      <ServiceWorker />
    </CartProvider>
  );
}
