import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "./forgot-password-form";

export const metadata: Metadata = { title: "Reset your password" };
// Prerendered at build time: the page needs no session; its script policy is by hash (proxy.ts).
export const dynamic = "force-static";

export default function ForgotPasswordPage() {
  return (
    <div className="space-y-6">
      <div>
        <h1>Reset your password</h1>
        <p className="mt-1 text-sm text-basalt-500">We e-mail a link that works once and expires after an hour.</p>
      </div>
      <ForgotPasswordForm />
      <p className="text-sm">
        <Link href="/sign-in">Back to sign-in</Link>
      </p>
    </div>
  );
}
