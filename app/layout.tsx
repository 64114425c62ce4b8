import type { Metadata } from "next";
import localFont from "next/font/local";
import type { ReactNode } from "react";
import { Providers } from "./providers";
import "./globals.css";

const sans = localFont({
  src: [
    { path: "./fonts/SourceSans3-Variable.woff2", style: "normal", weight: "200 900" },
    { path: "./fonts/SourceSans3-Variable-Italic.woff2", style: "italic", weight: "200 900" },
  ],
  variable: "--font-sagline",
  display: "swap",
});

export const metadata: Metadata = {
  title: { default: "Sagline", template: "%s · Sagline" },
  description: "Dissolved-oxygen modelling and waste-load allocation for river basins",
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={sans.variable}>
      <body>
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
