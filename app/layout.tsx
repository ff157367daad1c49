import type { Metadata } from "next";
import type { ReactNode } from "react";
import { connection } from "next/server";
import { plexMono, plexSans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Plinthwise", template: "%s · Plinthwise" },
  description: "Design and sign-off desk for concrete block foundations of rotating machines.",
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Every page renders per request: Next puts the request's CSP nonce (proxy.ts) on its
  // scripts only while rendering, so a page prerendered at build time would carry none and
  // its scripts would be blocked. See README, "Content security policy".
  await connection();
  return (
    <html lang="en" className={`${plexSans.variable} ${plexMono.variable}`}>
      <body>{children}</body>
    </html>
  );
}
