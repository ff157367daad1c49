"use client";

import { memo } from "react";
import { CHECK_VERDICT_LABELS, type AnalysisResult, type CheckVerdict } from "@/modules/calc";
import { summariseResults } from "@/modules/desk/results-summary";
import { formatSignificant as sig } from "@/modules/units";

const verdictTag: Record<CheckVerdict, string> = {
  pass: "bg-moss-100 text-moss-700",
  fail: "bg-brick-100 text-brick-700",
  accepted: "bg-ochre-100 text-ochre-700",
  "not-applicable": "bg-grout-100 text-basalt-600",
};

/**
 * The results in brief, kept in view beside the inputs (sticky at desktop widths, in the flow
 * on a phone): governing check and verdict, frequencies and ratios, the soil band, and whether
 * the figures belong to the inputs as they stand. Each part links to its full section.
 */
export const ResultsSummaryBar = memo(function ResultsSummaryBar({ result, stale, pending, hasError }: { result: AnalysisResult | null; stale: boolean; pending: boolean; hasError: boolean }) {
  const s = result ? summariseResults(result) : null;
  const state = !result ? (hasError ? "incomplete" : "calculating") : stale ? "stale" : "current";
  const stateText = { current: "current: follows the inputs", stale: pending ? "stale: recalculating" : "stale: earlier inputs", calculating: "calculating…", incomplete: "no results: inputs incomplete" }[state];
  return (
    <section
      aria-label="Results in brief"
      data-testid="results-summary"
      data-state={state}
      className="slab z-20 space-y-1 border-basalt-300 px-3 py-2 text-xs lg:sticky lg:top-0"
    >
      <div className="flex flex-wrap items-center gap-x-4 gap-y-1">
        <span className={`tag ${state === "current" ? "bg-moss-100 text-moss-700" : "bg-ochre-100 text-ochre-700"}`} role="status" data-testid="results-summary-state">
          {stateText}
        </span>
        {s?.governing ? (
          <a href="#checks" className="no-underline" data-testid="results-summary-governing">
            <span className="text-basalt-600">Governing:</span> <span className={`tag ${verdictTag[s.governing.verdict]}`}>{CHECK_VERDICT_LABELS[s.governing.verdict]}</span>{" "}
            <span className="text-basalt-800">{s.governing.label}</span> <span className="font-mono text-basalt-600">({sig(s.governing.utilisation * 100)} % of its limit)</span>
            <span className="text-basalt-600"> · {s.failing} of {s.total} checks fail</span>
          </a>
        ) : null}
      </div>
      {s ? (
        <div className="flex flex-wrap items-center gap-x-4 gap-y-1">
          <a href="#modes" className="no-underline" data-testid="results-summary-frequencies">
            <span className="text-basalt-600">f:</span> <span className="font-mono text-basalt-800">{s.frequenciesHz.map((f) => sig(f)).join(", ")} Hz</span>
          </a>
          {s.rotors.map((r) => (
            <a key={`${r.machine}-${r.rotor}`} href="#modes" className="no-underline" data-testid="results-summary-ratio">
              <span className="text-basalt-600">
                {r.machine} · {r.rotor}, r nearest 1:
              </span>{" "}
              <span className="font-mono text-basalt-800">
                {sig(r.nearestRatio)} (mode {r.mode})
              </span>
            </a>
          ))}
          {s.soilBand ? (
            <a href="#checks" className="no-underline" data-testid="results-summary-band">
              <span className="text-basalt-600">Soil band:</span> <span className={`tag ${verdictTag[s.soilBand.verdict]}`}>{CHECK_VERDICT_LABELS[s.soilBand.verdict]}</span>{" "}
              <span className="text-basalt-600">
                {s.soilBand.failing} of {s.soilBand.total} band checks fail
              </span>
            </a>
          ) : null}
          <a href="#plots" className="text-basalt-700">
            plots
          </a>
        </div>
      ) : null}
    </section>
  );
});
