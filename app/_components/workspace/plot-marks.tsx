"use client";

import { placeAxisLabels } from "@/modules/desk/plot-labels";

// What the frequency-response plots draw under and over their curves: the operating speed
// ranges, the separation band around each natural frequency, the natural frequencies across
// the soil band (all light, so curves stay readable), the natural frequencies as dashed lines,
// and labels that never print over each other (see modules/desk/plot-labels.ts).

export interface FrequencyBand {
  fromHz: number;
  toHz: number;
}
export interface OperatingBand extends FrequencyBand {
  label: string;
}
export interface ModeMark {
  hz: number;
  label: string;
  title: string;
  colour: string;
}

export const OPERATING_COLOUR = "#d49a1e";
const OPERATING_TEXT = "#8f650f";
const AVOID_COLOUR = "#b8432f";
const SOIL_COLOUR = "#647d88";
export const MODE_COLOUR = "#2e3d46";

const ROW_PX = 10;

export function FrequencyMarks({
  x,
  innerWidth,
  innerHeight,
  operating,
  avoidance = [],
  soil = [],
  modes = [],
  idPrefix,
}: {
  x: (hz: number) => number;
  innerWidth: number;
  innerHeight: number;
  operating: OperatingBand[];
  avoidance?: FrequencyBand[];
  soil?: FrequencyBand[];
  modes?: ModeMark[];
  idPrefix: string;
}) {
  const inside = (px: number) => Number.isFinite(px) && px >= 0 && px <= innerWidth;
  const width = (b: FrequencyBand) => Math.max(1, x(b.toHz) - x(b.fromHz));
  const opLabels = placeAxisLabels(operating.filter((b) => inside(x(b.fromHz))).map((b) => ({ x: x(b.fromHz), text: b.label })));
  const shownModes = modes.filter((m) => inside(x(m.hz)));
  const modeLabels = placeAxisLabels(shownModes.map((m) => ({ x: x(m.hz), text: m.label })));
  const hatch = `${idPrefix}-avoid-hatch`;
  return (
    <g>
      <defs>
        <pattern id={hatch} width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="6" stroke={AVOID_COLOUR} strokeWidth="1" opacity="0.18" />
        </pattern>
      </defs>
      {soil.map((b, i) => (
        <rect key={`s${i}`} x={x(b.fromHz)} width={width(b)} y={0} height={innerHeight} fill={SOIL_COLOUR} opacity={0.07} data-testid="soil-band" />
      ))}
      {avoidance.map((b, i) => (
        <rect key={`a${i}`} x={x(b.fromHz)} width={width(b)} y={0} height={innerHeight} fill={`url(#${hatch})`} data-testid="separation-band" />
      ))}
      {operating.map((b, i) => (
        <g key={`o${i}`} data-testid="operating-band">
          <rect x={x(b.fromHz)} width={Math.max(2, x(b.toHz) - x(b.fromHz))} y={0} height={innerHeight} fill={OPERATING_COLOUR} opacity={0.12} />
          {/* Edges drawn firmly so a fixed-speed machine (a range of zero width) is still seen. */}
          <line x1={x(b.fromHz)} x2={x(b.fromHz)} y1={0} y2={innerHeight} stroke={OPERATING_COLOUR} strokeWidth={1} opacity={0.6} />
          {b.toHz > b.fromHz ? <line x1={x(b.toHz)} x2={x(b.toHz)} y1={0} y2={innerHeight} stroke={OPERATING_COLOUR} strokeWidth={1} opacity={0.6} /> : null}
        </g>
      ))}
      {shownModes.map((m, i) => (
        <line key={`m${i}`} x1={x(m.hz)} x2={x(m.hz)} y1={0} y2={innerHeight} stroke={m.colour} strokeWidth={1} strokeDasharray="3 3" opacity={0.75} data-testid="mode-line">
          <title>{m.title}</title>
        </line>
      ))}
      {opLabels.map((l) => (
        <text key={`ol${l.x}-${l.text}`} x={l.x + 3} y={10 + l.row * ROW_PX} fontSize={9} fill={OPERATING_TEXT} data-testid="operating-label">
          {l.text}
        </text>
      ))}
      {modeLabels.map((l) => (
        <text key={`ml${l.x}-${l.text}`} x={l.x + 2} y={innerHeight - 3 - l.row * ROW_PX} fontSize={9} fill={MODE_COLOUR} data-testid="mode-label">
          {l.text}
        </text>
      ))}
    </g>
  );
}

/** Which curve is which: a swatch in the curve's colour and its name, under the plot. */
export function CurveLegend({ items, testId }: { items: { id: string; colour: string }[]; testId?: string }) {
  if (!items.length) return null;
  return (
    <ul className="mt-1 flex flex-wrap gap-x-3 gap-y-0.5 text-2xs text-basalt-600" data-testid={testId ?? "curve-legend"} aria-label="Curves">
      {items.map((it) => (
        <li key={it.id} className="flex items-center gap-1">
          <span aria-hidden className="inline-block h-0.5 w-4" style={{ background: it.colour }} />
          <span>{it.id}</span>
        </li>
      ))}
    </ul>
  );
}
