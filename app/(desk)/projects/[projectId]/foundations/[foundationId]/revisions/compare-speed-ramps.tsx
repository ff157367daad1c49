"use client";

import { ResponsiveLine, type LineSeries } from "@nivo/line";
import { useMemo, useState } from "react";
import type { AnalysisResult, TransientResult } from "@/modules/calc";
import { speedRampTitle } from "@/modules/desk/speed-ramps";
import { UnitsProvider, useUnits, type UnitSystem } from "@/app/_components/workspace/units-context";

type Series = LineSeries & { id: string; data: { x: number; y: number }[] };

// Older revision in slate, newer in ochre, as on the frequency-response overlay.
const colours = ["#647d88", "#d49a1e"];

/** The same identity the revision diff gives a run: rotor, ramp, load case and unbalance. */
function runKey(r: TransientResult): string {
  return [r.machine, r.rotor, r.kind, r.case, r.unbalanceMode].join(" / ");
}

/** Largest value over the run's bearings in each plot interval. */
function largestOverBearings(rows: number[][], n: number): number[] {
  return Array.from({ length: n }, (_, j) => rows.reduce((m, r) => Math.max(m, r[j] ?? 0), 0));
}

function Overlay({ older, newer }: { older: { label: string; result: AnalysisResult }; newer: { label: string; result: AnalysisResult } }) {
  const u = useUnits();
  const keys = useMemo(() => [...new Set([...(newer.result.transient ?? []), ...(older.result.transient ?? [])].map(runKey))], [older, newer]);
  const [pick, setPick] = useState(0);
  const [quantity, setQuantity] = useState<"displacement" | "velocity">("displacement");
  const chosen = keys[Math.min(pick, keys.length - 1)] ?? "";
  const series: Series[] = [older, newer].flatMap((rev) => {
    const run = (rev.result.transient ?? []).find((r) => runKey(r) === chosen);
    if (!run) return [];
    const values = largestOverBearings(quantity === "displacement" ? run.series.displacementPeak : run.series.velocityPeak, run.series.speedRpm.length);
    return [{ id: `revision ${rev.label}`, data: run.series.speedRpm.map((x, j) => ({ x, y: u.toDisplayNumber(quantity, values[j] ?? 0) })) }];
  });
  const described = [newer, older].map((rev) => (rev.result.transient ?? []).find((r) => runKey(r) === chosen)).find(Boolean);
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-3 text-xs">
        <label className="flex items-center gap-2">
          <span className="field-label mb-0">Run</span>
          <select className="field-input w-auto" value={pick} onChange={(e) => setPick(Number(e.target.value))}>
            {keys.map((k, i) => (
              <option key={k} value={i}>
                {k}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-2">
          <span className="field-label mb-0">Quantity</span>
          <select className="field-input w-auto" value={quantity} onChange={(e) => setQuantity(e.target.value === "velocity" ? "velocity" : "displacement")}>
            <option value="displacement">displacement</option>
            <option value="velocity">velocity</option>
          </select>
        </label>
      </div>
      {described ? <p className="text-2xs text-basalt-500">{speedRampTitle(described)}</p> : null}
      {series.length < 2 ? <p className="text-2xs text-ochre-700">Only one of the two revisions has this run.</p> : null}
      <div className="flex flex-wrap gap-3 text-2xs text-basalt-500">
        <span>
          <span className="inline-block h-0.5 w-4 bg-basalt-400 align-middle" /> revision {older.label}
        </span>
        <span>
          <span className="inline-block h-0.5 w-4 bg-ochre-500 align-middle" /> revision {newer.label}
        </span>
      </div>
      <div className="h-64 w-full" data-testid="compare-plot-speed-ramp">
        <ResponsiveLine
          data={series}
          ariaLabel={`Plot of the ${quantity} envelope of the speed ramp, revisions ${older.label} and ${newer.label} overlaid`}
          margin={{ top: 12, right: 16, bottom: 40, left: 64 }}
          xScale={{ type: "linear", min: "auto", max: "auto" }}
          yScale={{ type: "linear", min: 0, max: "auto" }}
          colors={(s) => colours[s.id === `revision ${older.label}` ? 0 : 1] ?? "#647d88"}
          lineWidth={1.6}
          enablePoints={false}
          enableGridX={false}
          useMesh
          animate={false}
          axisBottom={{ legend: "speed (rpm)", legendOffset: 30, legendPosition: "middle", tickSize: 4 }}
          axisLeft={{ legend: `${quantity} envelope, largest bearing (${u.unitLabel(quantity)})`, legendOffset: -54, legendPosition: "middle", tickSize: 4, format: (v) => Number(v).toPrecision(3) }}
          theme={{ text: { fontFamily: "var(--font-plex-sans)", fontSize: 10, fill: "#4a616c" }, grid: { line: { stroke: "#e3dfd6" } } }}
        />
      </div>
    </div>
  );
}

/** The speed-ramp envelopes of two revisions drawn over each other, run by run. */
export function CompareSpeedRamps(props: { older: { label: string; result: AnalysisResult }; newer: { label: string; result: AnalysisResult }; units: UnitSystem }) {
  return (
    <UnitsProvider initial={props.units}>
      <Overlay older={props.older} newer={props.newer} />
    </UnitsProvider>
  );
}
