"use client";

import { memo, useMemo, useState } from "react";
import type { AnalysisResult } from "@/modules/calc";
import { cutoffMarkers } from "@/modules/desk/soil-factors";
import { Explain } from "./explain";
import { FrequencyLineChart, sweepCaseKey, type FrequencyLayer, type FrequencySeries } from "./frequency-line-chart";
import { CurveLegend, FrequencyMarks, MODE_COLOUR, type FrequencyBand, type ModeMark, type OperatingBand } from "./plot-marks";
import { useUnits } from "./units-context";

type Series = FrequencySeries;

const palette = ["#2e3d46", "#d49a1e", "#3f8a4a", "#b8432f", "#647d88", "#8f650f", "#2b6233", "#84291b"];

interface Bands {
  operating: OperatingBand[];
  avoidance: FrequencyBand[];
  soil: FrequencyBand[];
  modes: ModeMark[];
  /** Stratum cutoff frequencies: no radiation damping below them. */
  cutoffs: { hz: number; label: string }[];
}

function bandLayer(bands: Bands, idPrefix: string): FrequencyLayer {
  // Drawn under the curves: operating speed range (ochre), the band each natural frequency
  // must keep clear of (brick hatch), where the natural frequencies move within the soil band
  // (slate), and the natural frequencies themselves as dashed lines.
  function BandLayer({ xScale, innerWidth, innerHeight }: Parameters<FrequencyLayer>[0]) {
    const x = (v: number) => xScale(v as never);
    return (
      <g>
        <FrequencyMarks x={x} innerWidth={innerWidth} innerHeight={innerHeight} idPrefix={idPrefix} {...bands} />
        {bands.cutoffs.map((c, i) => (
          <g key={`c${i}`} data-testid="cutoff-marker">
            <line x1={x(c.hz)} x2={x(c.hz)} y1={0} y2={innerHeight} stroke="#2b6233" strokeWidth={1.2} strokeDasharray="4 3" />
            <text x={x(c.hz) + 3} y={24 + 11 * i} fontSize={9} fill="#2b6233">
              {c.label}
            </text>
          </g>
        ))}
      </g>
    );
  }
  return BandLayer;
}

function Plot({ series, bands, yLabel, testId }: { series: Series[]; bands: Bands; yLabel: string; testId: string }) {
  const layer = useMemo(() => bandLayer(bands, testId), [bands, testId]);
  return (
    <div data-testid={testId}>
      <div className="h-64 w-full">
        <FrequencyLineChart
          series={series}
          colours={palette}
          yLabel={yLabel}
          ariaLabel={`Plot of ${yLabel} against frequency: ${series.map((s) => String(s.id)).join(", ")}, with the operating ranges and natural frequencies marked`}
          layer={layer}
        />
      </div>
      <CurveLegend items={series.map((s, i) => ({ id: s.id, colour: palette[i % palette.length] ?? MODE_COLOUR }))} testId={`${testId}-legend`} />
    </div>
  );
}

const dofWords: Record<string, string> = { x: "sliding along x", y: "sliding along y", z: "vertical", rx: "rocking about x", ry: "rocking about y", rz: "torsion about z" };

/** Memoised: it re-renders only for a new result (the workspace hands it a deferred one, see foundation-workspace.tsx). */
export const ResponsePlots = memo(function ResponsePlots({ result }: { result: AnalysisResult }) {
  const u = useUnits();
  const sw = result.sweep;
  const options = useMemo(() => {
    const keys = new Set<string>();
    for (const s of sw.series) keys.add(sweepCaseKey(s));
    return [...keys];
  }, [sw.series]);
  const [pick, setPick] = useState(0);
  const chosen = options[Math.min(pick, options.length - 1)] ?? "";
  const bands: Bands = useMemo(() => {
    const lower = result.bounds?.lower.frequenciesHz ?? [];
    const upper = result.bounds?.upper.frequenciesHz ?? [];
    return {
      operating: (sw.operatingRangesHz ?? []).map((o) => ({ fromHz: o.fromHz, toHz: Math.max(o.toHz, o.fromHz), label: `${o.machine} ${o.rotor}` })),
      avoidance: sw.avoidanceBandsHz ?? [],
      soil: lower.map((l, i) => ({ fromHz: Math.min(l, upper[i] ?? l), toHz: Math.max(l, upper[i] ?? l) })),
      modes: result.modes.map((m, i) => ({
        hz: m.frequencyHz,
        label: `f${i + 1}`,
        title: `natural frequency ${i + 1}: ${m.frequencyHz.toFixed(2)} Hz, mostly ${dofWords[m.dominant] ?? m.dominant}`,
        colour: MODE_COLOUR,
      })),
      cutoffs: cutoffMarkers(result.impedance),
    };
  }, [sw, result.bounds, result.modes, result.impedance]);
  const picked = sw.series.filter((s) => sweepCaseKey(s) === chosen);
  const toSeries = (values: (s: (typeof picked)[number]) => number[], kind: "displacement" | "velocity"): Series[] =>
    picked.map((s) => ({ id: s.point, data: sw.frequencyHz.map((f, i) => ({ x: f, y: u.toDisplayNumber(kind, values(s)[i] ?? 0) })) }));
  const [machine, rotor, rest] = chosen.split(" · ");
  const tr = (sw.transmissibility ?? []).filter((t) => t.machine === machine && t.rotor === rotor && rest?.startsWith(t.case) && rest.includes(t.unbalanceMode));
  const trSeries: Series[] = tr.map((t) => ({ id: "transmissibility", data: sw.frequencyHz.map((f, i) => ({ x: f, y: t.values[i] ?? 0 })) }));
  if (!options.length) return <p className="text-sm text-basalt-400">No rotor to plot.</p>;
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
        <span><span className="inline-block h-2 w-4 bg-ochre-300 align-middle" /> operating speed range</span>
        <span><span className="inline-block h-2 w-4 border border-brick-500 align-middle" /> separation band around each natural frequency</span>
        <span><span className="inline-block h-2 w-4 bg-basalt-200 align-middle" /> natural frequencies across the soil band</span>
        <span><span className="inline-block w-4 border-t border-dashed border-basalt-700 align-middle" /> natural frequency f1 … f6 (hover for the mode)</span>
        {bands.cutoffs.length ? (
          <span><span className="inline-block h-0 w-4 border-t border-dashed border-moss-700 align-middle" /> stratum cutoffs: no radiation damping below them</span>
        ) : null}
      </div>
      <div className="grid grid-cols-1 gap-4 2xl:grid-cols-2">
        <div>
          <p className="text-xs font-semibold">Displacement amplitude (largest axis) at each point</p>
          <Plot series={toSeries((s) => s.displacementPeak, "displacement")} bands={bands} yLabel={`peak (${u.unitLabel("displacement")})`} testId="plot-displacement" />
        </div>
        <div>
          <p className="text-xs font-semibold">Velocity amplitude (largest axis) at each point</p>
          <Plot series={toSeries((s) => s.velocityPeak, "velocity")} bands={bands} yLabel={`peak (${u.unitLabel("velocity")})`} testId="plot-velocity" />
        </div>
        <div>
          <p className="text-xs font-semibold">Transmissibility (soil force / exciting force)</p>
          <Plot series={trSeries} bands={bands} yLabel="TR" testId="plot-transmissibility" />
        </div>
      </div>
      <Explain
        method="The damped harmonic steady state repeated at every sweep frequency with the unbalance force scaled with ω²; the curves are the largest axis of the peak amplitude."
        formula="(K(ω)(1 + 2iβ) + iωC − ω²M) u(ω) = F(ω), F ∝ ω²"
        source="Harmonic response as in Chopra, Dynamics of Structures; separation band after common practice discussed in ACI 351.3R"
        inputs={[
          ["sweep", `${sw.frequencyHz[0]?.toFixed(2)} – ${sw.frequencyHz[sw.frequencyHz.length - 1]?.toFixed(2)} Hz, ${sw.frequencyHz.length} points`],
        ]}
      />
    </div>
  );
});
