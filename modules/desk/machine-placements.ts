// Where each machine's own datum sits on the block, and the vendor's own figures behind the
// draft's machines (issue 18, item 6). Kept beside the analysis input (the draft's and the
// revision's `machine_placements`), never inside it: the calculation contract stays in block
// coordinates, and the desk converts the vendor's positions before the input is built.
import { z } from "zod";
import type { MachineInput, TransientRequestDocument } from "@/modules/calc/schema";
import { DATUM_ROTATIONS, machineToBlock, machineToDatum, type MachineDatum } from "@/modules/vendor-data/datum";
import type { PositionFrame } from "@/modules/vendor-data/layout";
import { RAMP_TIME_DEFAULTS } from "./rotor-defaults";

/** The vendor's start-up and coast-down times of one rotor (s). */
export interface RampTimes {
  rotor: string;
  startUpS?: number;
  coastDownS?: number;
}

/** The vendor submission a machine was taken from, with the vendor's own values. */
export interface VendorTrail {
  submissionId: string;
  version: number;
  /** "machine-datum": the values below are relative to the machine datum; "block": version 1 template, block coordinates. */
  frame: PositionFrame;
  /** The machine exactly as the vendor gave it. */
  machine: MachineInput;
  rampTimes: RampTimes[];
}

export interface MachinePlacement {
  /** The machine's name in the draft's input. */
  machine: string;
  /** Where the machine datum sits on the block; null: the machine's positions are block coordinates. */
  datum: MachineDatum | null;
  vendor: VendorTrail | null;
}

const finite = z.number({ error: "must be a finite number" }).refine(Number.isFinite, { error: "must be a finite number" }).refine((v) => Math.abs(v) <= 1000, { error: "must lie within ±1000 m" });

export const machineDatumSchema = z.strictObject({
  origin: z.tuple([finite, finite, finite], { error: "must be [x, y, z] in m" }),
  rotationDeg: z.union(DATUM_ROTATIONS.map((r) => z.literal(r)) as [z.ZodLiteral<0>, z.ZodLiteral<90>, z.ZodLiteral<180>, z.ZodLiteral<270>], { error: "must be 0, 90, 180 or 270 (degrees about z)" }),
});

const rampTimesSchema = z.strictObject({ rotor: z.string().max(200), startUpS: z.number().positive().optional(), coastDownS: z.number().positive().optional() });

// The vendor trail is written by the server when vendor data is taken in; a save from the
// workspace sends it back as it was read. Its machine is kept as stored (checked loosely here:
// it was checked by the contract when the vendor submitted it).
const vendorTrailSchema = z.strictObject({
  submissionId: z.string().uuid({ error: "must be a submission id" }),
  version: z.number().int().positive(),
  frame: z.enum(["machine-datum", "block"]),
  machine: z.record(z.string(), z.unknown()),
  rampTimes: z.array(rampTimesSchema).max(64),
});

export const machinePlacementsSchema = z
  .array(z.strictObject({ machine: z.string().max(200), datum: machineDatumSchema.nullable(), vendor: vendorTrailSchema.nullable() }), { error: "must be a list of machine placements" })
  .max(64, { error: "at most 64 machine placements" });

/** Stored placements, read leniently: anything unreadable is dropped rather than failing a page. */
export function readPlacements(stored: unknown): MachinePlacement[] {
  const parsed = machinePlacementsSchema.safeParse(stored);
  return parsed.success ? (parsed.data as unknown as MachinePlacement[]) : [];
}

export type TakeInResult =
  | { ok: true; machines: MachineInput[]; placements: MachinePlacement[]; transient: TransientRequestDocument[] | undefined; retimed: number }
  | { ok: false; issues: { path: string; message: string }[] };

/**
 * Takes a vendor submission's machines into a draft. Positions from the machine datum go
 * through the datum the designer placed for that machine (looked up by the requested machine's
 * name, then by the vendor's); a version 1 submission (block coordinates) is taken as it is.
 * Every machine keeps the vendor's own values and its datum, so the trail shows both. Runs of
 * a rotor whose vendor gave a start-up or coast-down time take that time as their duration.
 */
export function takeVendorMachines(args: {
  submission: { id: string; version: number; frame: PositionFrame; machines: MachineInput[]; rampTimes: (RampTimes & { machine: string })[] };
  /** The request's machine names, in the order of the submission's machines. */
  requestedNames: string[];
  placements: MachinePlacement[];
  transient: TransientRequestDocument[] | undefined;
}): TakeInResult {
  const { submission } = args;
  const issues: { path: string; message: string }[] = [];
  const machines: MachineInput[] = [];
  const placements: MachinePlacement[] = [];
  submission.machines.forEach((vendorMachine, i) => {
    const requested = args.requestedNames[i] ?? vendorMachine.name;
    const placed = args.placements.find((p) => p.machine === requested) ?? args.placements.find((p) => p.machine === vendorMachine.name);
    const datum = placed?.datum ?? null;
    if (submission.frame === "machine-datum" && !datum) {
      issues.push({
        path: `machines[${i}]`,
        message: `Place the datum of "${requested}" on the block first (workspace, Machines: machine datum): version ${submission.version} gives its positions from the machine's own datum`,
      });
      return;
    }
    const block = submission.frame === "machine-datum" && datum ? machineToBlock(datum, vendorMachine) : vendorMachine;
    machines.push(block);
    placements.push({
      machine: block.name,
      datum,
      vendor: {
        submissionId: submission.id,
        version: submission.version,
        frame: submission.frame,
        machine: vendorMachine,
        rampTimes: submission.rampTimes.filter((t) => t.machine === vendorMachine.name).map((t) => ({ rotor: t.rotor, ...(t.startUpS !== undefined ? { startUpS: t.startUpS } : {}), ...(t.coastDownS !== undefined ? { coastDownS: t.coastDownS } : {}) })),
      },
    });
  });
  if (issues.length) return { ok: false, issues };
  let retimed = 0;
  const transient = args.transient?.map((run) => {
    const times = placements.find((p) => p.machine === run.machine)?.vendor?.rampTimes.find((t) => t.rotor === run.rotor);
    const vendorS = run.kind === "run-up" ? times?.startUpS : times?.coastDownS;
    if (vendorS === undefined || vendorS === run.durationS) return run;
    retimed++;
    return { ...run, durationS: vendorS };
  });
  return { ok: true, machines, placements, transient, retimed };
}

export interface RampDuration {
  durationS: number;
  from: "vendor" | "desk-default";
  /** What the designer reads beside the run: where the figure comes from. */
  source: string;
}

/** The duration a run of this rotor starts from: the vendor's time when one is on record, the desk's default otherwise. */
export function rampDurationFor(placements: readonly MachinePlacement[], machine: string, rotor: string, kind: "run-up" | "coast-down"): RampDuration {
  const trail = placements.find((p) => p.machine === machine)?.vendor;
  const times = trail?.rampTimes.find((t) => t.rotor === rotor);
  const vendorS = kind === "run-up" ? times?.startUpS : times?.coastDownS;
  const what = kind === "run-up" ? "start-up" : "coast-down";
  if (trail && vendorS !== undefined) return { durationS: vendorS, from: "vendor", source: `the vendor's ${what} time (machine data version ${trail.version})` };
  const d = kind === "run-up" ? RAMP_TIME_DEFAULTS.startUpS : RAMP_TIME_DEFAULTS.coastDownS;
  return { durationS: d.value, from: "desk-default", source: `the desk's default ${what} time: ${d.source}` };
}

/** Which figure a run's duration is: the vendor's, the desk's default, or one the designer set. */
export function runDurationSource(placements: readonly MachinePlacement[], run: { machine: string; rotor: string; kind: "run-up" | "coast-down"; durationS: number | null }): string {
  const start = rampDurationFor(placements, run.machine, run.rotor, run.kind);
  if (run.durationS === start.durationS) return `Duration: ${start.source}`;
  return start.from === "vendor" ? `Duration set by the designer (the vendor gives ${start.durationS} s)` : "Duration set by the designer";
}

/** One machine of a template as it is prefilled (workbook, CSV, web form): in the vendor's terms. */
export interface PrefillMachine {
  name: string;
  values: MachineInput | null;
  /** The figures on record are block coordinates and no datum is placed: the position cells stay blank. */
  omitPositions?: boolean;
  rampTimes?: RampTimes[];
}

/**
 * What a template is prefilled with, in the machine's own terms: the newest submission when it
 * gave positions from the datum (and its times); otherwise the figures on record (block
 * coordinates) taken back through the datum the designer placed, or without their positions
 * when no datum is placed (a block coordinate is no position from the machine datum).
 */
export function prefillInVendorTerms(
  requested: { name: string; values: MachineInput | null }[],
  newest: { frame: PositionFrame; machines: MachineInput[]; rampTimes: (RampTimes & { machine: string })[] } | undefined,
  datums: { machine: string; datum: MachineDatum }[],
): PrefillMachine[] {
  if (newest && newest.frame === "machine-datum" && newest.machines.length === requested.length) {
    return newest.machines.map((m) => ({ name: m.name, values: m, rampTimes: newest.rampTimes.filter((t) => t.machine === m.name) }));
  }
  const held = newest && newest.machines.length === requested.length ? newest.machines.map((m) => ({ name: m.name, values: m as MachineInput | null })) : requested;
  return held.map((entry, i) => {
    const names = [requested[i]?.name, entry.name];
    const datum = datums.find((d) => names.includes(d.machine))?.datum;
    if (!entry.values) return { name: entry.name, values: null };
    return datum ? { name: entry.name, values: machineToDatum(datum, entry.values) } : { name: entry.name, values: entry.values, omitPositions: true };
  });
}

/**
 * The placements of a save from the workspace: the datums as the designer sent them, the vendor
 * figures only as the server stored them (a trail that is not on record, or was changed, is
 * dropped), so the trail always shows what the vendor submitted.
 */
export function withStoredTrails(sent: readonly MachinePlacement[], stored: readonly MachinePlacement[]): MachinePlacement[] {
  return sent.flatMap((p) => {
    const trail = p.vendor ? stored.find((q) => q.vendor && q.vendor.submissionId === p.vendor?.submissionId && q.vendor.machine.name === p.vendor.machine.name)?.vendor ?? null : null;
    if (!p.datum && !trail) return [];
    return [{ machine: p.machine, datum: p.datum, vendor: trail }];
  });
}
