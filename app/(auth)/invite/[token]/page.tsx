import type { Metadata } from "next";
import { getLiveToken, getPublicUser } from "@/db/queries/accounts";
import { PasswordForm } from "../../password-form";

export const metadata: Metadata = { title: "Accept your invitation" };
// Per request: the link is checked when it is opened, and the page carries the request\'s script nonce.
export const dynamic = "force-dynamic";

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const live = await getLiveToken("invitation", token);
  const user = live ? await getPublicUser(live.userId) : undefined;
  if (!live || !user) {
    return (
      <div className="space-y-4">
        <h1>This invitation no longer works</h1>
        <p className="text-sm text-basalt-600">Invitations expire after seven days and work once. Ask the project manager to invite you again.</p>
      </div>
    );
  }
  return (
    <div className="space-y-6">
      <div>
        <h1>Welcome to Plinthwise</h1>
        <p className="mt-1 text-sm text-basalt-500">Set a password for {user.email}.</p>
      </div>
      <PasswordForm token={token} mode="invite" defaultName={user.name} />
    </div>
  );
}
