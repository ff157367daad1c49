"use client";

import type { DraftForm } from "@/modules/desk/draft-form";
import type { MassPropertiesResult } from "@/modules/calc";
import { springsBaseOf, springsOf } from "@/modules/desk/spring-layout";

// Plan (x-y) and elevation (x-z) of the block to scale: boxes, voids, machines,
// bearings, check points and the combined centre of gravity, with overall
// dimensions, so that a wrong coordinate is seen at once. Method "piles": the piles
// under the cap to the same scale (plan: dashed circles of the diameter, hidden under
// the cap; elevation: the shafts down to their length), with a text list beside.
// Method "springs": each spring at its plan position to scale (the input gives no spring size, so
// the symbol's size is schematic and said so): plan, a circle with a cross, a square inside
// when the spring has a damper; elevation, a coil between the underside (z = 0) and the
// supporting floor, with a dashpot beside it when there is a damper; a text list beside. Springs
// on a base block: the base drawn to scale under the springs (plan and elevation), the coils
// down to its top face (their height is then the real spring height), the ground at its underside.

type View = "plan" | "elevation";

interface Rect {
  a0: number;
  a1: number;
  b0: number;
  b1: number;
  isVoid: boolean;
  name: string;
}

const ok = (n: unknown): n is number => typeof n === "number" && Number.isFinite(n);

function extents(form: DraftForm, view: View) {
  const rects: Rect[] = [];
  for (const s of form.block.solids) {
    const [x0, x1] = s.x;
    const [b0, b1] = view === "plan" ? s.y : s.z;
    if (ok(x0) && ok(x1) && ok(b0) && ok(b1)) rects.push({ a0: Math.min(x0, x1), a1: Math.max(x0, x1), b0: Math.min(b0, b1), b1: Math.max(b0, b1), isVoid: s.void, name: s.name });
  }
  const points: { a: number; b: number; kind: "machine" | "bearing" | "check"; label: string }[] = [];
  for (const m of form.machines) {
    const [x, y, z] = m.cg;
    const b = view === "plan" ? y : z;
    if (ok(x) && ok(b)) points.push({ a: x, b, kind: "machine", label: m.name });
    for (const r of m.rotors)
      r.bearings.forEach((p, i) => {
        const bb = view === "plan" ? p[1] : p[2];
        if (ok(p[0]) && ok(bb)) points.push({ a: p[0], b: bb, kind: "bearing", label: `${r.name} B${i + 1}` });
      });
  }
  for (const c of form.checkPoints) {
    const bb = view === "plan" ? c.position[1] : c.position[2];
    if (ok(c.position[0]) && ok(bb)) points.push({ a: c.position[0], b: bb, kind: "check", label: c.name });
  }
  const piles = pilesOf(form);
  const springs = springsOf(form);
  const solids = rects.filter((r) => !r.isVoid);
  // plan: circles about (x, y); elevation: shafts from z = 0 down to -L
  const pileA = piles ? piles.heads.flatMap((h) => [h.x - piles.d / 2, h.x + piles.d / 2]) : [];
  const pileB = piles ? (view === "plan" ? piles.heads.flatMap((h) => [h.y - piles.d / 2, h.y + piles.d / 2]) : [-piles.length]) : [];
  // springs: a schematic symbol (radius and height from the block's size, the input has none)
  const plainA = solids.flatMap((r) => [r.a0, r.a1]);
  const spanOfBlock = plainA.length ? Math.max(...plainA) - Math.min(...plainA) : 1;
  const springSymbol = { r: Math.max(spanOfBlock * 0.035, 1e-3), h: Math.max(spanOfBlock * 0.12, 1e-3) };
  const springA = springs ? springs.flatMap((sp) => [sp.x - springSymbol.r, sp.x + springSymbol.r]) : [];
  const springB = springs ? (view === "plan" ? springs.flatMap((sp) => [sp.y - springSymbol.r, sp.y + springSymbol.r]) : [-springSymbol.h]) : [];
  const sb = springs ? springsBaseOf(form) : null;
  const base = sb ? { a0: sb.x[0], a1: sb.x[1], b0: view === "plan" ? sb.y[0] : sb.z[0], b1: view === "plan" ? sb.y[1] : sb.z[1], top: sb.z[1] } : null;
  const all = [...solids.flatMap((r) => [r.a0, r.a1]), ...points.map((p) => p.a), ...pileA, ...springA, ...(base ? [base.a0, base.a1] : [])];
  const allB = [...solids.flatMap((r) => [r.b0, r.b1]), ...points.map((p) => p.b), ...pileB, ...(base ? [base.b0, base.b1] : springB)];
  return { rects, points, solids, piles, springs, springSymbol, base, aMin: Math.min(...all), aMax: Math.max(...all), bMin: Math.min(...allB), bMax: Math.max(...allB) };
}

/** The piles of method "piles" with every number present (heads with a blank coordinate are left out). */
export function pilesOf(form: DraftForm): { heads: { x: number; y: number }[]; d: number; length: number } | null {
  const p = form.impedance.method === "piles" ? form.impedance.piles : undefined;
  if (!p || !ok(p.diameter) || !ok(p.length) || p.diameter <= 0 || p.length <= 0) return null;
  const heads = p.heads.flatMap((h) => (ok(h.x) && ok(h.y) ? [{ x: h.x, y: h.y }] : []));
  return heads.length ? { heads, d: p.diameter, length: p.length } : null;
}

/** A coil from (x, top) down to (x, bottom) of half-width w, in screen units. */
function coilPath(x: number, top: number, bottom: number, w: number): string {
  const turns = 5;
  const lead = (bottom - top) * 0.12;
  const step = (bottom - top - 2 * lead) / (2 * turns);
  let d = `M ${x} ${top} L ${x} ${top + lead}`;
  for (let i = 0; i < 2 * turns; i++) d += ` L ${x + (i % 2 === 0 ? w : -w)} ${top + lead + (i + 0.5) * step}`;
  return `${d} L ${x} ${bottom - lead} L ${x} ${bottom}`;
}

function fmtLen(m: number, toDisplay: (m: number) => string): string {
  return toDisplay(m);
}

function OneView({ form, view, cg, formatLength }: { form: DraftForm; view: View; cg?: [number, number, number]; formatLength: (m: number) => string }) {
  const e = extents(form, view);
  if (!e.solids.length || !Number.isFinite(e.aMin) || !Number.isFinite(e.bMin)) {
    return <p className="text-sm text-basalt-400">Enter a box with all six coordinates to see the {view}.</p>;
  }
  const W = 460;
  const H = 260;
  const pad = 42;
  const spanA = Math.max(e.aMax - e.aMin, 1e-3);
  const spanB = Math.max(e.bMax - e.bMin, 1e-3);
  // One scale for both axes: the drawing is to scale.
  const s = Math.min((W - 2 * pad) / spanA, (H - 2 * pad) / spanB);
  const ox = pad + ((W - 2 * pad) - spanA * s) / 2;
  const oy = H - pad - ((H - 2 * pad) - spanB * s) / 2;
  const X = (a: number) => ox + (a - e.aMin) * s;
  const Y = (b: number) => oy - (b - e.bMin) * s;
  const solidA0 = Math.min(...e.solids.map((r) => r.a0));
  const solidA1 = Math.max(...e.solids.map((r) => r.a1));
  const solidB0 = Math.min(...e.solids.map((r) => r.b0));
  const solidB1 = Math.max(...e.solids.map((r) => r.b1));
  const cgA = cg?.[0];
  const cgB = view === "plan" ? cg?.[1] : cg?.[2];
  return (
    <svg viewBox={`0 0 ${W} ${H}`} className="w-full rounded-plinth border border-grout-200 bg-white" role="img" aria-label={`${view} of the block to scale`} data-testid={`drawing-${view}`}>
      <defs>
        <pattern id={`hatch-${view}`} width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="6" stroke="#a99f8c" strokeWidth="1" />
        </pattern>
      </defs>
      {view === "elevation" ? <line x1={8} x2={W - 8} y1={Y(0)} y2={Y(0)} stroke="#8ea2ab" strokeDasharray="4 3" /> : null}
      {e.piles ? (
        <g data-testid={`piles-${view}`} stroke="#3a4d57" strokeWidth={1} fill="none">
          {view === "plan"
            ? e.piles.heads.map((h, i) => (
                <circle key={i} cx={X(h.x)} cy={Y(h.y)} r={(e.piles!.d / 2) * s} strokeDasharray="3 2">
                  <title>{`pile ${i + 1}`}</title>
                </circle>
              ))
            : [...new Set(e.piles.heads.map((h) => h.x))].map((x) => (
                <rect key={x} x={X(x - e.piles!.d / 2)} y={Y(0)} width={e.piles!.d * s} height={e.piles!.length * s} fill="#e7e2d8">
                  <title>{`pile shaft at x = ${formatLength(x)}`}</title>
                </rect>
              ))}
        </g>
      ) : null}
      {e.springs ? (
        <g data-testid={`springs-${view}`} stroke="#3a4d57" strokeWidth={1} fill="none">
          {view === "plan"
            ? e.springs.map((sp) => {
                const r = e.springSymbol.r * s;
                return (
                  <g key={sp.n} data-spring={sp.n}>
                    <circle cx={X(sp.x)} cy={Y(sp.y)} r={r} strokeDasharray="3 2" />
                    <line x1={X(sp.x) - r} x2={X(sp.x) + r} y1={Y(sp.y)} y2={Y(sp.y)} />
                    <line x1={X(sp.x)} x2={X(sp.x)} y1={Y(sp.y) - r} y2={Y(sp.y) + r} />
                    {sp.damper ? <rect x={X(sp.x) - r / 2} y={Y(sp.y) - r / 2} width={r} height={r} data-damper={sp.n} /> : null}
                    <title>{`spring ${sp.n}${sp.damper ? " with damper" : ""}`}</title>
                  </g>
                );
              })
            : [...new Map(e.springs.map((sp) => [sp.x, sp])).values()].map((sp) => {
                const w = e.springSymbol.r * s;
                const damper = e.springs!.some((o) => o.x === sp.x && o.damper);
                const bottom = e.base ? e.base.top : -e.springSymbol.h;
                return (
                  <g key={sp.x} data-spring={sp.n}>
                    <path d={coilPath(X(sp.x), Y(0), Y(bottom), w)} />
                    {damper ? (
                      <g data-damper={sp.n}>
                        <rect x={X(sp.x) + 1.4 * w} y={Y(0) + (Y(bottom) - Y(0)) * 0.45} width={0.8 * w} height={(Y(bottom) - Y(0)) * 0.55} />
                        <line x1={X(sp.x) + 1.8 * w} x2={X(sp.x) + 1.8 * w} y1={Y(0)} y2={Y(0) + (Y(bottom) - Y(0)) * 0.6} />
                      </g>
                    ) : null}
                    <title>{`spring at x = ${formatLength(sp.x)}${damper ? " with damper" : ""}`}</title>
                  </g>
                );
              })}
          {view === "elevation" && !e.base ? <line x1={X(e.aMin)} x2={X(e.aMax)} y1={Y(-e.springSymbol.h)} y2={Y(-e.springSymbol.h)} strokeWidth={1.5} /> : null}
        </g>
      ) : null}
      {e.base ? (
        <g data-testid={`springs-base-${view}`}>
          <rect x={X(e.base.a0)} y={Y(e.base.b1)} width={(e.base.a1 - e.base.a0) * s} height={(e.base.b1 - e.base.b0) * s} fill={view === "plan" ? "none" : "#efe9dc"} stroke="#3a4d57" strokeWidth={1.2} strokeDasharray={view === "plan" ? "6 3" : undefined}>
            <title>base block under the springs</title>
          </rect>
          {view === "elevation" ? <line x1={8} x2={W - 8} y1={Y(e.base.b0)} y2={Y(e.base.b0)} stroke="#6b5b3e" strokeWidth={1.5} /> : null}
        </g>
      ) : null}
      {e.rects.map((r, i) => (
        <rect
          key={`${r.name}-${i}`}
          x={X(r.a0)}
          y={Y(r.b1)}
          width={(r.a1 - r.a0) * s}
          height={(r.b1 - r.b0) * s}
          fill={r.isVoid ? "#faf9f7" : `url(#hatch-${view})`}
          stroke={r.isVoid ? "#b8432f" : "#3a4d57"}
          strokeDasharray={r.isVoid ? "4 2" : undefined}
          strokeWidth={1.2}
        >
          <title>{`${r.name}${r.isVoid ? " (void)" : ""}`}</title>
        </rect>
      ))}
      {e.points.map((p, i) =>
        p.kind === "machine" ? (
          <g key={i}>
            <circle cx={X(p.a)} cy={Y(p.b)} r={5} fill="#d49a1e" stroke="#8f650f" />
            <text x={X(p.a) + 7} y={Y(p.b) - 6} fontSize="10" fill="#8f650f">
              {p.label}
            </text>
          </g>
        ) : p.kind === "bearing" ? (
          <rect key={i} x={X(p.a) - 3.5} y={Y(p.b) - 3.5} width={7} height={7} fill="#2e3d46">
            <title>{p.label}</title>
          </rect>
        ) : (
          <path key={i} d={`M ${X(p.a)} ${Y(p.b) - 5} l 5 8 l -10 0 z`} fill="#3f8a4a">
            <title>{p.label}</title>
          </path>
        ),
      )}
      {ok(cgA) && ok(cgB) ? (
        <g data-testid={`cg-${view}`}>
          <circle cx={X(cgA)} cy={Y(cgB)} r={7} fill="none" stroke="#b8432f" strokeWidth={1.5} />
          <line x1={X(cgA) - 10} x2={X(cgA) + 10} y1={Y(cgB)} y2={Y(cgB)} stroke="#b8432f" />
          <line x1={X(cgA)} x2={X(cgA)} y1={Y(cgB) - 10} y2={Y(cgB) + 10} stroke="#b8432f" />
        </g>
      ) : null}
      {/* overall dimensions */}
      <g fontSize="10" fill="#4a616c" stroke="#647d88">
        <line x1={X(solidA0)} x2={X(solidA1)} y1={H - 16} y2={H - 16} markerStart="" />
        <line x1={X(solidA0)} x2={X(solidA0)} y1={H - 20} y2={H - 12} />
        <line x1={X(solidA1)} x2={X(solidA1)} y1={H - 20} y2={H - 12} />
        <text x={(X(solidA0) + X(solidA1)) / 2} y={H - 20} textAnchor="middle" stroke="none">
          {fmtLen(solidA1 - solidA0, formatLength)}
        </text>
        <line x1={16} x2={16} y1={Y(solidB0)} y2={Y(solidB1)} />
        <line x1={12} x2={20} y1={Y(solidB0)} y2={Y(solidB0)} />
        <line x1={12} x2={20} y1={Y(solidB1)} y2={Y(solidB1)} />
        <text x={24} y={(Y(solidB0) + Y(solidB1)) / 2} stroke="none" dominantBaseline="middle">
          {fmtLen(solidB1 - solidB0, formatLength)}
        </text>
      </g>
      <text x={W - 10} y={14} textAnchor="end" fontSize="10" fill="#8ea2ab">
        {view === "plan" ? "PLAN  x →  y ↑" : "ELEVATION  x →  z ↑"}
      </text>
    </svg>
  );
}

export function BlockDrawing({ form, mass, formatLength }: { form: DraftForm; mass?: MassPropertiesResult; formatLength: (m: number) => string }) {
  const piles = pilesOf(form);
  const springs = springsOf(form);
  const springsBase = springs ? springsBaseOf(form) : null;
  return (
    <div className="grid grid-cols-1 gap-3 xl:grid-cols-2">
      <figure>
        <OneView form={form} view="plan" cg={mass?.cg as [number, number, number] | undefined} formatLength={formatLength} />
        <figcaption className="mt-1 text-2xs text-basalt-400">Plan. Hatched: concrete; dashed red: voids; amber: machine centres; dark squares: bearings; green: check points; red cross: combined centre of gravity.</figcaption>
      </figure>
      <figure>
        <OneView form={form} view="elevation" cg={mass?.cg as [number, number, number] | undefined} formatLength={formatLength} />
        <figcaption className="mt-1 text-2xs text-basalt-400">
          Elevation, looking along +y. Dashed line: underside of the base (z = 0).{piles ? " Shaded below it: the pile shafts to their length (piles behind one another drawn once)." : ""}
          {springs && !springsBase ? " Below it: the springs (coils; a dashpot beside where there is a damper) down to the supporting floor (heavy line); springs behind one another drawn once; their height is schematic." : ""}
          {springs && springsBase ? " Below it: the springs (coils; a dashpot beside where there is a damper) down to the base block (shaded, to scale, the spring height as typed), the base on the ground (heavy line at its underside); springs behind one another drawn once." : ""}
        </figcaption>
      </figure>
      {piles ? (
        <div className="text-2xs text-basalt-400 xl:col-span-2" data-testid="piles-text">
          <p>
            Piles (dashed circles in plan, under the cap): {piles.heads.length} of diameter {formatLength(piles.d)} and length {formatLength(piles.length)}, heads at the underside of the cap.
          </p>
          <ul className="sr-only">
            {piles.heads.map((h, i) => (
              <li key={i}>{`Pile ${i + 1} at x ${formatLength(h.x)}, y ${formatLength(h.y)}`}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {springs ? (
        <div className="text-2xs text-basalt-400 xl:col-span-2" data-testid="springs-text">
          <p>
            Springs (circles with a cross in plan, under the block; a square inside: with a damper): {springs.length} at their positions to scale; the symbols&apos; size is schematic (the spring table gives no
            spring size).
            {springsBase
              ? ` They stand on a base block (dashed in plan, shaded in elevation) ${formatLength(springsBase.x[1] - springsBase.x[0])} × ${formatLength(springsBase.y[1] - springsBase.y[0])} × ${formatLength(springsBase.z[1] - springsBase.z[0])}, its top at z = ${formatLength(springsBase.z[1])}, on the soil.`
              : ""}
          </p>
          <ul className="sr-only" data-testid="springs-list">
            {springs.map((sp) => (
              <li key={sp.n}>{`Spring ${sp.n} at x ${formatLength(sp.x)}, y ${formatLength(sp.y)}${sp.damper ? ", with damper" : ""}`}</li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
