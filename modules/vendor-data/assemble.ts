// From cells to the contract's machines: converts each cell by its field's kind, builds
// the machine documents, validates them with the contract, and names the cell of every
// problem. The workbook and CSV readers both end here.
import type { MachineInput } from "@/modules/calc/schema";
import { TRANSIENT_LIMITS } from "@/modules/calc/transient-settings";
import { ROTOR_DEFAULTS } from "@/modules/desk/rotor-defaults";
import {
  bearingLabel,
  datumAxisChoices,
  machineFields,
  rampFields,
  rotorFields,
  type FieldSpec,
  type MachineFieldKey,
  type PositionFrame,
  type RampFieldKey,
  type RotorFieldKey,
  type RotorRampTimes,
} from "./layout";
import { problemAt, type CellRef, type Problem, type RawCell, type RawMachine, type UploadTerms } from "./types";
import { sheetWording, validateMachines } from "./validate";

export type AssembleResult =
  | { ok: true; machines: MachineInput[]; rampTimes: RotorRampTimes[]; terms: UploadTerms }
  | { ok: false; problems: Problem[] };

/** Version 2 unless said otherwise: positions from the machine datum. */
const DATUM_TERMS: UploadTerms = { formatVersion: 2, frame: "machine-datum" };

interface Target {
  ref: CellRef;
  label: string;
}

const numberText = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

function unitText(spec: FieldSpec): string {
  return spec.unit ? ` in ${spec.unit}` : "";
}

/** The value of a cell for its field, or a problem; undefined for an empty cell. */
function convert(spec: FieldSpec, cell: RawCell | undefined, problems: Problem[]): string | number | undefined {
  if (!cell) return undefined;
  const v = cell.value;
  if (v.kind === "empty") return undefined;
  if (v.kind === "bad") {
    problems.push(problemAt(cell.ref, `${spec.label}: ${v.message}`));
    return undefined;
  }
  switch (spec.kind) {
    case "text":
      return v.kind === "number" ? String(v.value) : v.value;
    case "axis":
    case "mode":
      return v.kind === "text" ? v.value.trim().toLowerCase() : String(v.value);
    case "number":
    case "positive":
    case "grade": {
      if (v.kind === "number") return v.value;
      // Vendors often write a grade as "G 6.3".
      const text = (spec.kind === "grade" ? v.value.replace(/^G\s*/i, "") : v.value).trim();
      if (numberText.test(text)) return Number(text);
      problems.push(problemAt(cell.ref, `${spec.label}: expected a number${unitText(spec)}, found the text "${v.value.slice(0, 40)}"`));
      return undefined;
    }
  }
}

/** Longest start-up or coast-down accepted: the speed-ramp runs' own limit (transient-settings.ts). */
const RAMP_MAX_S = TRANSIENT_LIMITS.maxDurationS;

function isFilled(cell: RawCell | undefined): boolean {
  return !!cell && cell.value.kind !== "empty";
}

const machineSpec = (key: MachineFieldKey): FieldSpec => machineFields.find((f) => f.key === key) as FieldSpec;
const rotorSpec = (key: RotorFieldKey): FieldSpec => rotorFields.find((f) => f.key === key) as FieldSpec;
const rampSpec = (key: RampFieldKey): FieldSpec => rampFields.find((f) => f.key === key) as FieldSpec;

/** Which cell a contract path points at; the nearest enclosing path when not exact. */
function lookup(targets: Map<string, Target>, path: string): Target | undefined {
  let p = path;
  for (;;) {
    const hit = targets.get(p);
    if (hit) return hit;
    const cut = Math.max(p.lastIndexOf("."), p.lastIndexOf("["));
    if (cut <= 0) return undefined;
    p = p.slice(0, cut);
  }
}

export function assembleMachines(raws: RawMachine[], terms: UploadTerms = DATUM_TERMS): AssembleResult {
  const frame: PositionFrame = terms.frame;
  const problems: Problem[] = [];
  const rampTimes: RotorRampTimes[] = [];
  // Contract paths that already have a cell problem; the contract's own issue at the same
  // place (a value missing because its cell was unreadable) would only repeat it.
  const reported = new Set<string>();
  const note = (path: string, before: number) => {
    if (problems.length > before) reported.add(path);
  };
  const targets = new Map<string, Target>();
  const docs: Record<string, unknown>[] = [];
  const target = (path: string, cell: RawCell | undefined, fallback: CellRef, label: string) =>
    targets.set(path, { ref: cell?.ref ?? fallback, label });

  raws.forEach((raw, mi) => {
    const mp = `machines[${mi}]`;
    const paths: Record<MachineFieldKey, string> = {
      name: `${mp}.name`, mass: `${mp}.mass`, cgX: `${mp}.cg`, cgY: `${mp}.cg`, cgZ: `${mp}.cg`,
      boxXFrom: `${mp}.box`, boxXTo: `${mp}.box`, boxYFrom: `${mp}.box`, boxYTo: `${mp}.box`, boxZFrom: `${mp}.box`, boxZTo: `${mp}.box`,
    };
    const field = (key: MachineFieldKey) => {
      const before = problems.length;
      const v = convert(machineSpec(key), raw.fields[key], problems);
      note(paths[key], before);
      return v;
    };
    const doc: Record<string, unknown> = {};
    const name = field("name");
    if (name !== undefined) doc.name = name;
    const mass = field("mass");
    if (mass !== undefined) doc.mass = mass;
    const cg = (["cgX", "cgY", "cgZ"] as const).map(field);
    if (cg.every((c) => c !== undefined)) doc.cg = cg;
    target(mp, raw.fields.name, raw.anchor, machineSpec("name").label);
    target(`${mp}.name`, raw.fields.name, raw.anchor, machineSpec("name").label);
    target(`${mp}.mass`, raw.fields.mass, raw.anchor, machineSpec("mass").label);
    // The rotor masses are compared with the machine mass: point at the machine mass.
    target(`${mp}.rotors`, raw.fields.mass, raw.anchor, machineSpec("mass").label);
    (["cgX", "cgY", "cgZ"] as const).forEach((key, a) => {
      if (cg[a] === undefined && !isFilled(raw.fields[key])) {
        problems.push(problemAt(raw.fields[key]?.ref ?? raw.anchor, `${machineSpec(key).label}: is required (the cell is empty)`));
        reported.add(`${mp}.cg`);
      }
      target(`${mp}.cg[${a}]`, raw.fields[key], raw.anchor, machineSpec(key).label);
    });
    target(`${mp}.cg`, raw.fields.cgX, raw.anchor, machineSpec("cgX").label);

    const boxKeys = ["boxXFrom", "boxXTo", "boxYFrom", "boxYTo", "boxZFrom", "boxZTo"] as const;
    const box = boxKeys.map(field);
    const boxFilled = boxKeys.filter((k) => isFilled(raw.fields[k]));
    if (boxFilled.length === boxKeys.length && box.every((b) => b !== undefined)) {
      doc.box = { x: [box[0], box[1]], y: [box[2], box[3]], z: [box[4], box[5]] };
    } else if (boxFilled.length > 0 && boxFilled.length < boxKeys.length) {
      const firstEmpty = boxKeys.find((k) => !isFilled(raw.fields[k])) ?? "boxXFrom";
      problems.push(problemAt(raw.fields[firstEmpty]?.ref ?? raw.anchor, `${machineSpec(firstEmpty).label}: fill all six outline box cells, or none`));
      reported.add(`${mp}.box`);
    }
    (["x", "y", "z"] as const).forEach((axis, a) => {
      const from = boxKeys[2 * a] as MachineFieldKey;
      const to = boxKeys[2 * a + 1] as MachineFieldKey;
      target(`${mp}.box.${axis}`, raw.fields[from], raw.anchor, machineSpec(from).label);
      target(`${mp}.box.${axis}[0]`, raw.fields[from], raw.anchor, machineSpec(from).label);
      target(`${mp}.box.${axis}[1]`, raw.fields[to], raw.anchor, machineSpec(to).label);
    });
    target(`${mp}.box`, raw.fields.boxXFrom, raw.anchor, machineSpec("boxXFrom").label);

    const rotors: Record<string, unknown>[] = [];
    for (const rr of raw.rotors) {
      const used = Object.values(rr.fields).some(isFilled) || rr.bearings.some((b) => b.some(isFilled));
      if (!used) continue;
      const ri = rotors.length;
      const rp = `${mp}.rotors[${ri}]`;
      const rf = (key: RotorFieldKey) => {
        const before = problems.length;
        const v = convert(rotorSpec(key), rr.fields[key], problems);
        note(key === "speedMinRpm" || key === "speedMaxRpm" ? `${rp}.speedRangeRpm` : `${rp}.${key}`, before);
        return v;
      };
      const rotor: Record<string, unknown> = {};
      for (const key of ["name", "mass", "speedRpm", "balanceGrade", "unbalanceForce", "serviceFactor", "axis", "unbalanceMode"] as const) {
        const value = rf(key);
        if (value !== undefined) rotor[key] = value;
        target(`${rp}.${key}`, rr.fields[key], rr.anchor, rotorSpec(key).label);
      }
      // A blank service factor is the desk's default (rotor-defaults.ts), not the contract's 1.
      if (rotor.serviceFactor === undefined && !isFilled(rr.fields.serviceFactor)) rotor.serviceFactor = ROTOR_DEFAULTS.serviceFactor.value;
      // In the machine datum a horizontal shaft runs along x by definition (datum.ts).
      if (frame === "machine-datum" && rotor.axis !== undefined && !(datumAxisChoices as readonly unknown[]).includes(rotor.axis)) {
        problems.push(
          problemAt(rr.fields.axis?.ref ?? rr.anchor, `${rotorSpec("axis").label}: "${String(rotor.axis)}" is not an axis of the machine datum; its x runs along a horizontal shaft (give x), z up a vertical shaft (give z)`),
        );
        reported.add(`${rp}.axis`);
      }
      const times: RotorRampTimes = { machine: typeof doc.name === "string" ? doc.name : "", rotor: typeof rotor.name === "string" ? rotor.name : "" };
      for (const key of ["startUpS", "coastDownS"] as const) {
        const value = convert(rampSpec(key), rr.ramp?.[key], problems);
        if (typeof value === "number") {
          if (!(value > 0) || value > RAMP_MAX_S) problems.push(problemAt(rr.ramp?.[key]?.ref ?? rr.anchor, `${rampSpec(key).label}: must be greater than 0 and at most ${RAMP_MAX_S} s`));
          else times[key] = value;
        }
      }
      if (times.startUpS !== undefined || times.coastDownS !== undefined) rampTimes.push(times);
      // A rotor-level issue is the grade-or-force rule: point at the grade.
      target(rp, rr.fields.balanceGrade, rr.anchor, rotorSpec("balanceGrade").label);
      const lo = rf("speedMinRpm");
      const hi = rf("speedMaxRpm");
      if (lo !== undefined && hi !== undefined) rotor.speedRangeRpm = [lo, hi];
      else if (isFilled(rr.fields.speedMinRpm) !== isFilled(rr.fields.speedMaxRpm)) {
        const empty = isFilled(rr.fields.speedMinRpm) ? "speedMaxRpm" : "speedMinRpm";
        problems.push(problemAt(rr.fields[empty]?.ref ?? rr.anchor, `${rotorSpec(empty).label}: give both the lowest and the highest operating speed, or neither`));
        reported.add(`${rp}.speedRangeRpm`);
      }
      target(`${rp}.speedRangeRpm`, rr.fields.speedMinRpm, rr.anchor, rotorSpec("speedMinRpm").label);
      target(`${rp}.speedRangeRpm[0]`, rr.fields.speedMinRpm, rr.anchor, rotorSpec("speedMinRpm").label);
      target(`${rp}.speedRangeRpm[1]`, rr.fields.speedMaxRpm, rr.anchor, rotorSpec("speedMaxRpm").label);

      const bearings: number[][] = [];
      rr.bearings.forEach((cells, b) => {
        if (!cells.some(isFilled)) return;
        const bi = bearings.length;
        const coords = cells.map((cell, a) => {
          const spec: FieldSpec = { key: "bearing", label: bearingLabel(b, a), unit: "m", kind: "number", required: true, csv: "" };
          const before = problems.length;
          const value = convert(spec, cell, problems);
          if (value === undefined && !isFilled(cell)) problems.push(problemAt(cell.ref, `${spec.label}: fill all three coordinates of the bearing`));
          note(`${rp}.bearings`, before);
          target(`${rp}.bearings[${bi}][${a}]`, cell, rr.anchor, spec.label);
          return value;
        });
        target(`${rp}.bearings[${bi}]`, cells[0], rr.anchor, bearingLabel(b, 0));
        if (coords.every((c): c is number => typeof c === "number")) bearings.push(coords);
      });
      rotor.bearings = bearings;
      target(`${rp}.bearings`, rr.bearings[0]?.[0], rr.anchor, bearingLabel(0, 0));
      rotors.push(rotor);
    }
    doc.rotors = rotors;
    docs.push(doc);
  });

  const validated = validateMachines(docs);
  if (validated.ok && problems.length === 0) return { ok: true, machines: validated.machines, rampTimes, terms };
  // A cell that already has a problem (say, text in a number cell) also lacks its value in
  // the document; the contract's "is required" for it would only repeat the first problem.
  if (!validated.ok) {
    const seen = new Set<string>();
    for (const issue of validated.issues) {
      if ([...reported].some((r) => issue.path === r || issue.path.startsWith(`${r}[`) || issue.path.startsWith(`${r}.`))) continue;
      const t = lookup(targets, issue.path);
      const ref = t?.ref ?? raws[0]?.anchor ?? null;
      const message = `${t ? `${t.label}: ` : ""}${sheetWording(issue.message)}`;
      const key = `${ref?.sheet}!${ref?.cell}:${message}`;
      if (seen.has(key)) continue;
      seen.add(key);
      problems.push(problemAt(ref, message));
    }
  }
  return { ok: false, problems: sortProblems(problems) };
}

function cellOrder(cell: string | null): [number, number] {
  const m = /^([A-Z]+)(\d+)$/.exec(cell ?? "");
  if (!m?.[1] || !m[2]) return [0, 0];
  const col = [...m[1]].reduce((n, ch) => n * 26 + ch.charCodeAt(0) - 64, 0);
  return [Number(m[2]), col];
}

export function sortProblems(problems: Problem[]): Problem[] {
  return [...problems].sort((a, b) => {
    if ((a.sheet ?? "") !== (b.sheet ?? "")) return (a.sheet ?? "").localeCompare(b.sheet ?? "", undefined, { numeric: true });
    const [ra, ca] = cellOrder(a.cell);
    const [rb, cb] = cellOrder(b.cell);
    return ra - rb || ca - cb;
  });
}
