// What changed between two versions of a vendor's machine data: machines and rotors are
// matched by name (then by position for those left over, so a renamed machine still
// compares), every figure is listed with old, new, change and per cent, and machines,
// rotors and bearings that appear or disappear are listed as such.
import type { MachineInput } from "@/modules/calc/schema";

type Rotor = MachineInput["rotors"][number];
type Value = number | string | null;

export interface DataChange {
  /** Where, in words: "Raw-water pump RWP-101 › impeller › rotor mass". */
  where: string;
  unit: string;
  kind: "changed" | "added" | "removed";
  before: Value;
  after: Value;
  /** after − before, for numbers. */
  delta: number | null;
  /** Change in per cent of before, for numbers with before ≠ 0. */
  percent: number | null;
}

const RELATIVE_TOLERANCE = 1e-9;

function sameNumber(a: number, b: number): boolean {
  return Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(1, Math.abs(a), Math.abs(b));
}

function change(where: string, unit: string, before: Value, after: Value): DataChange | null {
  if (before === after) return null;
  if (typeof before === "number" && typeof after === "number") {
    if (sameNumber(before, after)) return null;
    return { where, unit, kind: "changed", before, after, delta: after - before, percent: before !== 0 ? ((after - before) / Math.abs(before)) * 100 : null };
  }
  const kind = before === null ? "added" : after === null ? "removed" : "changed";
  return { where, unit, kind, before, after, delta: null, percent: null };
}

/** Pairs items by name, then the leftovers by their order. */
function pair<T extends { name: string }>(before: T[], after: T[]): [T | null, T | null][] {
  const pairs: [T | null, T | null][] = [];
  const restAfter = [...after];
  const restBefore: T[] = [];
  for (const b of before) {
    const i = restAfter.findIndex((a) => a.name === b.name);
    if (i >= 0) pairs.push([b, restAfter.splice(i, 1)[0] ?? null]);
    else restBefore.push(b);
  }
  while (restBefore.length || restAfter.length) pairs.push([restBefore.shift() ?? null, restAfter.shift() ?? null]);
  return pairs;
}

const xyz = ["x", "y", "z"] as const;

function rotorRows(r: Rotor): [string, string, Value][] {
  const rows: [string, string, Value][] = [
    ["rotor mass", "kg", r.mass],
    ["rated speed", "rpm", r.speedRpm],
    ["lowest operating speed", "rpm", r.speedRangeRpm?.[0] ?? null],
    ["highest operating speed", "rpm", r.speedRangeRpm?.[1] ?? null],
    ["balance grade", "mm/s", r.balanceGrade ?? null],
    ["unbalance force", "N", r.unbalanceForce ?? null],
    ["service factor", "", r.serviceFactor],
    ["shaft axis", "", r.axis],
    ["unbalance mode", "", r.unbalanceMode],
  ];
  r.bearings.forEach((b, i) => xyz.forEach((axis, a) => rows.push([`bearing ${i + 1} ${axis}`, "m", b[a] ?? null])));
  return rows;
}

function machineRows(m: MachineInput): [string, string, Value][] {
  const rows: [string, string, Value][] = [["machine mass", "kg", m.mass]];
  xyz.forEach((axis, a) => rows.push([`centre of gravity ${axis}`, "m", m.cg[a] ?? null]));
  for (const axis of xyz) {
    rows.push([`outline box ${axis} from`, "m", m.box?.[axis][0] ?? null]);
    rows.push([`outline box ${axis} to`, "m", m.box?.[axis][1] ?? null]);
  }
  return rows;
}

function compareRows(prefix: string, before: [string, string, Value][], after: [string, string, Value][], out: DataChange[]): void {
  const labels = [...new Set([...before.map((r) => r[0]), ...after.map((r) => r[0])])];
  for (const label of labels) {
    const b = before.find((r) => r[0] === label);
    const a = after.find((r) => r[0] === label);
    const c = change(`${prefix} › ${label}`, (a ?? b)?.[1] ?? "", b?.[2] ?? null, a?.[2] ?? null);
    if (c) out.push(c);
  }
}

export function diffMachines(before: MachineInput[], after: MachineInput[]): DataChange[] {
  const out: DataChange[] = [];
  for (const [b, a] of pair(before, after)) {
    const name = a?.name ?? b?.name ?? "?";
    if (!b || !a) {
      out.push(change(`machine ${name}`, "", b ? b.name : null, a ? a.name : null) as DataChange);
      continue;
    }
    const c = change(`${b.name} › name`, "", b.name, a.name);
    if (c) out.push(c);
    compareRows(name, machineRows(b), machineRows(a), out);
    for (const [rb, ra] of pair(b.rotors, a.rotors)) {
      const rname = ra?.name ?? rb?.name ?? "?";
      if (!rb || !ra) {
        out.push(change(`${name} › rotor ${rname}`, "", rb ? rb.name : null, ra ? ra.name : null) as DataChange);
        continue;
      }
      const rc = change(`${name} › ${rb.name} › name`, "", rb.name, ra.name);
      if (rc) out.push(rc);
      compareRows(`${name} › ${rname}`, rotorRows(rb), rotorRows(ra), out);
    }
  }
  return out;
}
