import type { Metadata } from "next";
import localFont from "next/font/local";
import { GeistMono } from "geist/font/mono";
import { Providers } from "@/components/layout/providers";
import { SkipLinks } from "@/components/layout/skip-links";
import "./globals.css";

const sans = localFont({
  src: "../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2",
  weight: "100 900",
  variable: "--font-sans",
  display: "swap",
});

// Every page is rendered per request, never prerendered: the Content-Security-Policy's script
// nonce (proxy.ts) is new for each request, and a prerendered page's scripts would lack it.
export const dynamic = "force-dynamic";

export const metadata: Metadata = {
  title: { default: "Seriatim", template: "%s · Seriatim" },
  description: "Reactor train design: sweep, rank and approve CSTR and PFR trains.",
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${sans.variable} ${GeistMono.variable}`} style={{ ["--font-mono" as string]: "var(--font-geist-mono)" }}>
      <body>
        <SkipLinks />
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
