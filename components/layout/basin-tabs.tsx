"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";
import { useEffect, useRef } from "react";

/**
 * A basin's sections as tabs. The strip never wraps a label: on a narrow screen it
 * scrolls sideways inside itself (the page does not), and the current tab is scrolled
 * into view so a phone shows where the reader is.
 */
export function BasinTabs({ tabs }: { tabs: { href: string; label: string }[] }) {
  const path = usePathname();
  const strip = useRef<HTMLElement>(null);
  useEffect(() => {
    const nav = strip.current;
    const current = nav?.querySelector<HTMLElement>('[aria-current="page"]');
    if (!nav || !current) return;
    const left = current.offsetLeft - nav.offsetLeft;
    if (left < nav.scrollLeft || left + current.offsetWidth > nav.scrollLeft + nav.clientWidth) nav.scrollLeft = left - 16;
  }, [path]);
  return (
    <nav ref={strip} className="tab-strip -mx-4 flex gap-1 overflow-x-auto px-4 sm:mx-0 sm:px-0" aria-label="Basin sections">
      {tabs.map((t) => {
        const active = path === t.href || (t.href.split("/").length > 3 && path.startsWith(`${t.href}/`));
        return (
          <Link
            key={t.href}
            href={t.href}
            aria-current={active ? "page" : undefined}
            className={`shrink-0 whitespace-nowrap border-b-2 px-3 py-2 text-sm no-underline hover:no-underline ${
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
