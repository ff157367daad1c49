// Frequency-response curves of a revision as SVG: the largest displacement (or velocity)
// component over every point and load case of each rotor across the sweep, on a
// logarithmic amplitude axis, with each rotor's operating range, the avoidance band
// around every natural frequency (the separation criterion), the natural frequencies and
// the limit drawn on it. Pure: result in, SVG text out; units as the package shows them.
import { CRITERIA_DEFAULTS, type AnalysisResult } from "@/modules/calc";
import { formatSignificant, type UnitSystemKey } from "@/modules/units";
import { packageUnit, toPackageUnit } from "../package-units";
import { esc, n2, svgDocument } from "./svg";

export type ResponseQuantity = "displacement" | "velocity";

const COLOURS = ["#1f5f8b", "#b8432f", "#3f8a4a", "#8f650f", "#6a4c93", "#2e3d46"];

/** Each rotor's envelope over its points and load cases, in SI. */
export function rotorEnvelopes(result: AnalysisResult, quantity: ResponseQuantity): { label: string; values: number[] }[] {
  const out = new Map<string, number[]>();
  for (const s of result.sweep.series) {
    const key = `${s.machine} ${s.rotor}`;
    const v = quantity === "displacement" ? s.displacementPeak : s.velocityPeak;
    const cur = out.get(key) ?? new Array<number>(v.length).fill(0);
    v.forEach((x, i) => {
      if (x > (cur[i] ?? 0)) cur[i] = x;
    });
    out.set(key, cur);
  }
  return [...out].map(([label, values]) => ({ label, values }));
}

export function frequencyResponseSvg(result: AnalysisResult, quantity: ResponseQuantity, system: UnitSystemKey): string {
  const W = 900;
  const H = 420;
  const left = 78;
  const right = 20;
  const top = 40;
  const bottom = 56;
  const f = result.sweep.frequencyHz;
  const curves = rotorEnvelopes(result, quantity).map((c) => ({ ...c, shown: c.values.map((v) => toPackageUnit(quantity, v, system)) }));
  const limitSi = quantity === "displacement" ? (result.criteria?.maxDisplacementPeak?.value ?? CRITERIA_DEFAULTS.maxDisplacementPeak.value) : (result.criteria?.maxVelocityPeak?.value ?? CRITERIA_DEFAULTS.maxVelocityPeak.value);
  const limit = toPackageUnit(quantity, limitSi, system);
  const positive = [...curves.flatMap((c) => c.shown), limit].filter((v) => v > 0 && Number.isFinite(v));
  const fMin = f[0] ?? 0;
  const fMax = f.at(-1) ?? 1;
  const yMaxLog = Math.ceil(Math.log10(Math.max(...positive, 1e-12)));
  const yMinLog = Math.max(yMaxLog - 5, Math.floor(Math.log10(Math.min(...positive, 10 ** (yMaxLog - 1)))));
  const X = (hz: number) => left + ((hz - fMin) / Math.max(fMax - fMin, 1e-9)) * (W - left - right);
  const Y = (v: number) => {
    const lv = Math.log10(Math.max(v, 10 ** yMinLog));
    return top + ((yMaxLog - lv) / Math.max(yMaxLog - yMinLog, 1)) * (H - top - bottom);
  };
  const unit = packageUnit(quantity, system).symbol;
  const parts: string[] = [];
  // Avoidance bands, then operating ranges, under the curves.
  for (const b of result.sweep.avoidanceBandsHz ?? []) {
    const x0 = X(Math.max(b.fromHz, fMin));
    const x1 = X(Math.min(b.toHz, fMax));
    if (x1 > x0) parts.push(`<rect x="${n2(x0)}" y="${top}" width="${n2(x1 - x0)}" height="${H - top - bottom}" fill="#b8432f" fill-opacity="0.10"/>`);
  }
  for (const o of result.sweep.operatingRangesHz ?? []) {
    const x0 = X(o.fromHz);
    const x1 = X(o.toHz);
    parts.push(`<rect x="${n2(x0)}" y="${top}" width="${n2(Math.max(x1 - x0, 2))}" height="${H - top - bottom}" fill="#1f5f8b" fill-opacity="0.18"/>`);
    parts.push(`<line x1="${n2(X(o.ratedHz))}" x2="${n2(X(o.ratedHz))}" y1="${top}" y2="${H - bottom}" stroke="#1f5f8b" stroke-width="1.5"/>`);
  }
  // Grid: decades on the amplitude axis, round frequencies on the other.
  for (let e = yMinLog; e <= yMaxLog; e++) {
    const y = Y(10 ** e);
    parts.push(`<line x1="${left}" x2="${W - right}" y1="${n2(y)}" y2="${n2(y)}" stroke="#d7dde0" stroke-width="1"/>`);
    parts.push(`<text x="${left - 6}" y="${n2(y + 4)}" font-size="12" text-anchor="end" fill="#2e3d46">${esc(formatSignificant(10 ** e))}</text>`);
  }
  const step = [1, 2, 5, 10, 20, 50, 100].find((s) => (fMax - fMin) / s <= 12) ?? 200;
  for (let hz = Math.ceil(fMin / step) * step; hz <= fMax + 1e-9; hz += step) {
    parts.push(`<line x1="${n2(X(hz))}" x2="${n2(X(hz))}" y1="${top}" y2="${H - bottom}" stroke="#eef1f2" stroke-width="1"/>`);
    parts.push(`<text x="${n2(X(hz))}" y="${H - bottom + 16}" font-size="12" text-anchor="middle" fill="#2e3d46">${esc(formatSignificant(hz))}</text>`);
  }
  // Natural frequencies.
  result.modes.forEach((m, i) => {
    if (m.frequencyHz < fMin || m.frequencyHz > fMax) return;
    const x = X(m.frequencyHz);
    parts.push(`<line x1="${n2(x)}" x2="${n2(x)}" y1="${top}" y2="${H - bottom}" stroke="#b8432f" stroke-dasharray="4 3" stroke-width="1"/>`);
    parts.push(`<text x="${n2(x + 2)}" y="${top + 12 + (i % 3) * 12}" font-size="11" fill="#b8432f">f${i + 1}</text>`);
  });
  // The limit.
  if (limit > 0) {
    parts.push(`<line x1="${left}" x2="${W - right}" y1="${n2(Y(limit))}" y2="${n2(Y(limit))}" stroke="#2e3d46" stroke-dasharray="8 4" stroke-width="1.5"/>`);
    parts.push(`<text x="${W - right - 4}" y="${n2(Y(limit) - 5)}" font-size="12" text-anchor="end" fill="#2e3d46">limit ${esc(formatSignificant(limit))} ${esc(unit)}</text>`);
  }
  curves.forEach((c, i) => {
    const d = c.shown.map((v, j) => `${j === 0 ? "M" : "L"}${n2(X(f[j] ?? fMin))} ${n2(Y(v))}`).join(" ");
    parts.push(`<path d="${d}" fill="none" stroke="${COLOURS[i % COLOURS.length]}" stroke-width="1.8"/>`);
  });
  // Axes, titles and the legend.
  parts.push(`<rect x="${left}" y="${top}" width="${W - left - right}" height="${H - top - bottom}" fill="none" stroke="#647d88"/>`);
  const title = `${quantity === "displacement" ? "Largest displacement" : "Largest velocity"} over points and load cases [${unit}] against frequency [Hz]`;
  parts.push(`<text x="${left}" y="22" font-size="15" font-weight="600" fill="#1f2a33">${esc(title)}</text>`);
  parts.push(`<text x="${W - right}" y="${H - 12}" font-size="12" text-anchor="end" fill="#2e3d46">frequency [Hz]</text>`);
  const legend = [
    ...curves.map((c, i) => ({ swatch: `<line x1="0" x2="18" y1="0" y2="0" stroke="${COLOURS[i % COLOURS.length]}" stroke-width="2"/>`, text: c.label })),
    { swatch: `<rect x="0" y="-6" width="18" height="10" fill="#1f5f8b" fill-opacity="0.18"/>`, text: "operating range" },
    { swatch: `<rect x="0" y="-6" width="18" height="10" fill="#b8432f" fill-opacity="0.10"/>`, text: "avoidance band" },
  ];
  let lx = left;
  for (const l of legend) {
    parts.push(`<g transform="translate(${n2(lx)} ${H - 30})">${l.swatch}<text x="22" y="4" font-size="11" fill="#2e3d46">${esc(l.text)}</text></g>`);
    lx += 30 + l.text.length * 6.2;
  }
  return svgDocument(W, H, parts.join(""), title);
}
