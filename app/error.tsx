"use client";

import { useEffect } from "react";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <main className="mx-auto flex min-h-[60vh] max-w-xl flex-col justify-center gap-4 px-6">
      <p className="font-mono text-sm text-brick-500">Error{error.digest ? ` · ${error.digest}` : ""}</p>
      <h1>The desk hit a snag</h1>
      <p className="text-basalt-600">Nothing you saved has been lost. Try again; if it keeps happening, tell your administrator the code above.</p>
      <div>
        <button type="button" className="btn-primary" onClick={() => reset()}>
          Try again
        </button>
      </div>
    </main>
  );
}
