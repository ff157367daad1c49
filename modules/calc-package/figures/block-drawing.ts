// Plan (x-y) and elevation (x-z) of the block to scale as SVG, from the revision's input as
// issued: solids hatched, voids dashed, machines' centres of gravity, bearings, check points
// and the combined centre of gravity, with the overall dimensions in the package's units.
// The same drawing as the desk's (app/_components/workspace/block-drawing.tsx), written
// from the contract's input instead of the form, so the server can render it.
import type { AnalysisInput, MassPropertiesResult } from "@/modules/calc";
import { formatSignificant, type UnitSystemKey } from "@/modules/units";
import { packageUnit, toPackageUnit } from "../package-units";
import { esc, n2, svgDocument } from "./svg";

type View = "plan" | "elevation";

interface Mark {
  a: number;
  b: number;
  kind: "machine" | "bearing" | "check";
  label: string;
}

function viewOf(input: AnalysisInput, view: View) {
  const pick = (p: readonly number[]) => (view === "plan" ? p[1] : p[2]) ?? 0;
  const rects = input.block.solids.map((s) => ({ a0: Math.min(...s.x), a1: Math.max(...s.x), b0: Math.min(...(view === "plan" ? s.y : s.z)), b1: Math.max(...(view === "plan" ? s.y : s.z)), isVoid: s.void ?? false, name: s.name }));
  const marks: Mark[] = [];
  for (const m of input.machines) {
    marks.push({ a: m.cg[0], b: pick(m.cg), kind: "machine", label: m.name });
    for (const r of m.rotors) r.bearings.forEach((p, i) => marks.push({ a: p[0], b: pick(p), kind: "bearing", label: `${r.name} B${i + 1}` }));
  }
  for (const c of input.checkPoints ?? []) marks.push({ a: c.position[0], b: pick(c.position), kind: "check", label: c.name });
  return { rects, marks };
}

function oneView(input: AnalysisInput, view: View, mass: MassPropertiesResult | undefined, system: UnitSystemKey, W: number, H: number, offsetY: number): string {
  const { rects, marks } = viewOf(input, view);
  const solids = rects.filter((r) => !r.isVoid);
  const as = [...solids.flatMap((r) => [r.a0, r.a1]), ...marks.map((m) => m.a)];
  const bs = [...solids.flatMap((r) => [r.b0, r.b1]), ...marks.map((m) => m.b)];
  const aMin = Math.min(...as);
  const aMax = Math.max(...as);
  const bMin = Math.min(...bs);
  const bMax = Math.max(...bs);
  const pad = 60;
  // One scale for both axes: the drawing is to scale.
  const s = Math.min((W - 2 * pad) / Math.max(aMax - aMin, 1e-3), (H - 2 * pad) / Math.max(bMax - bMin, 1e-3));
  const ox = pad + (W - 2 * pad - (aMax - aMin) * s) / 2;
  const oy = offsetY + H - pad - (H - 2 * pad - (bMax - bMin) * s) / 2;
  const X = (a: number) => ox + (a - aMin) * s;
  const Y = (b: number) => oy - (b - bMin) * s;
  const len = (m: number) => `${formatSignificant(toPackageUnit("length", m, system))} ${packageUnit("length", system).symbol}`;
  const p: string[] = [];
  p.push(`<text x="12" y="${offsetY + 22}" font-size="15" font-weight="600" fill="#1f2a33">${view === "plan" ? "Plan (x right, y up), to scale" : "Elevation (x right, z up), to scale"}</text>`);
  if (view === "elevation") p.push(`<line x1="8" x2="${W - 8}" y1="${n2(Y(0))}" y2="${n2(Y(0))}" stroke="#8ea2ab" stroke-dasharray="4 3"/>`);
  for (const r of rects) {
    p.push(
      `<rect x="${n2(X(r.a0))}" y="${n2(Y(r.b1))}" width="${n2((r.a1 - r.a0) * s)}" height="${n2((r.b1 - r.b0) * s)}" fill="${r.isVoid ? "#faf9f7" : `url(#hatch-${view})`}" stroke="${r.isVoid ? "#b8432f" : "#3a4d57"}" stroke-width="1.4"${r.isVoid ? ' stroke-dasharray="5 3"' : ""}/>`,
    );
  }
  for (const m of marks) {
    if (m.kind === "machine") {
      p.push(`<circle cx="${n2(X(m.a))}" cy="${n2(Y(m.b))}" r="6" fill="#d49a1e" stroke="#8f650f"/>`);
      p.push(`<text x="${n2(X(m.a) + 9)}" y="${n2(Y(m.b) - 8)}" font-size="12" fill="#8f650f">${esc(m.label)}</text>`);
    } else if (m.kind === "bearing") {
      p.push(`<rect x="${n2(X(m.a) - 4)}" y="${n2(Y(m.b) - 4)}" width="8" height="8" fill="#2e3d46"/>`);
    } else {
      p.push(`<path d="M ${n2(X(m.a))} ${n2(Y(m.b) - 6)} l 6 10 l -12 0 z" fill="#3f8a4a"/>`);
    }
  }
  const cgA = mass?.cg[0];
  const cgB = mass ? (view === "plan" ? mass.cg[1] : mass.cg[2]) : undefined;
  if (cgA !== undefined && cgB !== undefined) {
    const cx = X(cgA);
    const cy = Y(cgB);
    p.push(`<circle cx="${n2(cx)}" cy="${n2(cy)}" r="8" fill="none" stroke="#b8432f" stroke-width="1.8"/><line x1="${n2(cx - 12)}" x2="${n2(cx + 12)}" y1="${n2(cy)}" y2="${n2(cy)}" stroke="#b8432f"/><line x1="${n2(cx)}" x2="${n2(cx)}" y1="${n2(cy - 12)}" y2="${n2(cy + 12)}" stroke="#b8432f"/>`);
  }
  const sa0 = Math.min(...solids.map((r) => r.a0));
  const sa1 = Math.max(...solids.map((r) => r.a1));
  const sb0 = Math.min(...solids.map((r) => r.b0));
  const sb1 = Math.max(...solids.map((r) => r.b1));
  const yDim = offsetY + H - 22;
  p.push(`<g stroke="#647d88"><line x1="${n2(X(sa0))}" x2="${n2(X(sa1))}" y1="${yDim}" y2="${yDim}"/><line x1="${n2(X(sa0))}" x2="${n2(X(sa0))}" y1="${yDim - 5}" y2="${yDim + 5}"/><line x1="${n2(X(sa1))}" x2="${n2(X(sa1))}" y1="${yDim - 5}" y2="${yDim + 5}"/>`);
  p.push(`<line x1="24" x2="24" y1="${n2(Y(sb0))}" y2="${n2(Y(sb1))}"/><line x1="19" x2="29" y1="${n2(Y(sb0))}" y2="${n2(Y(sb0))}"/><line x1="19" x2="29" y1="${n2(Y(sb1))}" y2="${n2(Y(sb1))}"/></g>`);
  p.push(`<text x="${n2((X(sa0) + X(sa1)) / 2)}" y="${yDim - 6}" font-size="12" text-anchor="middle" fill="#2e3d46">${esc(len(sa1 - sa0))}</text>`);
  p.push(`<text x="30" y="${n2((Y(sb0) + Y(sb1)) / 2)}" font-size="12" fill="#2e3d46">${esc(len(sb1 - sb0))}</text>`);
  return p.join("");
}

/** Plan above elevation, one SVG. */
export function blockDrawingSvg(input: AnalysisInput, mass: MassPropertiesResult | undefined, system: UnitSystemKey): string {
  const W = 900;
  const H = 380;
  const defs = (["plan", "elevation"] as const)
    .map((v) => `<pattern id="hatch-${v}" width="7" height="7" patternUnits="userSpaceOnUse" patternTransform="rotate(45)"><line x1="0" y1="0" x2="0" y2="7" stroke="#a99f8c" stroke-width="1"/></pattern>`)
    .join("");
  const legend = `<g font-size="11" fill="#2e3d46" transform="translate(12 ${2 * H + 18})"><circle cx="6" cy="-4" r="5" fill="#d49a1e"/><text x="16">machine centre of gravity</text><rect x="190" y="-8" width="8" height="8" fill="#2e3d46"/><text x="204">bearing</text><path d="M 270 -10 l 6 10 l -12 0 z" fill="#3f8a4a"/><text x="282">check point</text><circle cx="380" cy="-4" r="6" fill="none" stroke="#b8432f" stroke-width="1.6"/><text x="392">combined centre of gravity</text><rect x="580" y="-9" width="18" height="10" fill="#faf9f7" stroke="#b8432f" stroke-dasharray="4 2"/><text x="604">void</text></g>`;
  return svgDocument(W, 2 * H + 30, `<defs>${defs}</defs>${oneView(input, "plan", mass, system, W, H, 0)}${oneView(input, "elevation", mass, system, W, H, H)}${legend}`, "Plan and elevation of the block to scale");
}
