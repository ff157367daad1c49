"use client";

import { ResponsiveLine, type LineCustomSvgLayerProps, type LineSeries } from "@nivo/line";
import { useMemo, useState } from "react";
import type { AnalysisResult } from "@/modules/calc";
import { cutoffMarkers } from "@/modules/desk/soil-factors";
import { Explain } from "./explain";
import { useUnits } from "./units-context";

type Series = LineSeries & { id: string; data: { x: number; y: number }[] };

const palette = ["#2e3d46", "#d49a1e", "#3f8a4a", "#b8432f", "#647d88", "#8f650f", "#2b6233", "#84291b"];

interface Bands {
  operating: { fromHz: number; toHz: number; label: string }[];
  avoidance: { fromHz: number; toHz: number }[];
  soil: { fromHz: number; toHz: number }[];
  /** Stratum cutoff frequencies: no radiation damping below them. */
  cutoffs: { hz: number; label: string }[];
}

function bandLayer(bands: Bands) {
  // Shading drawn under the curves: operating speed range (ochre), the band each
  // natural frequency must keep clear of (brick hatch), and where the natural
  // frequencies move within the soil band (slate).
  function BandLayer({ xScale, innerHeight }: LineCustomSvgLayerProps<Series>) {
    const x = (v: number) => xScale(v as never);
    return (
      <g>
        <defs>
          <pattern id="avoid-hatch" width="5" height="5" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <line x1="0" y1="0" x2="0" y2="5" stroke="#b8432f" strokeWidth="1" opacity="0.35" />
          </pattern>
        </defs>
        {bands.soil.map((b, i) => (
          <rect key={`s${i}`} x={x(b.fromHz)} width={Math.max(1, x(b.toHz) - x(b.fromHz))} y={0} height={innerHeight} fill="#647d88" opacity={0.12} />
        ))}
        {bands.avoidance.map((b, i) => (
          <rect key={`a${i}`} x={x(b.fromHz)} width={Math.max(1, x(b.toHz) - x(b.fromHz))} y={0} height={innerHeight} fill="url(#avoid-hatch)" />
        ))}
        {bands.cutoffs.map((c, i) => (
          <g key={`c${i}`} data-testid="cutoff-marker">
            <line x1={x(c.hz)} x2={x(c.hz)} y1={0} y2={innerHeight} stroke="#2b6233" strokeWidth={1.2} strokeDasharray="4 3" />
            <text x={x(c.hz) + 3} y={24 + 11 * i} fontSize={9} fill="#2b6233">
              {c.label}
            </text>
          </g>
        ))}
        {bands.operating.map((b, i) => (
          <g key={`o${i}`}>
            <rect x={x(b.fromHz)} width={Math.max(2, x(b.toHz) - x(b.fromHz))} y={0} height={innerHeight} fill="#d49a1e" opacity={0.25} />
            <text x={x(b.fromHz) + 3} y={12} fontSize={9} fill="#8f650f">
              {b.label}
            </text>
          </g>
        ))}
      </g>
    );
  }
  return BandLayer;
}

function Plot({ series, bands, yLabel, testId }: { series: Series[]; bands: Bands; yLabel: string; testId: string }) {
  const layer = useMemo(() => bandLayer(bands), [bands]);
  return (
    <div className="h-64 w-full" data-testid={testId}>
      <ResponsiveLine
        data={series}
        margin={{ top: 12, right: 16, bottom: 40, left: 64 }}
        xScale={{ type: "linear", min: "auto", max: "auto" }}
        yScale={{ type: "linear", min: 0, max: "auto" }}
        curve="linear"
        colors={palette}
        lineWidth={1.6}
        enablePoints={false}
        enableGridX={false}
        useMesh
        animate={false}
        axisBottom={{ legend: "frequency (Hz)", legendOffset: 30, legendPosition: "middle", tickSize: 4 }}
        axisLeft={{ legend: yLabel, legendOffset: -54, legendPosition: "middle", tickSize: 4, format: (v) => Number(v).toPrecision(3) }}
        layers={[layer, "grid", "axes", "lines", "crosshair", "mesh", "legends"]}
        theme={{ text: { fontFamily: "var(--font-plex-sans)", fontSize: 10, fill: "#4a616c" }, grid: { line: { stroke: "#e3dfd6" } } }}
      />
    </div>
  );
}

export function ResponsePlots({ result }: { result: AnalysisResult }) {
  const u = useUnits();
  const sw = result.sweep;
  const options = useMemo(() => {
    const keys = new Set<string>();
    for (const s of sw.series) keys.add(`${s.machine} · ${s.rotor} · ${s.case} (${s.unbalanceMode})`);
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
      cutoffs: cutoffMarkers(result.impedance),
    };
  }, [sw, result.bounds, result.impedance]);
  const picked = sw.series.filter((s) => `${s.machine} · ${s.rotor} · ${s.case} (${s.unbalanceMode})` === chosen);
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
}
