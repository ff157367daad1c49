// The design form's model: the contract's analysis input as the designer is
// typing it. Numbers may be blank (null) while being entered; `toInputDocument`
// turns the form into the contract's JSON (blank optional fields dropped) and the
// contract's zod schema then has the last word on the server.
import * as yup from "yup";
import { ACCEPTANCE_JUSTIFICATION_MAX, ACCEPTANCE_JUSTIFICATION_MIN, TRANSIENT_LIMITS, type AnalysisInputDocument } from "@/modules/calc";
import { RAMP_TIME_DEFAULTS, ROTOR_DEFAULTS } from "./rotor-defaults";
import type { MachinePlacement, VendorTrail } from "./machine-placements";
import type { DatumRotation } from "@/modules/vendor-data/datum";

export type Num = number | null;
export type Vec3Form = [Num, Num, Num];
export type RangeForm = [Num, Num];

export interface SolidForm {
  name: string;
  x: RangeForm;
  y: RangeForm;
  z: RangeForm;
  void: boolean;
}

export interface RotorForm {
  name: string;
  mass: Num;
  speedRpm: Num;
  speedRangeRpm: RangeForm;
  unbalanceSource: "grade" | "force";
  balanceGrade: Num;
  unbalanceForce: Num;
  serviceFactor: Num;
  axis: "x" | "y" | "z";
  unbalanceMode: "static" | "couple" | "both";
  bearings: Vec3Form[];
}

export interface MachineForm {
  name: string;
  mass: Num;
  cg: Vec3Form;
  /** A machine modelled as a uniform box (its own rotational inertia) instead of a point mass. */
  box: { enabled: boolean; x: RangeForm; y: RangeForm; z: RangeForm };
  rotors: RotorForm[];
  /**
   * Where the machine's own datum sits on the block (machine-placements.ts): the vendor's
   * positions are given from it. Absent or not placed: the positions are block coordinates.
   */
  datum?: DatumForm;
  /** The vendor's own figures behind this machine, when they were taken in (read-only). */
  vendor?: VendorTrail | null;
}

export interface DatumForm {
  placed: boolean;
  origin: Vec3Form;
  rotationDeg: DatumRotation;
}

export function newDatumForm(): DatumForm {
  return { placed: true, origin: [0, 0, null], rotationDeg: 0 };
}

export type Dof6Form = { x: Num; y: Num; z: Num; rx: Num; ry: Num; rz: Num };

/**
 * One start-up or coast-down run of a rotor (the contract's `transient[i]`). The rotor is named
 * by machine and rotor name, as in the contract; blank speeds take the core's defaults
 * (standstill and the rated speed), a blank unbalance mode the rotor's own.
 */
export interface TransientRunForm {
  machine: string;
  rotor: string;
  kind: "run-up" | "coast-down";
  fromRpm: Num;
  toRpm: Num;
  durationS: Num;
  case: "vertical" | "horizontal" | "rotating" | "horizontal-x" | "horizontal-y";
  unbalanceMode: "static" | "couple" | null;
  /** Output intervals of the envelope series; blank takes the core's default. */
  outputPoints: Num;
}

/** One layer of a borehole profile, top down; Vs or, when given that way, G. */
export interface SoilLayerForm {
  thickness: Num;
  shearWaveVelocity: Num;
  shearModulus: Num;
  density: Num;
  poissonRatio: Num;
}

/** A blank steel spring row of the "springs" method (issue 16). */
export function newSpring(): NonNullable<DraftForm["impedance"]["springs"]>[number] {
  return { x: null, y: null, kz: null, kh: null, cz: null, ch: null };
}

export interface SpringsBaseForm {
  restsOn: "floor" | "base";
  x: RangeForm;
  y: RangeForm;
  z: RangeForm;
  concreteDensity: Num;
  support: "gazetas" | "equivalent-radius" | "user";
}

/** A blank base block under the springs (two-stage isolation). */
export function newSpringsBase(): SpringsBaseForm {
  return { restsOn: "base", x: [null, null], y: [null, null], z: [null, null], concreteDensity: null, support: "gazetas" };
}

/** A blank pile head row of the "piles" method (issue 16). */
export function newPileHead(): { x: Num; y: Num } {
  return { x: null, y: null };
}

/** The pile group's fields of the "piles" method, blank. */
export function newPilesForm(): NonNullable<DraftForm["impedance"]["piles"]> {
  return { heads: [], diameter: null, length: null, youngsModulus: null, pileDensity: null, tip: "floating", soilProfile: "uniform", interaction: "dynamic-factors" };
}

export function newSoilLayer(): SoilLayerForm {
  return { thickness: null, shearWaveVelocity: null, shearModulus: null, density: null, poissonRatio: null };
}

export interface DraftForm {
  block: { concreteDensity: Num; solids: SolidForm[] };
  soil: {
    modulusSource: "shearModulus" | "shearWaveVelocity";
    shearModulus: Num;
    shearWaveVelocity: Num;
    poissonRatio: Num;
    density: Num;
    materialDamping: Num;
    allowableBearingPressure: Num;
    embedmentDepth: Num;
    sidewallContactHeight: Num;
    /** Half-space (default), one layer over rock, or a layered borehole profile over rock. */
    profile: "half-space" | "stratum" | "layers";
    /** Depth from grade to the rigid base (profile "stratum"). */
    stratumThickness: Num;
    layers: SoilLayerForm[];
  };
  impedance: {
    method: "equivalent-radius" | "gazetas" | "user" | "springs" | "piles";
    stiffness: Dof6Form;
    /** Piles only (issue 16): pile heads in plan, pile section and length, tip, soil profile along the shaft. */
    piles?: {
      heads: { x: Num; y: Num }[];
      diameter: Num;
      length: Num;
      youngsModulus: Num;
      /** Blank: the engine's 2500 kg/m^3. */
      pileDensity?: Num;
      tip: "floating" | "end-bearing";
      soilProfile: "uniform" | "linear";
      interaction: "dynamic-factors" | "none";
    };
    /** Steel springs only (issue 16): plan position, catalogue kz and kh, optional dampers. */
    springs?: { x: Num; y: Num; kz: Num; kh: Num; cz: Num; ch: Num }[];
    /** Steel springs only: one damping ratio when the springs have no dampers (empty: the default). */
    springsDampingRatio?: Num;
    /**
     * Steel springs only (engine 1.8.0): what the springs rest on, a rigid floor or a base block on
     * the soil (its box, concrete density, blank: the block's, and the soil method under it; the
     * "user" support takes `stiffness` and `dampingRatio` above, "gazetas" `gazetasDynamic`).
     */
    springsBase?: SpringsBaseForm;
    dampingRatio: Dof6Form;
    /** Gazetas only: the paper's charts (default), Pais & Kausel's closed forms, or the simplified k = 1, c = 1. */
    gazetasDynamic: "published" | "pais-kausel" | "simplified";
  };
  machines: MachineForm[];
  checkPoints: { name: string; position: Vec3Form }[];
  criteria: {
    frequencySeparation: Num;
    maxDisplacementPeak: Num;
    maxVelocityPeak: Num;
    minMassRatio: Num;
    maxEccentricity: Num;
    maxBearingRatio: Num;
  };
  soilBand: { lowerFactor: Num; upperFactor: Num };
  sweep: { fromHz: Num; toHz: Num; points: Num };
  /** Start-up and coast-down runs through resonance; none by default. */
  transient: TransientRunForm[];
  /**
   * Failing soil-band checks the designer accepts with a written justification (the contract's
   * `acceptances`, modules/calc/band-checks.ts). A blank justification is no acceptance.
   */
  acceptances: AcceptanceForm[];
}

export interface AcceptanceForm {
  checkKey: string;
  justification: string;
}

const emptyDof = (): Dof6Form => ({ x: null, y: null, z: null, rx: null, ry: null, rz: null });

export function newRotor(): RotorForm {
  return {
    name: "Rotor",
    mass: null,
    speedRpm: null,
    speedRangeRpm: [null, null],
    unbalanceSource: "grade",
    // The desk's defaults, with their sources (rotor-defaults.ts; the vendor template prints the same).
    balanceGrade: ROTOR_DEFAULTS.balanceGrade.value,
    serviceFactor: ROTOR_DEFAULTS.serviceFactor.value,
    unbalanceForce: null,
    axis: "x",
    unbalanceMode: ROTOR_DEFAULTS.unbalanceMode.value,
    bearings: [
      [null, 0, null],
      [null, 0, null],
    ],
  };
}

export function newMachine(n: number): MachineForm {
  return { name: `Machine ${n}`, mass: null, cg: [0, 0, null], box: { enabled: false, x: [null, null], y: [null, null], z: [null, null] }, rotors: [newRotor()] };
}

/** The form of a foundation that has no draft yet: one mat to start from, nothing assumed about the soil. */
export function emptyDraftForm(): DraftForm {
  return {
    block: { concreteDensity: 2400, solids: [{ name: "Mat", x: [-2, 2], y: [-1.5, 1.5], z: [0, 1.2], void: false }] },
    soil: {
      modulusSource: "shearWaveVelocity",
      shearModulus: null,
      shearWaveVelocity: null,
      poissonRatio: null,
      density: null,
      materialDamping: null,
      allowableBearingPressure: null,
      embedmentDepth: 0,
      sidewallContactHeight: 0,
      profile: "half-space",
      stratumThickness: null,
      layers: [],
    },
    impedance: { method: "equivalent-radius", stiffness: emptyDof(), dampingRatio: emptyDof(), gazetasDynamic: "published" },
    machines: [newMachine(1)],
    checkPoints: [],
    criteria: { frequencySeparation: null, maxDisplacementPeak: null, maxVelocityPeak: null, minMassRatio: null, maxEccentricity: null, maxBearingRatio: null },
    soilBand: { lowerFactor: null, upperFactor: null },
    sweep: { fromHz: null, toHz: null, points: null },
    transient: [],
    acceptances: [],
  };
}

/**
 * Placeholder run durations for a new run (s) when the vendor gave none (RAMP_TIME_DEFAULTS:
 * common practice, orders of magnitude recalled from memory); the vendor's start-up and
 * coast-down times replace them (machine-placements.ts, rampDurationFor).
 */
export const NEW_RUN_DURATION_S = { "run-up": RAMP_TIME_DEFAULTS.startUpS.value, "coast-down": RAMP_TIME_DEFAULTS.coastDownS.value } as const;

/**
 * A new run of a rotor with the core's default speeds (standstill and the rated speed); its
 * duration is the vendor's time when one is on record (`durationS`), the desk's default otherwise.
 */
export function newTransientRun(machine: string, rotor: string, kind: TransientRunForm["kind"], durationS?: number | null): TransientRunForm {
  return { machine, rotor, kind, fromRpm: null, toRpm: null, durationS: durationS ?? NEW_RUN_DURATION_S[kind], case: "rotating", unbalanceMode: null, outputPoints: null };
}

/** A rotor a run can name: the form's machines and rotors as they stand. */
export interface RunRotorChoice {
  machine: string;
  rotor: string;
  speedRpm: Num;
  unbalanceMode: RotorForm["unbalanceMode"];
  axis: RotorForm["axis"];
}

export function runRotorChoices(form: Pick<DraftForm, "machines">): RunRotorChoice[] {
  return form.machines.flatMap((m) => m.rotors.map((r) => ({ machine: m.name, rotor: r.name, speedRpm: r.speedRpm, unbalanceMode: r.unbalanceMode, axis: r.axis })));
}

/** Start and end speed of a run as the core resolves them (blank: standstill and rated). */
export function runSpeeds(run: Pick<TransientRunForm, "kind" | "fromRpm" | "toRpm">, ratedRpm: Num): { fromRpm: Num; toRpm: Num } {
  const runUp = run.kind === "run-up";
  return { fromRpm: run.fromRpm ?? (runUp ? 0 : ratedRpm), toRpm: run.toRpm ?? (runUp ? ratedRpm : 0) };
}

/**
 * What the core's consistency rules would say about a run, checked against the form's own
 * machines (modules/calc/input-consistency.ts, checkTransientRequest): the rotor exists, the
 * speeds go the run's way, the unbalance mode is one the rotor has. Null when none applies.
 */
export function transientRunIssue(form: Pick<DraftForm, "machines">, run: TransientRunForm): { field: keyof TransientRunForm; message: string } | null {
  const machine = form.machines.find((m) => m.name === run.machine);
  if (!machine) return { field: "machine", message: `No machine is named "${run.machine}": pick the rotor again` };
  const rotor = machine.rotors.find((r) => r.name === run.rotor);
  if (!rotor) return { field: "rotor", message: `"${run.machine}" has no rotor named "${run.rotor}": pick the rotor again` };
  const { fromRpm, toRpm } = runSpeeds(run, rotor.speedRpm);
  const field = run.toRpm !== null ? "toRpm" : "fromRpm";
  if (fromRpm !== null && toRpm !== null && Number.isFinite(fromRpm) && Number.isFinite(toRpm)) {
    if (run.kind === "run-up" && !(toRpm > fromRpm)) return { field, message: `A run-up must end faster than it starts (${fromRpm} to ${toRpm} rpm)` };
    if (run.kind === "coast-down" && !(fromRpm > toRpm)) return { field, message: `A coast-down must end slower than it starts (${fromRpm} to ${toRpm} rpm)` };
  }
  if (run.unbalanceMode !== null && rotor.unbalanceMode !== "both" && run.unbalanceMode !== rotor.unbalanceMode) {
    return { field: "unbalanceMode", message: `The rotor's unbalance is ${rotor.unbalanceMode}; a run can use only that one` };
  }
  return null;
}

const v3 = (v: readonly number[] | undefined): Vec3Form => [v?.[0] ?? null, v?.[1] ?? null, v?.[2] ?? null];
const r2 = (v: readonly number[] | undefined): RangeForm => [v?.[0] ?? null, v?.[1] ?? null];

/** A stored (valid) input document as the form shows it. */
export function formFromInput(input: AnalysisInputDocument): DraftForm {
  const soil = input.soil;
  const imp = input.impedance;
  const baseSupport = imp.method === "springs" ? imp.base?.support : undefined;
  return {
    block: {
      concreteDensity: input.block.concreteDensity,
      solids: input.block.solids.map((s) => ({ name: s.name, x: r2(s.x), y: r2(s.y), z: r2(s.z), void: s.void ?? false })),
    },
    soil: {
      modulusSource: soil.shearModulus !== undefined ? "shearModulus" : "shearWaveVelocity",
      shearModulus: soil.shearModulus ?? null,
      shearWaveVelocity: soil.shearWaveVelocity ?? null,
      poissonRatio: soil.poissonRatio,
      density: soil.density,
      materialDamping: soil.materialDamping ?? null,
      allowableBearingPressure: soil.allowableBearingPressure,
      embedmentDepth: soil.embedmentDepth ?? 0,
      sidewallContactHeight: soil.sidewallContactHeight ?? 0,
      profile: soil.layers ? "layers" : soil.stratum ? "stratum" : "half-space",
      stratumThickness: soil.stratum?.thickness ?? null,
      layers: (soil.layers ?? []).map((l) => ({
        thickness: l.thickness,
        shearWaveVelocity: l.shearWaveVelocity ?? null,
        shearModulus: l.shearModulus ?? null,
        density: l.density,
        poissonRatio: l.poissonRatio ?? null,
      })),
    },
    impedance: {
      method: imp.method,
      stiffness: imp.method === "user" ? { ...imp.stiffness } : baseSupport?.method === "user" ? { ...baseSupport.stiffness } : emptyDof(),
      dampingRatio: imp.method === "user" ? { ...imp.dampingRatio } : baseSupport?.method === "user" ? { ...baseSupport.dampingRatio } : emptyDof(),
      gazetasDynamic: imp.method === "gazetas" ? (imp.gazetasDynamic ?? "published") : baseSupport?.method === "gazetas" ? (baseSupport.gazetasDynamic ?? "published") : "published",
      ...(imp.method === "springs"
        ? {
            springs: imp.springs.map((s) => ({ x: s.x, y: s.y, kz: s.kz, kh: s.kh, cz: s.cz ?? null, ch: s.ch ?? null })),
            springsDampingRatio: imp.dampingRatio ?? null,
            ...(imp.base
              ? {
                  springsBase: {
                    restsOn: "base" as const,
                    x: r2(imp.base.x),
                    y: r2(imp.base.y),
                    z: r2(imp.base.z),
                    concreteDensity: imp.base.concreteDensity ?? null,
                    support: imp.base.support?.method ?? "gazetas",
                  },
                }
              : {}),
          }
        : {}),
      ...(imp.method === "piles"
        ? {
            piles: {
              heads: imp.piles.map((p) => ({ x: p.x, y: p.y })),
              diameter: imp.diameter,
              length: imp.length,
              youngsModulus: imp.youngsModulus,
              pileDensity: imp.pileDensity ?? null,
              tip: imp.tip,
              soilProfile: imp.soilProfile ?? "uniform",
              interaction: imp.interaction ?? "dynamic-factors",
            },
          }
        : {}),
    },
    machines: input.machines.map((m) => ({
      name: m.name,
      mass: m.mass,
      cg: v3(m.cg),
      box: m.box ? { enabled: true, x: r2(m.box.x), y: r2(m.box.y), z: r2(m.box.z) } : { enabled: false, x: [null, null], y: [null, null], z: [null, null] },
      rotors: (m.rotors ?? []).map((r) => ({
        name: r.name,
        mass: r.mass,
        speedRpm: r.speedRpm,
        speedRangeRpm: r.speedRangeRpm ? r2(r.speedRangeRpm) : [null, null],
        unbalanceSource: r.unbalanceForce !== undefined && r.balanceGrade === undefined ? "force" : "grade",
        balanceGrade: r.balanceGrade ?? null,
        unbalanceForce: r.unbalanceForce ?? null,
        serviceFactor: r.serviceFactor ?? 1,
        axis: r.axis,
        unbalanceMode: r.unbalanceMode ?? "static",
        bearings: r.bearings.map((b) => v3(b)),
      })),
    })),
    checkPoints: (input.checkPoints ?? []).map((c) => ({ name: c.name, position: v3(c.position) })),
    criteria: {
      frequencySeparation: input.criteria?.frequencySeparation ?? null,
      maxDisplacementPeak: input.criteria?.maxDisplacementPeak ?? null,
      maxVelocityPeak: input.criteria?.maxVelocityPeak ?? null,
      minMassRatio: input.criteria?.minMassRatio ?? null,
      maxEccentricity: input.criteria?.maxEccentricity ?? null,
      maxBearingRatio: input.criteria?.maxBearingRatio ?? null,
    },
    soilBand: { lowerFactor: input.soilBand?.lowerFactor ?? null, upperFactor: input.soilBand?.upperFactor ?? null },
    sweep: { fromHz: input.sweep?.fromHz ?? null, toHz: input.sweep?.toHz ?? null, points: input.sweep?.points ?? null },
    transient: (input.transient ?? []).map((t) => ({
      machine: t.machine,
      rotor: t.rotor,
      kind: t.kind,
      fromRpm: t.fromRpm ?? null,
      toRpm: t.toRpm ?? null,
      durationS: t.durationS,
      case: t.case ?? "rotating",
      unbalanceMode: t.unbalanceMode ?? null,
      outputPoints: t.outputPoints ?? null,
    })),
    acceptances: (input.acceptances ?? []).map((a) => ({ checkKey: a.checkKey, justification: a.justification })),
  };
}

type Loose = Record<string, unknown>;
const obj = (v: unknown): Loose => (v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Loose) : {});
const list = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);

/**
 * A stored draft document as the form shows it, complete or not (issue 18: a draft may be
 * saved with blanks). Missing objects and lists are filled in empty, so the form opens on
 * whatever was saved; blank values stay blank (null).
 */
export function formFromDraftDocument(doc: unknown, placements: readonly MachinePlacement[] = []): DraftForm {
  return withPlacements(formFromDocument(doc), placements);
}

/** The form's machines with their datums and vendor figures, matched by machine name. */
export function withPlacements(form: DraftForm, placements: readonly MachinePlacement[]): DraftForm {
  if (!placements.length) return form;
  return {
    ...form,
    machines: form.machines.map((m) => {
      const p = placements.find((q) => q.machine === m.name);
      if (!p) return m;
      return { ...m, ...(p.datum ? { datum: { placed: true, origin: [...p.datum.origin] as Vec3Form, rotationDeg: p.datum.rotationDeg } } : {}), vendor: p.vendor };
    }),
  };
}

/**
 * The placements to store with the draft: a machine whose datum is placed with all three
 * coordinates, or that carries vendor figures. Keyed by the machine's name as it stands.
 */
export function placementsFromForm(form: Pick<DraftForm, "machines">): MachinePlacement[] {
  return form.machines.flatMap((m) => {
    const d = m.datum;
    const origin = d?.origin;
    const datum =
      d?.placed && origin && origin.every((v) => typeof v === "number" && Number.isFinite(v)) ? { origin: [origin[0], origin[1], origin[2]] as [number, number, number], rotationDeg: d.rotationDeg } : null;
    if (!datum && !m.vendor) return [];
    return [{ machine: m.name, datum, vendor: m.vendor ?? null }];
  });
}

function formFromDocument(doc: unknown): DraftForm {
  const d = obj(doc);
  const block = obj(d.block);
  const filled = {
    ...d,
    block: { ...block, solids: list(block.solids).map(obj) },
    soil: obj(d.soil),
    impedance: d.impedance === undefined ? { method: "equivalent-radius" } : obj(d.impedance),
    machines: list(d.machines).map((m) => {
      const machine = obj(m);
      return { ...machine, rotors: list(machine.rotors).map((r) => ({ ...obj(r), bearings: list(obj(r).bearings) })) };
    }),
  };
  return formFromInput(filled as unknown as AnalysisInputDocument);
}

function dropNulls<T extends Record<string, unknown>>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== null && v !== undefined)) as Partial<T>;
}

/**
 * The contract's input document from the form. Blank optional values are left
 * out (the contract's defaults apply); blank required values stay null so the
 * contract's schema names them.
 */
export function toInputDocument(f: DraftForm): unknown {
  const soil = f.soil;
  const layered = soil.profile === "layers";
  // A layered profile gives the stiffness itself: the top-level G / Vs are then left out.
  const modulus = layered ? {} : soil.modulusSource === "shearModulus" ? { shearModulus: soil.shearModulus } : { shearWaveVelocity: soil.shearWaveVelocity };
  const criteria = dropNulls(f.criteria);
  const band = dropNulls(f.soilBand);
  const sweep = dropNulls(f.sweep);
  const acceptances = (f.acceptances ?? []).filter((a) => a.justification.trim() !== "");
  return {
    schemaVersion: 1,
    block: { concreteDensity: f.block.concreteDensity, solids: f.block.solids.map((s) => ({ name: s.name, x: s.x, y: s.y, z: s.z, void: s.void })) },
    soil: {
      ...modulus,
      poissonRatio: soil.poissonRatio,
      density: soil.density,
      ...(soil.materialDamping !== null ? { materialDamping: soil.materialDamping } : {}),
      allowableBearingPressure: soil.allowableBearingPressure,
      embedmentDepth: soil.embedmentDepth ?? 0,
      sidewallContactHeight: soil.sidewallContactHeight ?? 0,
      ...(soil.profile === "stratum" ? { stratum: { thickness: soil.stratumThickness, base: "rigid" } } : {}),
      ...(layered
        ? {
            layers: soil.layers.map((l) => ({
              thickness: l.thickness,
              ...(l.shearModulus !== null && l.shearWaveVelocity === null ? { shearModulus: l.shearModulus } : { shearWaveVelocity: l.shearWaveVelocity }),
              density: l.density,
              ...(l.poissonRatio !== null ? { poissonRatio: l.poissonRatio } : {}),
            })),
          }
        : {}),
    },
    impedance:
      f.impedance.method === "user"
        ? { method: "user", stiffness: f.impedance.stiffness, dampingRatio: f.impedance.dampingRatio }
        : f.impedance.method === "springs"
          ? {
              method: "springs",
              springs: (f.impedance.springs ?? []).map((s) => ({ x: s.x, y: s.y, kz: s.kz, kh: s.kh, ...(s.cz !== null ? { cz: s.cz } : {}), ...(s.ch !== null ? { ch: s.ch } : {}) })),
              ...(f.impedance.springsDampingRatio !== undefined && f.impedance.springsDampingRatio !== null ? { dampingRatio: f.impedance.springsDampingRatio } : {}),
              ...(f.impedance.springsBase?.restsOn === "base" ? { base: springsBaseInput(f.impedance.springsBase, f.impedance) } : {}),
            }
          : f.impedance.method === "piles"
            ? pilesInput(f.impedance.piles ?? newPilesForm())
          : f.impedance.method === "gazetas" && f.impedance.gazetasDynamic !== "published"
          ? { method: "gazetas", gazetasDynamic: f.impedance.gazetasDynamic }
          : { method: f.impedance.method },
    machines: f.machines.map((m) => ({
      name: m.name,
      mass: m.mass,
      cg: m.cg,
      ...(m.box.enabled ? { box: { x: m.box.x, y: m.box.y, z: m.box.z } } : {}),
      rotors: m.rotors.map((r) => ({
        name: r.name,
        mass: r.mass,
        speedRpm: r.speedRpm,
        ...(r.speedRangeRpm[0] !== null || r.speedRangeRpm[1] !== null ? { speedRangeRpm: r.speedRangeRpm } : {}),
        ...(r.unbalanceSource === "grade" ? { balanceGrade: r.balanceGrade } : { unbalanceForce: r.unbalanceForce }),
        ...(r.serviceFactor !== null ? { serviceFactor: r.serviceFactor } : {}),
        axis: r.axis,
        unbalanceMode: r.unbalanceMode,
        bearings: r.bearings,
      })),
    })),
    ...(f.checkPoints.length ? { checkPoints: f.checkPoints } : {}),
    ...(Object.keys(criteria).length ? { criteria } : {}),
    ...(Object.keys(band).length ? { soilBand: band } : {}),
    ...(Object.keys(sweep).length ? { sweep } : {}),
    ...(f.transient.length
      ? {
          transient: f.transient.map((t) => ({
            machine: t.machine,
            rotor: t.rotor,
            kind: t.kind,
            ...(t.fromRpm !== null ? { fromRpm: t.fromRpm } : {}),
            ...(t.toRpm !== null ? { toRpm: t.toRpm } : {}),
            durationS: t.durationS,
            case: t.case,
            ...(t.unbalanceMode !== null ? { unbalanceMode: t.unbalanceMode } : {}),
            ...(t.outputPoints !== null ? { outputPoints: t.outputPoints } : {}),
          })),
        }
      : {}),
    ...(acceptances.length ? { acceptances: acceptances.map((a) => ({ checkKey: a.checkKey, justification: a.justification })) } : {}),
  };
}

/** Sets, changes or (with a blank text) withdraws the acceptance of one band check. */
export function withAcceptance(list: readonly AcceptanceForm[], checkKey: string, justification: string): AcceptanceForm[] {
  if (justification === "") return list.filter((a) => a.checkKey !== checkKey);
  if (!list.some((a) => a.checkKey === checkKey)) return [...list, { checkKey, justification }];
  return list.map((a) => (a.checkKey === checkKey ? { checkKey, justification } : a));
}

// ---- the browser's validation (the same limits as the contract's zod schema) ----

// A blank is "required" (a draft may be saved with it; the analysis waits); a value that is
// there but wrong is an error (the draft is not saved). isMissingMessage tells them apart.
export const REQUIRED_PREFIX = "Required";
const required = (what: string) => `${REQUIRED_PREFIX}: ${what}`;
export function isMissingMessage(message: string): boolean {
  return message.startsWith(REQUIRED_PREFIX);
}
const req = (label: string) => yup.number().typeError(`${label} must be a number`).nullable().required(required(`the ${label}`));
const positive = (label: string) => req(label).moreThan(0, `The ${label} must be greater than 0`);
const coordinate = yup.number().typeError("Must be a number").nullable().required(required("a coordinate"));
const vec3 = yup.array().of(coordinate).length(3);
const range = (label: string) =>
  yup
    .array()
    .of(coordinate)
    .length(2)
    .test("ordered", `${label}: 'from' must be below 'to'`, (v) => !v || v[0] == null || v[1] == null || Number(v[1]) > Number(v[0]));
const optionalRatio = (label: string, max: number) =>
  yup.number().typeError(`${label} must be a number`).nullable().min(0, `${label} must be 0 or more`).lessThan(max, `${label} must be below ${max}`);

const L = TRANSIENT_LIMITS;
const optionalSpeed = yup.number().typeError("Must be a number").nullable().min(0, "Must be 0 or more");

const transientRunSchema = yup
  .object({
    machine: yup.string().trim().required(required("the rotor of the run")),
    rotor: yup.string().trim().required(required("the rotor of the run")),
    kind: yup.string().oneOf(["run-up", "coast-down"]),
    fromRpm: optionalSpeed,
    toRpm: optionalSpeed,
    durationS: positive("run duration").max(L.maxDurationS, `The run duration must be at most ${L.maxDurationS} s`),
    case: yup.string().oneOf(["vertical", "horizontal", "rotating", "horizontal-x", "horizontal-y"]),
    unbalanceMode: yup.string().nullable().oneOf(["static", "couple", null]),
    outputPoints: yup
      .number()
      .typeError("Must be a number")
      .nullable()
      .integer("Must be a whole number")
      .min(L.minOutputPoints, `Must be at least ${L.minOutputPoints}`)
      .max(L.maxOutputPoints, `Must be at most ${L.maxOutputPoints}`),
  })
  .test("consistent-with-rotor", "The run does not fit its rotor", function (run) {
    // The form's root is the last ancestor: the run is checked against the machines as typed.
    const root = this.from?.[this.from.length - 1]?.value as Pick<DraftForm, "machines"> | undefined;
    if (!root?.machines || !run) return true;
    const issue = transientRunIssue(root, run as TransientRunForm);
    return issue ? this.createError({ path: `${this.path}.${issue.field}`, message: issue.message }) : true;
  });

export const draftFormSchema = yup.object({
  block: yup.object({
    concreteDensity: positive("concrete density"),
    solids: yup
      .array()
      .of(yup.object({ name: yup.string().trim().required(required("a name for the box")), x: range("x"), y: range("y"), z: range("z"), void: yup.boolean() }))
      .min(1, required("at least one box")),
  }),
  soil: yup.object({
    modulusSource: yup.string().oneOf(["shearModulus", "shearWaveVelocity"]),
    shearModulus: yup
      .number()
      .typeError("Must be a number")
      .nullable()
      .when(["modulusSource", "profile"], { is: (m: string, p: string) => m === "shearModulus" && p !== "layers", then: () => positive("shear modulus") }),
    shearWaveVelocity: yup
      .number()
      .typeError("Must be a number")
      .nullable()
      .when(["modulusSource", "profile"], { is: (m: string, p: string) => m === "shearWaveVelocity" && p !== "layers", then: () => positive("shear-wave velocity") }),
    profile: yup.string().oneOf(["half-space", "stratum", "layers"]),
    stratumThickness: yup
      .number()
      .typeError("Must be a number")
      .nullable()
      .when("profile", { is: "stratum", then: () => positive("depth to rock") }),
    layers: yup.array().when("profile", {
      is: "layers",
      then: (a) =>
        a
          .of(
            yup.object({
              thickness: positive("layer thickness"),
              shearWaveVelocity: yup.number().typeError("Must be a number").nullable().moreThan(0, "Must be greater than 0"),
              shearModulus: yup.number().typeError("Must be a number").nullable().moreThan(0, "Must be greater than 0"),
              density: positive("layer density"),
              poissonRatio: yup.number().typeError("Must be a number").nullable().moreThan(0, "Poisson's ratio must lie in (0, 0.5)").lessThan(0.5, "Poisson's ratio must lie in (0, 0.5)"),
            }),
          )
          .min(1, required("at least one layer")),
    }),
    poissonRatio: req("Poisson's ratio").moreThan(0, "Poisson's ratio must lie in (0, 0.5)").lessThan(0.5, "Poisson's ratio must lie in (0, 0.5)"),
    density: positive("soil density"),
    materialDamping: optionalRatio("Material damping", 0.5),
    allowableBearingPressure: positive("allowable bearing pressure"),
    embedmentDepth: yup.number().typeError("Must be a number").nullable().min(0, "Must be 0 or more"),
    sidewallContactHeight: yup.number().typeError("Must be a number").nullable().min(0, "Must be 0 or more"),
  }),
  impedance: yup.object({
    method: yup.string(),
    // springs on a base block: blanks make the draft incomplete, like the block's boxes
    springsBase: yup
      .object()
      .default(undefined)
      .when("method", {
        is: "springs",
        then: () =>
          yup
            .object({
              restsOn: yup.string().oneOf(["floor", "base"]),
              x: yup.array().when("restsOn", { is: "base", then: () => range("x") }),
              y: yup.array().when("restsOn", { is: "base", then: () => range("y") }),
              z: yup.array().when("restsOn", { is: "base", then: () => range("z") }),
              concreteDensity: yup.number().typeError("Must be a number").nullable().moreThan(0, "Must be greater than 0"),
            })
            .default(undefined),
      }),
    // method "piles": blanks make the draft incomplete (it saves, the analysis waits)
    piles: yup
      .object()
      .default(undefined)
      .when("method", {
        is: "piles",
        then: () =>
          yup.object({
            diameter: positive("pile diameter"),
            length: positive("pile length"),
            youngsModulus: positive("Young's modulus of the pile"),
            pileDensity: yup.number().typeError("Must be a number").nullable().moreThan(0, "Must be greater than 0"),
            heads: yup.array().of(yup.object({ x: coordinate, y: coordinate })).min(2, required("at least two piles")),
          }),
      }),
  }),
  machines: yup
    .array()
    .of(
      yup.object({
        name: yup.string().trim().required(required("a name for the machine")),
        mass: positive("machine mass"),
        cg: vec3,
        datum: yup
          .object({ placed: yup.boolean(), origin: yup.array().when("placed", { is: true, then: () => vec3 }) })
          .default(undefined),
        rotors: yup.array().of(
          yup.object({
            name: yup.string().trim().required(required("a name for the rotor")),
            mass: positive("rotor mass"),
            speedRpm: positive("rated speed"),
            unbalanceSource: yup.string().oneOf(["grade", "force"]),
            balanceGrade: yup
              .number()
              .typeError("Must be a number")
              .nullable()
              .when("unbalanceSource", { is: "grade", then: () => positive("balance grade") }),
            unbalanceForce: yup
              .number()
              .typeError("Must be a number")
              .nullable()
              .when("unbalanceSource", { is: "force", then: () => positive("vendor force") }),
            serviceFactor: yup.number().typeError("Must be a number").nullable().moreThan(0, "Must be greater than 0"),
            bearings: yup.array().of(vec3).min(1, required("at least one bearing")),
          }),
        ),
      }),
    )
    .min(1, required("at least one machine")),
  transient: yup.array().of(transientRunSchema).max(L.maxRuns, `At most ${L.maxRuns} runs`),
  acceptances: yup.array().of(
    yup.object({
      checkKey: yup.string().required(),
      // blank withdraws the acceptance; otherwise the contract's bounds (modules/calc/schema.ts)
      justification: yup
        .string()
        .test("written", `Write the justification (at least ${ACCEPTANCE_JUSTIFICATION_MIN} characters), or clear it`, (v) => !v || v.trim() === "" || v.trim().length >= ACCEPTANCE_JUSTIFICATION_MIN)
        .max(ACCEPTANCE_JUSTIFICATION_MAX, `At most ${ACCEPTANCE_JUSTIFICATION_MAX} characters`),
    }),
  ),
});

/** Every message in a nested error object (Formik's `errors`), depth first. */
function errorMessages(errors: unknown): string[] {
  if (typeof errors === "string") return [errors];
  if (errors === null || typeof errors !== "object") return [];
  return Object.values(errors).flatMap(errorMessages);
}

/**
 * What the form's errors mean for saving (issue 18): "complete" (no errors: it analyses),
 * "incomplete" (only blanks: it saves as a draft, the analysis waits), "invalid" (a value
 * that is there is wrong, e.g. a negative mass: not saved until it is fixed).
 */
export function formCompleteness(errors: unknown): "complete" | "incomplete" | "invalid" {
  const messages = errorMessages(errors);
  if (!messages.length) return "complete";
  return messages.every(isMissingMessage) ? "incomplete" : "invalid";
}

/** The contract's `impedance.base` from the form (defaults left out, so a stored input reads back as typed). */
function springsBaseInput(b: SpringsBaseForm, imp: DraftForm["impedance"]) {
  const support =
    b.support === "user"
      ? { method: "user" as const, stiffness: imp.stiffness, dampingRatio: imp.dampingRatio }
      : b.support === "equivalent-radius"
        ? { method: "equivalent-radius" as const }
        : imp.gazetasDynamic !== "published"
          ? { method: "gazetas" as const, gazetasDynamic: imp.gazetasDynamic }
          : undefined;
  return {
    x: b.x,
    y: b.y,
    z: b.z,
    ...(b.concreteDensity !== null ? { concreteDensity: b.concreteDensity } : {}),
    ...(support ? { support } : {}),
  };
}

/** The contract's "piles" impedance from the form (defaults left out, so a stored input reads back as typed). */
function pilesInput(p: NonNullable<DraftForm["impedance"]["piles"]>) {
  return {
    method: "piles" as const,
    piles: p.heads.map((h) => ({ x: h.x, y: h.y })),
    diameter: p.diameter,
    length: p.length,
    youngsModulus: p.youngsModulus,
    ...(p.pileDensity !== undefined && p.pileDensity !== null ? { pileDensity: p.pileDensity } : {}),
    tip: p.tip,
    ...(p.soilProfile !== "uniform" ? { soilProfile: p.soilProfile } : {}),
    ...(p.interaction !== "dynamic-factors" ? { interaction: p.interaction } : {}),
  };
}

/**
 * The form field of an engine issue path where the two differ (method "piles": the engine's
 * impedance.diameter is the form's impedance.piles.diameter, impedance.piles[1] the second
 * pile's row); other paths are returned unchanged.
 */
export function formFieldOfIssue(path: string, method: DraftForm["impedance"]["method"]): string {
  if (method === "springs") {
    // the base block's fields (engine impedance.base.*) live in impedance.springsBase; a "user" support's springs in impedance.stiffness / dampingRatio
    const support = /^impedance\.base\.support\.(stiffness|dampingRatio)\.(\w+)$/.exec(path);
    if (support) return `impedance.${support[1]}.${support[2]}`;
    const base = /^impedance\.base\.(x|y|z|concreteDensity)(?:\[(\d)\])?$/.exec(path);
    if (base) return `impedance.springsBase.${base[1]}${base[2] !== undefined ? `.${base[2]}` : ""}`;
    return path.replace(/^impedance\.base\b/, "impedance.springsBase");
  }
  if (method !== "piles") return path;
  const head = /^impedance\.piles\[(\d+)\](?:\.(x|y))?$/.exec(path);
  if (head) return `impedance.piles.heads.${head[1]}.${head[2] ?? "x"}`;
  const field = /^impedance\.(diameter|length|youngsModulus|tip|soilProfile|interaction)$/.exec(path);
  return field ? `impedance.piles.${field[1]}` : path;
}
