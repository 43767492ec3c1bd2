"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useState } from "react";
import type { NavItem } from "@/lib/domain/access/permissions";

/**
 * The main navigation: a row of links on a wide screen; below that (a cart's 1024 px, a phone) one
 * "Menu" button that opens them, so the page being worked on starts near the top of the screen.
 */
export function MainNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  const [open, setOpen] = useState(false);
  const here = items.find((item) => (item.href === "/" ? pathname === "/" : pathname.startsWith(item.href)));
  return (
    <nav aria-label="Main" className={`flex flex-wrap items-center ${open ? "w-full xl:w-auto" : ""}`}>
      <button
        type="button"
        className="flex min-h-12 items-center gap-2 rounded px-4 font-semibold text-white hover:bg-white/15 xl:hidden"
        aria-expanded={open}
        aria-controls="main-nav-list"
        onClick={() => setOpen((o) => !o)}
      >
        <span aria-hidden="true">☰</span> Menu{here ? <span className="font-normal text-white/80">· {here.label}</span> : null}
      </button>
      <ul
        id="main-nav-list"
        className={`${open ? "flex" : "hidden"} w-full flex-col gap-1 pb-2 xl:flex xl:w-auto xl:flex-row xl:flex-wrap xl:pb-0`}
      >
        {items.map((item) => {
          const current = item === here;
          return (
            <li key={item.href}>
              <Link
                href={item.href}
                // Prefetching renders every destination on the server as each page loads: eight
                // pages rendered beside the one being opened (bench:reader saw them delay a manual
                // page on a two-core server). A click costs one round trip more instead.
                prefetch={false}
                onClick={() => setOpen(false)}
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
