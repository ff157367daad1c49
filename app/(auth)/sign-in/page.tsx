import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { getServerEnv, isDemoMode } from "@/modules/platform/env";
import { safeRedirectPath } from "@/modules/platform/redirects";
import { DEMO_PASSWORD, demoAccounts } from "@/modules/platform/demo";
import { getPageUser } from "../../_lib/page-guard";
import { SignInForm } from "./sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string }> }) {
  if (await getPageUser({ optional: true })) redirect("/");
  const { next } = await searchParams;
  // Checked here too, so the form never carries a foreign target (the action checks again).
  const target = safeRedirectPath(next, getServerEnv().APP_URL);
  const demo = isDemoMode();
  return (
    <div className="space-y-6">
      <div>
        <h1>Sign in to the desk</h1>
        <p className="mt-1 text-sm text-basalt-500">Use the e-mail address your project manager invited.</p>
      </div>
      <SignInForm next={target === "/" ? undefined : target} />
      <p className="text-sm">
        <Link href="/forgot-password">Forgotten your password?</Link>
      </p>
      {demo ? (
        <div className="rounded-plinth border border-ochre-300 bg-ochre-100 p-3 text-xs text-basalt-800" data-testid="demo-accounts">
          <p className="font-semibold">Demo mode: invented accounts, password <code className="font-mono">{DEMO_PASSWORD}</code></p>
          <ul className="mt-2 space-y-0.5 font-mono">
            {demoAccounts.map((a) => (
              <li key={a.email}>
                {a.email} <span className="text-basalt-500">· {a.label}</span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
