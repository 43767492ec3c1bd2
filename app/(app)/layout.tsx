import Link from "next/link";
import { Brand } from "@/components/brand";
import { ConnectionStatus } from "@/components/connection-status";
import { MainNav } from "@/components/main-nav";
import { Providers } from "@/components/providers";
import { SafetyNotice } from "@/components/safety-notice";
import { SignOutButton } from "@/components/sign-out-button";
import { navigationFor, roleLabels } from "@/lib/domain/access/permissions";
import { requirePageUser } from "@/app/_adapters/session";
import { getEnv } from "@/lib/server/env";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser();
  const items = navigationFor(user, { outbox: !!getEnv().HL_OUTBOX_URL });
  return (
    <Providers>
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-white focus:p-3">
        Skip to content
      </a>
      <header className="bg-deck text-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
          <Link href="/" prefetch={false} className="no-underline" aria-label="Hangarleaf home">
            <Brand inverted />
          </Link>
          <MainNav items={items} />
          <div className="ml-auto flex items-center gap-3">
            <ConnectionStatus />
            <span className="text-right leading-tight">
              <span className="block font-semibold">{user.name}</span>
              <span className="block text-sm text-white/80">{roleLabels[user.role]}</span>
            </span>
            <SignOutButton />
          </div>
        </div>
      </header>
      <div className="mx-auto max-w-6xl px-4 pt-3">
        <SafetyNotice compact />
      </div>
      <main id="main" className="mx-auto max-w-6xl px-4 py-6">
        {children}
      </main>
    </Providers>
  );
}
