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
 * row. On a phone the name mark and the account area share the first row and the section
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
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3 sm:flex-nowrap sm:px-6">
        <Link href={homeHref} className="shrink-0 no-underline hover:no-underline" aria-label={homeLabel}>
          <NameMark />
        </Link>
        <nav aria-label={navLabel} className="order-last -mx-4 w-[calc(100%+2rem)] overflow-x-auto px-4 sm:order-none sm:mx-0 sm:w-auto sm:px-0">
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
        <div className="ml-auto flex min-w-0 items-center gap-3 text-sm">{account}</div>
      </div>
    </header>
  );
}
