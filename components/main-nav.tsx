"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import type { NavItem } from "@/lib/domain/access/permissions";

export function MainNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    <nav aria-label="Main">
      <ul className="flex flex-wrap gap-1">
        {items.map((item) => {
          const current = item.href === "/" ? pathname === "/" : pathname.startsWith(item.href);
          return (
            <li key={item.href}>
              <Link
                href={item.href}
                // Prefetching renders every destination on the server as each page loads: eight
                // pages rendered beside the one being opened (bench:reader saw them delay a manual
                // page on a two-core server). A click costs one round trip more instead.
                prefetch={false}
                aria-current={current ? "page" : undefined}
                className={`flex min-h-12 items-center rounded px-4 font-semibold no-underline ${
                  current ? "bg-white text-deck" : "text-white hover:bg-white/15"
                }`}
              >
                {item.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
