"use client";

import { useMemo, useState } from "react";
import type { AnalysisResult } from "@/modules/calc";
import { UnitsProvider, useUnits, type UnitSystem } from "@/app/_components/workspace/units-context";
import { FrequencyMarks, type ModeMark, type OperatingBand } from "@/app/_components/workspace/plot-marks";
import { FrequencyLineChart, sweepCaseKey, type FrequencyLayer, type FrequencySeries } from "@/app/_components/workspace/frequency-line-chart";

type Series = FrequencySeries;

// Older revision in slate, newer in ochre: the same palette as the workspace plots.
const colours = ["#647d88", "#d49a1e"];

const caseKey = sweepCaseKey;

/** Largest value over every point of the chosen rotor and case, at each frequency. */
function envelope(result: AnalysisResult, key: string, pick: (s: AnalysisResult["sweep"]["series"][number]) => number[]): number[] {
  const series = result.sweep.series.filter((s) => caseKey(s) === key);
  return result.sweep.frequencyHz.map((_, i) => series.reduce((m, s) => Math.max(m, pick(s)[i] ?? 0), 0));
}

function marksLayer(ranges: OperatingBand[], modes: ModeMark[], idPrefix: string): FrequencyLayer {
  function MarksLayer({ xScale, innerWidth, innerHeight }: Parameters<FrequencyLayer>[0]) {
    return <FrequencyMarks x={(v) => xScale(v as never)} innerWidth={innerWidth} innerHeight={innerHeight} operating={ranges} modes={modes} idPrefix={idPrefix} />;
  }
  return MarksLayer;
}

function Overlay({ series, yLabel, ranges, modes, testId }: { series: Series[]; yLabel: string; ranges: OperatingBand[]; modes: ModeMark[]; testId: string }) {
  const layer = useMemo(() => marksLayer(ranges, modes, testId), [ranges, modes, testId]);
  return (
    <div className="h-64 w-full" data-testid={testId}>
      <FrequencyLineChart series={series} colours={colours} yLabel={yLabel} ariaLabel={`Plot of ${yLabel}, the two revisions overlaid`} layer={layer} />
    </div>
  );
}

function Plots({ older, newer }: { older: { label: string; result: AnalysisResult }; newer: { label: string; result: AnalysisResult } }) {
  const u = useUnits();
  const options = useMemo(() => [...new Set([...newer.result.sweep.series, ...older.result.sweep.series].map(caseKey))], [older, newer]);
  const [pick, setPick] = useState(0);
  const chosen = options[Math.min(pick, options.length - 1)] ?? "";
  const ranges = useMemo(() => (newer.result.sweep.operatingRangesHz ?? []).map((o) => ({ fromHz: o.fromHz, toHz: Math.max(o.toHz, o.fromHz), label: `${o.machine} ${o.rotor}` })), [newer]);
  // Each revision's natural frequencies as dashed lines in its curve's colour, labelled with the revision.
  const modes = useMemo(
    () =>
      [older, newer].flatMap((rev, r) =>
        rev.result.modes.map((m, i) => ({ hz: m.frequencyHz, label: `${rev.label}:f${i + 1}`, title: `revision ${rev.label}, natural frequency ${i + 1}: ${m.frequencyHz.toFixed(2)} Hz`, colour: colours[r] ?? "#2e3d46" })),
      ),
    [older, newer],
  );
  if (!options.length) return <p className="text-sm text-basalt-400">No rotor to plot.</p>;
  const both = (kind: "displacement" | "velocity"): Series[] =>
    [older, newer].map((rev) => {
      const values = envelope(rev.result, chosen, (s) => (kind === "displacement" ? s.displacementPeak : s.velocityPeak));
      return { id: `revision ${rev.label}`, data: rev.result.sweep.frequencyHz.map((f, i) => ({ x: f, y: u.toDisplayNumber(kind, values[i] ?? 0) })) };
    });
  const tr: Series[] = [older, newer].map((rev) => {
    const t = (rev.result.sweep.transmissibility ?? []).find((x) => caseKey(x) === chosen);
    return { id: `revision ${rev.label}`, data: rev.result.sweep.frequencyHz.map((f, i) => ({ x: f, y: t?.values[i] ?? 0 })) };
  });
  return (
    <div className="space-y-3">
      <label className="flex items-center gap-2 text-xs">
        <span className="field-label mb-0">Rotor and load case</span>
        <select className="field-input w-auto" value={pick} onChange={(e) => setPick(Number(e.target.value))}>
          {options.map((o, i) => (
            <option key={o} value={i}>
              {o}
            </option>
          ))}
        </select>
      </label>
      <div className="flex flex-wrap gap-3 text-2xs text-basalt-500">
        <span><span className="inline-block h-0.5 w-4 align-middle" style={{ background: colours[0] }} /> revision {older.label}</span>
        <span><span className="inline-block h-0.5 w-4 align-middle" style={{ background: colours[1] }} /> revision {newer.label}</span>
        <span><span className="inline-block h-2 w-4 bg-ochre-300 align-middle" /> operating speed range (revision {newer.label})</span>
        <span><span className="inline-block w-4 border-t border-dashed border-basalt-500 align-middle" /> natural frequencies, dashed in each revision&apos;s colour</span>
      </div>
      <div className="grid grid-cols-1 gap-4 2xl:grid-cols-2">
        <div>
          <p className="text-xs font-semibold">Displacement amplitude, largest over the points</p>
          <Overlay series={both("displacement")} ranges={ranges} modes={modes} yLabel={`peak (${u.unitLabel("displacement")})`} testId="compare-plot-displacement" />
        </div>
        <div>
          <p className="text-xs font-semibold">Velocity amplitude, largest over the points</p>
          <Overlay series={both("velocity")} ranges={ranges} modes={modes} yLabel={`peak (${u.unitLabel("velocity")})`} testId="compare-plot-velocity" />
        </div>
        <div>
          <p className="text-xs font-semibold">Transmissibility</p>
          <Overlay series={tr} ranges={ranges} modes={modes} yLabel="TR" testId="compare-plot-transmissibility" />
        </div>
      </div>
    </div>
  );
}

/** The frequency responses of two revisions drawn over each other. */
export function ComparePlots(props: { older: { label: string; result: AnalysisResult }; newer: { label: string; result: AnalysisResult }; units: UnitSystem }) {
  return (
    <UnitsProvider initial={props.units}>
      <Plots older={props.older} newer={props.newer} />
    </UnitsProvider>
  );
}
