"use client";
import dynamic from "next/dynamic";

/** The DO map only renders in the browser (WebGL); a placeholder holds its place meanwhile. */
export const DoMapLazy = dynamic(() => import("./do-map").then((m) => m.DoMap), {
  ssr: false,
  loading: () => <div className="h-[480px] w-full animate-pulse rounded-card border border-rule bg-paper-sunk" />,
});
