// The machine's own datum (format version 2 of the machine data): the vendor gives every
// position relative to it, the designer places it on the block once, and the desk turns the
// vendor's positions into block coordinates here, before any analysis input is built (the
// calculation contract itself stays in block coordinates, unchanged).
//
// Machine frame (stated on the template): origin on the shaft centreline at the coupling face,
// x along the shaft away from the coupling, z up, y completing a right-handed set (x × y = z).
// A vertical-shaft machine: origin on the shaft centreline at the mounting face, z up the shaft.
// Placing it: the origin's position in block coordinates and a rotation about the vertical
// (0, 90, 180 or 270 degrees, counter-clockwise seen from above, from block x towards block y).
import type { MachineInput } from "@/modules/calc/schema";
import { formatSignificant } from "@/modules/units/format-number";

export const DATUM_ROTATIONS = [0, 90, 180, 270] as const;
export type DatumRotation = (typeof DATUM_ROTATIONS)[number];

export interface MachineDatum {
  /** The datum's origin in block coordinates (m). */
  origin: [number, number, number];
  /** Rotation of the machine's x axis from the block's x axis about z, counter-clockwise seen from above. */
  rotationDeg: DatumRotation;
}

export const MACHINE_DATUM_TEXT =
  "Machine datum: origin on the shaft centreline at the coupling face (a vertical shaft: on its centreline at the mounting face); x along the shaft away from the coupling, z up, y to the left looking along +x (right-handed).";

type Vec3 = [number, number, number];

// Exact cosines and sines of the four quarter turns: no rounding from Math.cos(π/2).
const quarter: Record<DatumRotation, { c: number; s: number }> = { 0: { c: 1, s: 0 }, 90: { c: 0, s: 1 }, 180: { c: -1, s: 0 }, 270: { c: 0, s: -1 } };

// `+ 0` turns a -0 (from -1 × 0) into 0, so stored documents and hashes never hold "-0".
const clean = (v: number): number => v + 0;

export function isDatumRotation(v: unknown): v is DatumRotation {
  return DATUM_ROTATIONS.includes(v as DatumRotation);
}

/** A point of the machine frame in block coordinates: p_block = origin + Rz(θ) p_machine. */
export function datumToBlock(datum: MachineDatum, p: readonly number[]): Vec3 {
  const { c, s } = quarter[datum.rotationDeg];
  const [x = 0, y = 0, z = 0] = p;
  const [ox, oy, oz] = datum.origin;
  return [clean(ox + c * x - s * y), clean(oy + s * x + c * y), clean(oz + z)];
}

/** The inverse: a block point in the machine frame, p_machine = Rz(-θ) (p_block - origin). */
export function blockToDatum(datum: MachineDatum, p: readonly number[]): Vec3 {
  const { c, s } = quarter[datum.rotationDeg];
  const [x = 0, y = 0, z = 0] = p;
  const dx = x - datum.origin[0];
  const dy = y - datum.origin[1];
  return [clean(c * dx + s * dy), clean(-s * dx + c * dy), clean(z - datum.origin[2])];
}

/** A shaft axis of the machine frame as a block axis: a quarter turn swaps x and y. */
export function axisToBlock(datum: MachineDatum, axis: "x" | "y" | "z"): "x" | "y" | "z" {
  if (axis === "z" || datum.rotationDeg % 180 === 0) return axis;
  return axis === "x" ? "y" : "x";
}

type Box = NonNullable<MachineInput["box"]>;

function boxThrough(box: Box, map: (p: readonly number[]) => Vec3): Box {
  // Two opposite corners: under a quarter turn the box stays axis-aligned, its ranges swap or flip.
  const a = map([box.x[0], box.y[0], box.z[0]]);
  const b = map([box.x[1], box.y[1], box.z[1]]);
  const range = (i: 0 | 1 | 2): [number, number] => [Math.min(a[i], b[i]), Math.max(a[i], b[i])];
  return { x: range(0), y: range(1), z: range(2) };
}

/**
 * A machine whose positions (centre of gravity, outline box, bearings) and shaft axes are in its
 * own datum frame, in block coordinates. Everything else (masses, speeds, grades) is unchanged.
 */
export function machineToBlock(datum: MachineDatum, m: MachineInput): MachineInput {
  const map = (p: readonly number[]) => datumToBlock(datum, p);
  return {
    ...m,
    cg: map(m.cg),
    ...(m.box ? { box: boxThrough(m.box, map) } : {}),
    rotors: m.rotors.map((r) => ({ ...r, axis: axisToBlock(datum, r.axis), bearings: r.bearings.map(map) })),
  };
}

/** The inverse of machineToBlock: a machine in block coordinates in its datum frame. */
export function machineToDatum(datum: MachineDatum, m: MachineInput): MachineInput {
  const map = (p: readonly number[]) => blockToDatum(datum, p);
  // The inverse rotation swaps the same axes as the rotation itself.
  return {
    ...m,
    cg: map(m.cg),
    ...(m.box ? { box: boxThrough(m.box, map) } : {}),
    rotors: m.rotors.map((r) => ({ ...r, axis: axisToBlock(datum, r.axis), bearings: r.bearings.map(map) })),
  };
}

export function describeDatum(d: MachineDatum): string {
  return `origin at (${d.origin.map((v) => formatSignificant(v)).join(", ")}) m in block coordinates, machine x turned ${d.rotationDeg}° from block x about z`;
}
