"use client";
import Link from "next/link";
import { usePathname } from "next/navigation";
import type { ReactNode } from "react";
import { NameMark } from "@/components/brand/name-mark";

export interface HeaderLink {
  href: string;
  label: string;
}

/**
 * The one header frame of Sagline's pages: the name mark, the section links and the
 * account area (who is signed in, sign in or out). From 640 px up everything sits on one
 * row. On a phone the name mark and the account area share the first row (a long name is
 * cut short there, never pushed onto a row of its own) and the section
 * links get a row of their own that never wraps a link's words (it scrolls sideways
 * inside itself if a longer set of links ever needs it), so every link stays one tap away.
 */
export function SiteHeader({
  homeHref,
  homeLabel,
  navLabel,
  links,
  account,
  testId,
}: {
  homeHref: string;
  homeLabel: string;
  navLabel: string;
  links: HeaderLink[];
  account: ReactNode;
  testId?: string;
}) {
  const path = usePathname();
  return (
    <header className="border-b border-rule bg-paper-raised" data-testid={testId}>
      <div className="mx-auto grid max-w-6xl grid-cols-[auto_minmax(0,1fr)] items-center gap-x-4 gap-y-2 px-4 py-3 sm:flex sm:gap-x-6 sm:px-6">
        <Link href={homeHref} className="shrink-0 no-underline hover:no-underline" aria-label={homeLabel}>
          <NameMark />
        </Link>
        <nav aria-label={navLabel} className="order-last col-span-2 -mx-4 overflow-x-auto px-4 sm:order-none sm:mx-0 sm:px-0">
          <ul className="flex gap-x-5 whitespace-nowrap text-sm sm:gap-x-4">
            {links.map((l) => (
              <li key={l.href}>
                <Link href={l.href} aria-current={path === l.href ? "page" : undefined}>
                  {l.label}
                </Link>
              </li>
            ))}
          </ul>
        </nav>
        <div className="flex min-w-0 items-center justify-end gap-3 text-sm sm:ml-auto">{account}</div>
      </div>
    </header>
  );
}
