"use client";
import dynamic from "next/dynamic";

/** The map only renders in the browser (WebGL); a placeholder holds its place meanwhile. */
export const BasinMapLazy = dynamic(() => import("./basin-map").then((m) => m.BasinMap), {
  ssr: false,
  loading: () => <div className="h-[480px] w-full animate-pulse rounded-card border border-rule bg-paper-sunk" />,
});
