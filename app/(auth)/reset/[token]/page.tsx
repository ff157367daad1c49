import type { Metadata } from "next";
import Link from "next/link";
import { getLiveToken } from "@/db/queries/accounts";
import { PasswordForm } from "../../password-form";

export const metadata: Metadata = { title: "Choose a new password" };
// Per request: the link is checked when it is opened, and the page carries the request\'s script nonce.
export const dynamic = "force-dynamic";

export default async function ResetPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const live = await getLiveToken("password-reset", token);
  if (!live) {
    return (
      <div className="space-y-4">
        <h1>This link no longer works</h1>
        <p className="text-sm text-basalt-600">Reset links expire after an hour and work once.</p>
        <Link href="/forgot-password">Ask for a new link</Link>
      </div>
    );
  }
  return (
    <div className="space-y-6">
      <h1>Choose a new password</h1>
      <PasswordForm token={token} mode="reset" />
    </div>
  );
}
