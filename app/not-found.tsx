import Link from "next/link";
import { connection } from "next/server";

// Rendered per request like the pages it stands in for, so its scripts carry the request's nonce.
export default async function NotFound() {
  await connection();
  return (
    <main className="mx-auto flex min-h-[60vh] max-w-xl flex-col justify-center gap-4 px-6">
      <p className="font-mono text-sm text-basalt-400">404</p>
      <h1>Nothing to see here</h1>
      <p className="text-basalt-600">
        This page does not exist, or your role on the project does not let you open it. If you expected to see it, ask the
        project&apos;s manager for access.
      </p>
      <p>
        <Link href="/">Back to your desk</Link>
      </p>
    </main>
  );
}
