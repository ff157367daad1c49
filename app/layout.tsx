import type { Metadata } from "next";
import type { ReactNode } from "react";
import { plexMono, plexSans } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Plinthwise", template: "%s · Plinthwise" },
  description: "Design and sign-off desk for concrete block foundations of rotating machines.",
};

// Pages render per request (the desk's layout is dynamic, and so are the one-time-link pages):
// Next puts the request's CSP nonce (proxy.ts) on their scripts while rendering. The two pages
// that need no session (sign-in, forgot password) are prerendered instead, and proxy.ts gives
// them a policy naming their inline scripts by hash (app/_lib/static-pages.ts). README,
// "Requests and headers".
export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${plexSans.variable} ${plexMono.variable}`}>
      <body>{children}</body>
    </html>
  );
}
