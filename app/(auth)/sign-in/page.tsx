import type { Metadata } from "next";
import { SignInContent } from "./sign-in-content";

export const metadata: Metadata = { title: "Sign in" };
// Prerendered at build time: no session, no request data (see sign-in-content.tsx, proxy.ts).
export const dynamic = "force-static";

export default function SignInPage() {
  return <SignInContent demo={false} />;
}
