import Link from "next/link";
import { DEMO_PASSWORD, demoAccounts } from "@/modules/platform/demo";
import { SignInForm } from "./sign-in-form";

/**
 * The sign-in page, prerendered at build time in two variants (with and without the demo
 * accounts); proxy.ts serves the demo one only while the server runs in demo mode. It reads
 * no session and no query: the form takes `?next=` from the address itself, and the action
 * checks the target again. A signed-in visitor sees the form (signing in again replaces the
 * session) instead of a redirect, which would need the session and a render per request.
 */
export function SignInContent({ demo }: { demo: boolean }) {
  return (
    <div className="space-y-6">
      <div>
        <h1>Sign in to the desk</h1>
        <p className="mt-1 text-sm text-basalt-500">Use the e-mail address your project manager invited.</p>
      </div>
      <SignInForm />
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
