// Recognises the block the assistant can resize: one rectangular base mat (the only non-void
// solid resting on the soil) carrying plinths, pedestals, voids and machines above its top.
// Refusals name the field to change.
import type { AnalysisInput, InputIssue } from "@/modules/calc";

/** Two faces closer than this are at the same level or edge (m); matches the core's level tolerance. */
export const LENGTH_TOLERANCE_M = 1e-6;

export interface MatDimensions {
  /** Along x (m). */
  length: number;
  /** Along y (m). */
  width: number;
  thickness: number;
}

export interface BaseMat {
  /** Index of the mat in `block.solids`. */
  index: number;
  x: [number, number];
  y: [number, number];
  /** Underside and top level. */
  z: [number, number];
  dimensions: MatDimensions;
  concreteDensity: number;
  /** Net concrete volume of everything but the mat: plinths minus voids (m^3); it does not change with the mat. */
  otherVolume: number;
  /** Total machine mass (kg). */
  machineMass: number;
  /** Plan extent of what the mat carries (plinths, voids, machine cgs and boxes, bearings). */
  carried: { x: [number, number]; y: [number, number] };
  /** Deepest reach of a void below the mat top (m); 0 without voids. */
  deepestVoidBelowTop: number;
  /** Plan centre of gravity of the machines, plinths and voids (voids as negative mass). */
  loadCentre: [number, number];
}

type Interval = readonly [number, number];
const len = (i: Interval) => i[1] - i[0];
const mid = (i: Interval) => (i[0] + i[1]) / 2;

export type ReadBaseMatResult = { ok: true; mat: BaseMat } | { ok: false; issues: InputIssue[] };

/** Reads the base mat and what it carries from a valid analysis input. */
export function readBaseMat(input: AnalysisInput): ReadBaseMatResult {
  const solids = input.block.solids;
  const full = solids.map((s, i) => ({ s, i })).filter(({ s }) => !s.void);
  const level = Math.min(...full.map(({ s }) => s.z[0]));
  const onSoil = full.filter(({ s }) => Math.abs(s.z[0] - level) <= LENGTH_TOLERANCE_M);
  const first = onSoil[0];
  if (!first) return { ok: false, issues: [{ path: "block.solids", message: "the block needs a solid resting on the soil" }] };
  const issues: InputIssue[] = [];
  for (const other of onSoil.slice(1)) {
    issues.push({
      path: `block.solids[${other.i}]`,
      message: `also rests on the soil beside solids[${first.i}]: the assistant resizes one rectangular base mat, so make the base one box or size this block by hand`,
    });
  }
  const mat = first.s;
  const top = mat.z[1];
  solids.forEach((s, i) => {
    if (i === first.i) return;
    if (!s.void && s.z[0] < top - LENGTH_TOLERANCE_M && Math.abs(s.z[0] - level) > LENGTH_TOLERANCE_M) {
      issues.push({
        path: `block.solids[${i}].z`,
        message: `starts below the top of the base mat solids[${first.i}] (${top} m): only plinths standing on the mat top can follow a change of thickness`,
      });
    }
    if (s.void && Math.abs(s.z[0] - level) <= LENGTH_TOLERANCE_M) {
      issues.push({
        path: `block.solids[${i}].z`,
        message: "void reaches the underside of the base mat: it changes the contact area, which the assistant does not resize",
      });
    }
  });
  if (issues.length > 0) return { ok: false, issues };

  const rho = input.block.concreteDensity;
  const xs: number[] = [];
  const ys: number[] = [];
  let otherVolume = 0;
  let deepest = 0;
  let m = 0;
  let mx = 0;
  let my = 0;
  const addMass = (mass: number, x: number, y: number) => {
    m += mass;
    mx += mass * x;
    my += mass * y;
  };
  solids.forEach((s, i) => {
    if (i === first.i) return;
    const volume = len(s.x) * len(s.y) * len(s.z);
    otherVolume += s.void ? -volume : volume;
    addMass((s.void ? -1 : 1) * rho * volume, mid(s.x), mid(s.y));
    xs.push(...s.x);
    ys.push(...s.y);
    if (s.void) deepest = Math.max(deepest, top - s.z[0]);
  });
  let machineMass = 0;
  for (const machine of input.machines) {
    machineMass += machine.mass;
    // The core takes a machine with a box as a uniform box: its centre is the cg.
    const cg = machine.box ? [mid(machine.box.x), mid(machine.box.y)] : [machine.cg[0], machine.cg[1]];
    addMass(machine.mass, cg[0] ?? 0, cg[1] ?? 0);
    xs.push(machine.cg[0]);
    ys.push(machine.cg[1]);
    if (machine.box) {
      xs.push(...machine.box.x);
      ys.push(...machine.box.y);
    }
    for (const rotor of machine.rotors) {
      for (const b of rotor.bearings) {
        xs.push(b[0]);
        ys.push(b[1]);
      }
    }
  }
  // method "piles": the cap must cover every pile head wholly (the core refuses a head centre
  // outside the cap; the assistant keeps the whole circle of the diameter under it)
  if (input.impedance.method === "piles") {
    const r = input.impedance.diameter / 2;
    for (const p of input.impedance.piles) {
      xs.push(p.x - r, p.x + r);
      ys.push(p.y - r, p.y + r);
    }
  }
  return {
    ok: true,
    mat: {
      index: first.i,
      x: [mat.x[0], mat.x[1]],
      y: [mat.y[0], mat.y[1]],
      z: [mat.z[0], mat.z[1]],
      dimensions: { length: len(mat.x), width: len(mat.y), thickness: len(mat.z) },
      concreteDensity: rho,
      otherVolume,
      machineMass,
      carried: { x: [Math.min(...xs), Math.max(...xs)], y: [Math.min(...ys), Math.max(...ys)] },
      deepestVoidBelowTop: deepest,
      // voids in the mat can outweigh everything it carries; the mat's own centre serves then
      loadCentre: m > 0 ? [mx / m, my / m] : [mid(mat.x), mid(mat.y)],
    },
  };
}

/** Net concrete volume of the block with the mat at the given dimensions (m^3). */
export function concreteVolume(mat: BaseMat, d: MatDimensions): number {
  return d.length * d.width * d.thickness + mat.otherVolume;
}

/** Smallest dimensions that still hold everything the mat carries, about a plan centre. */
export function minimumFit(mat: BaseMat, centre: readonly [number, number]): MatDimensions {
  const half = (extent: [number, number], c: number) => Math.max(extent[1] - c, c - extent[0], 0);
  return {
    length: 2 * half(mat.carried.x, centre[0]),
    width: 2 * half(mat.carried.y, centre[1]),
    thickness: mat.deepestVoidBelowTop,
  };
}

/**
 * Dimensions that cannot hold the carried items: the plinths, voids, machines and bearings
 * must lie on the mat in plan, and every void must end above the underside (a void through
 * the mat would change the contact area).
 */
export function fitProblems(mat: BaseMat, centre: readonly [number, number], d: MatDimensions): { dimension: keyof MatDimensions; message: string }[] {
  const need = minimumFit(mat, centre);
  const out: { dimension: keyof MatDimensions; message: string }[] = [];
  if (d.length < need.length - LENGTH_TOLERANCE_M) {
    out.push({ dimension: "length", message: `${d.length} m is too short for the plinths, voids, machines and pile heads on the mat (at least ${need.length.toFixed(3)} m)` });
  }
  if (d.width < need.width - LENGTH_TOLERANCE_M) {
    out.push({ dimension: "width", message: `${d.width} m is too narrow for the plinths, voids, machines and pile heads on the mat (at least ${need.width.toFixed(3)} m)` });
  }
  if (!(d.thickness > need.thickness + LENGTH_TOLERANCE_M)) {
    out.push({ dimension: "thickness", message: `${d.thickness} m leaves no concrete under the deepest void (it reaches ${need.thickness.toFixed(3)} m below the top)` });
  }
  return out;
}
