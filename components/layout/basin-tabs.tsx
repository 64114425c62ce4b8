"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";

export function BasinTabs({ tabs }: { tabs: { href: string; label: string }[] }) {
  const path = usePathname();
  return (
    <nav className="flex gap-1 border-b border-rule" aria-label="Basin sections">
      {tabs.map((t) => {
        const active = path === t.href || (t.href.split("/").length > 3 && path.startsWith(`${t.href}/`));
        return (
          <Link
            key={t.href}
            href={t.href}
            aria-current={active ? "page" : undefined}
            className={`-mb-px border-b-2 px-3 py-2 text-sm no-underline hover:no-underline ${
              active ? "border-tarn-600 font-semibold text-ink" : "border-transparent text-ink-soft hover:text-ink"
            }`}
          >
            {t.label}
          </Link>
        );
      })}
    </nav>
  );
}
