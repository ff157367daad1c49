"use client";

import { ResponsiveLine, type LineCustomSvgLayerProps, type LineSeries } from "@nivo/line";
import type { FunctionComponent } from "react";

/** A curve against frequency: x in Hz, y already in display units. */
export type FrequencySeries = LineSeries & { id: string; data: { x: number; y: number }[] };

/** Draws under the curves (bands, natural frequencies): nivo's custom layer. */
export type FrequencyLayer = FunctionComponent<LineCustomSvgLayerProps<FrequencySeries>>;

/** The rotor, load case and unbalance mode a sweep series belongs to, as the plots' picker names it. */
export function sweepCaseKey(s: { machine: string; rotor: string; case: string; unbalanceMode: string }): string {
  return `${s.machine} · ${s.rotor} · ${s.case} (${s.unbalanceMode})`;
}

/**
 * The curves, as nivo's own "lines" layer draws them with animate off (a path per series, the
 * first on top) but without its animated path: that one interpolates every new path string
 * against the previous one even when it does not animate (a parse of both strings of some
 * thousand numbers, per curve and result). Typing cost, issue 15 item 2.
 */
function PlainLines({ series, lineGenerator, lineWidth }: LineCustomSvgLayerProps<FrequencySeries>) {
  return (
    <>
      {series
        .slice(0)
        .reverse()
        .map((s) => (
          <path key={s.id} d={lineGenerator(s.data.map((d) => d.position)) ?? undefined} fill="none" strokeWidth={lineWidth} stroke={s.color} />
        ))}
    </>
  );
}

/**
 * The one frequency-response chart of the desk (workspace plots and the revision comparison):
 * linear axes from zero, the marks layer under the grid and curves, the desk's type and grid
 * colours, the y ticks at three significant figures.
 */
export function FrequencyLineChart(props: { series: FrequencySeries[]; colours: string[]; yLabel: string; ariaLabel: string; layer: FrequencyLayer }) {
  return (
    <ResponsiveLine
      data={props.series}
      ariaLabel={props.ariaLabel}
      margin={{ top: 12, right: 16, bottom: 40, left: 64 }}
      xScale={{ type: "linear", min: "auto", max: "auto" }}
      yScale={{ type: "linear", min: 0, max: "auto" }}
      curve="linear"
      colors={props.colours}
      lineWidth={1.6}
      enablePoints={false}
      enableGridX={false}
      useMesh
      animate={false}
      axisBottom={{ legend: "frequency (Hz)", legendOffset: 30, legendPosition: "middle", tickSize: 4 }}
      axisLeft={{ legend: props.yLabel, legendOffset: -54, legendPosition: "middle", tickSize: 4, format: (v) => Number(v).toPrecision(3) }}
      layers={[props.layer, "grid", "axes", PlainLines, "crosshair", "mesh", "legends"]}
      theme={{ text: { fontFamily: "var(--font-plex-sans)", fontSize: 10, fill: "#4a616c" }, grid: { line: { stroke: "#e3dfd6" } } }}
    />
  );
}
