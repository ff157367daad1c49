"use client";

import type { ReactNode } from "react";

/** "How was this computed": method, formula, source and the numbers that went in. */
export function Explain({ title = "How this was computed", method, formula, source, inputs }: { title?: string; method: string; formula?: ReactNode; source: string; inputs?: [string, string][] }) {
  return (
    <details className="mt-2 rounded-plinth border border-grout-200 bg-grout-50 px-3 py-2 text-xs text-basalt-700">
      <summary className="cursor-pointer select-none font-medium text-basalt-600">{title}</summary>
      <div className="mt-2 space-y-1.5">
        <p>
          <span className="font-semibold">Method: </span>
          {method}
        </p>
        {formula ? (
          <p className="font-mono">
            <span className="font-sans font-semibold">Formula: </span>
            {formula}
          </p>
        ) : null}
        <p>
          <span className="font-semibold">Source: </span>
          {source}
        </p>
        {inputs?.length ? (
          <table className="mt-1 w-auto text-2xs">
            <tbody>
              {inputs.map(([k, v]) => (
                <tr key={k}>
                  <td className="border-0 py-0.5 pl-0 pr-4 text-basalt-500">{k}</td>
                  <td className="border-0 py-0.5 font-mono">{v}</td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : null}
      </div>
    </details>
  );
}
