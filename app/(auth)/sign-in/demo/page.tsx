import type { Metadata } from "next";
import { SignInContent } from "../sign-in-content";

export const metadata: Metadata = { title: "Sign in" };
// Served for /sign-in by proxy.ts in demo mode only (outside it this path serves the plain page).
export const dynamic = "force-static";

export default function DemoSignInPage() {
  return <SignInContent demo />;
}
