import Link from "next/link";

const tabs = [
  { href: "/tools", label: "Lending desk" },
  { href: "/tools/catalogue", label: "Tools and kits" },
  { href: "/tools/calibration", label: "Calibration" },
];

/** The tool room's three screens, as large links (the page's own navigation, not a second menu). */
export function ToolNav({ current }: { current: string }) {
  return (
    <nav aria-label="Tool room" className="flex flex-wrap gap-3">
      {tabs.map((t) => (
        <Link
          key={t.href}
          href={t.href}
          aria-current={t.href === current ? "page" : undefined}
          className={`btn ${t.href === current ? "btn-primary" : "btn-secondary"}`}
        >
          {t.label}
        </Link>
      ))}
    </nav>
  );
}
