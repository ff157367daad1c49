// The comparison of two revisions as a checker reads it: rows named by the check or the
// quantity (not by document paths), grouped by what an engineer looks for first, values in the
// project's display units through the one significant-figure formatter, numeric noise left out
// by a stated rule, and every row keeping its raw path for the download and the tooltip.
//
// Built on diffRevisions (diff.ts): the raw difference is computed once, for the two chosen
// revisions only, without the long sweep and speed-ramp series.
import { checkVerdict, type CheckResult, type CheckVerdict } from "@/modules/calc";
import { packageUnit, toPackageUnit, type PackageKind } from "@/modules/calc-package/package-units";
import { formatSignificant, type UnitSystemKey } from "@/modules/units";
import { diffRevisions, type ComparableResult, type DiffEntry, type LeafValue } from "./diff";

/**
 * The noise rule: a change of a number is listed only when |new − old| exceeds BOTH the
 * relative tolerance times the larger magnitude AND the absolute floor of its quantity kind
 * (in stored SI units). The floors sit far below any design value and any display
 * resolution of the desk (chosen by us as common practice, not taken from a standard): they
 * drop the round-off of a re-run (a displacement of 3e-16 m becoming 5e-16 m is a +67 %
 * "change" of nothing), never a real change of a design quantity.
 */
export const COMPARE_NOISE = {
  relativeTolerance: 1e-6,
  floors: {
    displacement: 1e-9, // 1 nm (0.001 µm)
    velocity: 1e-6, // 0.001 mm/s
    length: 1e-6, // 1 µm
    frequency: 1e-4, // Hz
    speed: 1e-3, // rpm
    ratio: 1e-6,
    force: 1e-3, // N
    largeForce: 1e-3, // N
    mass: 1e-3, // kg
    largeMass: 1e-3, // kg
    pressure: 1e-3, // Pa
    modulus: 1, // Pa
    stiffness: 1e-3, // N/m
    rotationalStiffness: 1e-3, // N·m/rad
    dashpot: 1e-6, // N·s/m
    rotationalDashpot: 1e-6,
    time: 1e-6, // s
    default: 1e-12,
  } as Partial<Record<PackageKind | "default", number>> & { default: number },
} as const;

/** Stated on the page and in README. */
export const COMPARE_NOISE_TEXT =
  "a number counts as changed only when its change exceeds both 1e-6 of the larger value and a floor per quantity (1 nm displacement, 0.001 mm/s velocity, 1 µm length, 1e-4 Hz, 1e-3 rpm, 1e-6 on ratios)";

export function isNoise(kind: PackageKind | undefined, a: number, b: number): boolean {
  if (a === b) return true;
  if (!Number.isFinite(a) || !Number.isFinite(b)) return Object.is(a, b);
  const d = Math.abs(a - b);
  const floor = (kind && COMPARE_NOISE.floors[kind]) ?? COMPARE_NOISE.floors.default;
  return d <= floor || d <= COMPARE_NOISE.relativeTolerance * Math.max(Math.abs(a), Math.abs(b));
}

export type CompareGroup = "verdicts" | "frequencies" | "amplitudes" | "inputs" | "results";

export const COMPARE_GROUP_TITLES: Record<CompareGroup, string> = {
  verdicts: "Verdicts",
  frequencies: "Frequencies and ratios",
  amplitudes: "Governing amplitudes",
  inputs: "Inputs (criteria first)",
  results: "Other results",
};

/** Which side of a check moved between the revisions. */
export type CheckMoved = "limit" | "value" | "both" | "neither";

export interface VerdictRow {
  key: string;
  label: string;
  source: string;
  quantity: PackageKind;
  unit: string;
  comparison: "min" | "max";
  oldVerdict?: CheckVerdict;
  newVerdict?: CheckVerdict;
  flipped: boolean;
  /** The verdict got better (fail -> accepted -> pass) or worse. */
  direction: "better" | "worse" | "same";
  moved: CheckMoved;
  oldValue?: number;
  newValue?: number;
  oldLimit?: number;
  newLimit?: number;
  /** Display texts (display units, formatSignificant with 4 figures). */
  oldValueText: string;
  newValueText: string;
  oldLimitText: string;
  newLimitText: string;
  /** The value moved to the unsafe side although the verdict got better or stayed pass. */
  worseWhileBetter: boolean;
  soilCase?: "lower" | "upper";
  soilFactor?: number;
  justification?: string;
  /** Where the check is in the result document. */
  path: string;
}

export interface QuantityRow {
  group: Exclude<CompareGroup, "verdicts">;
  label: string;
  path: string;
  change: DiffEntry["kind"];
  quantity?: PackageKind;
  unit: string;
  old?: LeafValue;
  new?: LeafValue;
  oldText: string;
  newText: string;
  /** new − old in display units, and per cent of |old|. */
  deltaText: string;
  percentChange?: number;
  /** A governing amplitude that grew while the verdicts of its kind stayed pass or improved. */
  worseWhileBetter?: boolean;
}

export interface ReadableDiff {
  units: UnitSystemKey;
  noise: string;
  /** Flipped first (newly failing, then accepted, then passing), then changed values with the same verdict. */
  verdicts: VerdictRow[];
  frequencies: QuantityRow[];
  amplitudes: QuantityRow[];
  /** Criteria (as entered and as used) first, then the other inputs. */
  inputs: QuantityRow[];
  results: QuantityRow[];
  /** Changes left out as numeric noise, so the page can say how many. */
  noiseCount: number;
}

// ---------------------------------------------------------------- paths

type Segment = { prop: string } | { id: string } | { index: number };

/** `a.b["x / y"].c[2]` -> [{prop:a},{prop:b},{id:"x / y"},{prop:c},{index:2}]. */
export function parsePath(path: string): Segment[] {
  const out: Segment[] = [];
  const re = /\.?([^.[\]]+)|\[("(?:[^"\\]|\\.)*"|\d+)\]/g;
  for (const m of path.matchAll(re)) {
    if (m[1] !== undefined) out.push({ prop: m[1] });
    else if (m[2]?.startsWith('"')) out.push({ id: JSON.parse(m[2]) as string });
    else out.push({ index: Number(m[2]) });
  }
  return out;
}

// method "piles" (issue 16): the pile group's inputs under `impedance` read in the trade's words
const pileWords: Record<string, string> = {
  youngsModulus: "Young's modulus of the pile Ep",
  pileDensity: "pile density",
  diameter: "pile diameter",
  length: "pile length",
  tip: "pile tip",
  soilProfile: "soil along the shaft",
  interaction: "pile-to-pile interaction",
  piles: "pile",
};

// springs on a base block (engine 1.8.0): the base's inputs under `impedance`
const baseWords: Record<string, string> = {
  base: "base block under the springs",
  support: "soil under the base",
};

const words: Record<string, string> = {
  groundForce: "force into the ground",
  baseDisplacementPeak: "base displacement",
  springHeight: "spring height",
  twoMassVerticalHz: "two-mass vertical frequency",
  rigidFloorHighestHz: "highest mode on a rigid floor",
  isolatorModesHighestHz: "highest mode of the block on its springs",
  soilStiffness: "soil stiffness under the base",
  soilStaticStiffness: "soil static stiffness under the base",
  soilDashpot: "soil dashpot under the base",
  upperShare: "block's share of the mode",
  baseShape: "base shape",
  poissonRatio: "Poisson's ratio",
  shearModulus: "shear modulus G",
  shearWaveVelocity: "shear-wave velocity",
  frequencyHz: "natural frequency",
  frequenciesHz: "natural frequency",
  frequencyRatios: "frequency ratio",
  ratios: "frequency ratio",
  massRatio: "block mass over machine mass",
  staticBearingPressure: "static bearing pressure",
  displacementPeak: "peak displacement",
  velocityPeak: "peak velocity",
  displacementPeakOverSpeedRange: "peak displacement over the speed range",
  velocityPeakOverSpeedRange: "peak velocity over the speed range",
  maxOverSpeedRange: "largest over the speed range",
  overSpeedRange: "over the speed range",
  peakDisplacement: "peak displacement",
  peakVelocity: "peak velocity",
  frequencySeparation: "frequency separation",
  maxDisplacementPeak: "allowed peak displacement",
  maxVelocityPeak: "allowed peak velocity",
  minMassRatio: "least block-to-machine mass ratio",
  maxEccentricity: "allowed eccentricity",
  maxBearingRatio: "allowed bearing-pressure ratio",
  speedRpm: "speed",
  forceAmplitude: "unbalance force",
  transmittedForce: "transmitted force",
  dampingRatio: "damping ratio",
  staticStiffness: "static stiffness",
  blockMass: "block mass",
  machineMass: "machine mass",
  totalMass: "total mass",
  baseArea: "base area",
  cg: "centre of gravity",
};

// Containers whose member is named by the id that follows: the container word is dropped.
const containers = new Set(["machines", "rotors", "solids", "boxes", "checkPoints", "cases", "points", "checks", "transient", "bearings", "frequencyRatios"]);

function camelWords(s: string): string {
  return s.replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase();
}

const axes = ["x", "y", "z"];
const dofs = ["x", "y", "z", "rx", "ry", "rz"];
const matrices = new Set(["inertiaAtCg", "massMatrix"]);

/** A readable name of a document path: `machines["Motor"].rotors["rotor"].mass` -> "Motor · rotor · mass". */
export function labelOfPath(path: string): string {
  const segs = parsePath(path);
  const parts: string[] = [];
  for (let i = 0; i < segs.length; i += 1) {
    const s = segs[i] as Segment;
    const next = segs[i + 1];
    if ("prop" in s) {
      if (next && "id" in next && containers.has(s.prop)) continue;
      if (s.prop === "modes" && next && "index" in next) {
        parts.push(`mode ${next.index + 1}`);
        i += 1;
        continue;
      }
      const first = segs[0];
      const underImpedance = first !== undefined && "prop" in first && first.prop === "impedance" && i > 0;
      parts.push((underImpedance ? (pileWords[s.prop] ?? baseWords[s.prop]) : undefined) ?? words[s.prop] ?? camelWords(s.prop));
    } else if ("id" in s) parts.push(s.id);
    else {
      const prev = segs[i - 1];
      const prop = prev && "prop" in prev ? prev.prop : "";
      const after = segs[i + 1];
      if (/Hz$|[Rr]atios$/.test(prop)) parts.push(`mode ${s.index + 1}`);
      else if (matrices.has(prop) && after && "index" in after) {
        parts.push(`row ${s.index + 1}, column ${after.index + 1}`);
        i += 1;
      } else if (prop === "bearings") {
        parts.pop();
        parts.push(`bearing ${s.index + 1}`);
        if (after && "index" in after) {
          parts.push(axes[after.index] ?? `no. ${after.index + 1}`);
          i += 1;
        }
      } else if (prop === "shape") parts.push(dofs[s.index] ?? `no. ${s.index + 1}`);
      else if (/^[xyz]$/.test(prop) && s.index < 2) parts.push(s.index === 0 ? "from" : "to");
      else if (prop === "eccentricity" || prop === "baseDimensions") parts.push(`along ${axes[s.index] ?? s.index + 1}`);
      else if (/position|Peak$|cg|origin|transmittedForce|groundForce|dimensions/.test(prop) && s.index < 3) parts.push(axes[s.index] as string);
      else parts.push(`no. ${s.index + 1}`);
    }
  }
  return parts.join(" · ");
}

// ---------------------------------------------------------------- quantity kinds

const kindByKey: Record<string, PackageKind> = {
  displacementPeak: "displacement",
  displacementPeakOverSpeedRange: "displacement",
  maxDisplacementPeak: "displacement",
  amplitude: "displacement",
  sixDofAmplitudeAtO: "displacement",
  velocityPeak: "velocity",
  velocityPeakOverSpeedRange: "velocity",
  maxVelocityPeak: "velocity",
  frequencyHz: "frequency",
  frequenciesHz: "frequency",
  closedFormHz: "frequency",
  nearestModeHz: "frequency",
  referenceHz: "frequency",
  naturalFrequenciesHz: "frequency",
  evaluatedAtHz: "frequency",
  fromHz: "frequency",
  toHz: "frequency",
  ratedHz: "frequency",
  speedRpm: "speed",
  atRpm: "speed",
  velocityAtRpm: "speed",
  fromRpm: "speed",
  toRpm: "speed",
  speedRangeRpm: "speed",
  frequencyRatios: "ratio",
  ratios: "ratio",
  massRatio: "ratio",
  transmissibility: "ratio",
  sixDofTransmissibility: "ratio",
  dampingRatio: "ratio",
  poissonRatio: "ratio",
  eccentricity: "ratio",
  frequencySeparation: "ratio",
  minMassRatio: "ratio",
  maxEccentricity: "ratio",
  maxBearingRatio: "ratio",
  materialDamping: "ratio",
  factor: "ratio",
  lowerFactor: "ratio",
  upperFactor: "ratio",
  participation: "ratio",
  mass: "mass",
  blockMass: "largeMass",
  machineMass: "largeMass",
  totalMass: "largeMass",
  staticBearingPressure: "pressure",
  allowableBearingPressure: "pressure",
  shearModulus: "modulus",
  shearWaveVelocity: "waveSpeed",
  density: "density",
  baseArea: "area",
  forceAmplitude: "force",
  transmittedForce: "force",
  durationS: "time",
  atTimeS: "time",
  timeStepS: "time",
  angularAcceleration: "angularAcceleration",
  position: "length",
  cg: "length",
  origin: "length",
  x: "length",
  y: "length",
  z: "length",
  size: "length",
  embedmentDepth: "length",
  thickness: "length",
  sidewallContactHeight: "length",
  balanceGrade: "balanceGrade",
  unbalanceForce: "force",
  concreteDensity: "density",
  serviceFactor: "ratio",
  baseThickness: "length",
  baseDimensions: "length",
  youngsModulus: "modulus",
  pileDensity: "density",
  activeLength: "length",
  pileVerticalStiffness: "stiffness",
  pileLateralStiffness: "stiffness",
  pileRockingStiffness: "rotationalStiffness",
  pileCrossStiffness: "couplingStiffness",
  groundForce: "force",
  baseDisplacementPeak: "displacement",
  springHeight: "length",
  dimensions: "length",
  twoMassVerticalHz: "frequency",
  rigidFloorHighestHz: "frequency",
  isolatorModesHighestHz: "frequency",
  highestNaturalFrequencyHz: "frequency",
  verticalFrequencyHz: "frequency",
  staticDeflection: "length",
  staticLoads: "force",
  upperShare: "ratio",
};

const rotational = new Set(["rx", "ry", "rz"]);

/** The quantity kind of a leaf, from the last property names of its path; undefined when unknown. */
export function kindOfPath(path: string): PackageKind | undefined {
  const segs = parsePath(path);
  const props = segs.filter((s): s is { prop: string } => "prop" in s).map((s) => s.prop);
  const last = props.at(-1);
  const parent = props.at(-2);
  if (!last) return undefined;
  // method "piles": the pile's diameter and length (the words are common, so only under impedance)
  if (props[0] === "impedance" && (last === "diameter" || last === "length")) return "length";
  if (parent === "stiffness" || parent === "staticStiffness" || parent === "soilStiffness" || parent === "soilStaticStiffness") return rotational.has(last) ? "rotationalStiffness" : "stiffness";
  if (parent === "dashpot" || parent === "soilDashpot") return rotational.has(last) ? "rotationalDashpot" : "dashpot";
  // springs on a base block: the base's mass (a large mass; a rotor's `mass` stays "mass")
  if (parent === "base" && last === "mass") return "largeMass";
  if (parent === "dampingRatio" || parent === "participation") return "ratio";
  if ((parent === "peakDisplacement" || parent === "peakVelocity") && last === "value") return parent === "peakDisplacement" ? "displacement" : "velocity";
  if (parent === "steadyStateMax" && last === "displacementPeak") return "displacement";
  return kindByKey[last];
}

/** A check's quantity from its unit (as the desk's checks table reads it). */
export function kindOfCheck(c: Pick<CheckResult, "unit">): PackageKind {
  return c.unit === "m" ? "displacement" : c.unit === "m/s" ? "velocity" : "ratio";
}

export function displayText(kind: PackageKind | undefined, v: LeafValue | undefined, system: UnitSystemKey): string {
  if (v === undefined || v === null) return "—";
  if (typeof v !== "number") return String(v);
  return formatSignificant(kind ? toPackageUnit(kind, v, system) : v, { digits: 4 });
}

export function displayUnit(kind: PackageKind | undefined, system: UnitSystemKey): string {
  return kind ? packageUnit(kind, system).symbol : "";
}

// ---------------------------------------------------------------- verdicts

const verdictRank: Record<CheckVerdict, number> = { fail: 0, accepted: 1, pass: 2, "not-applicable": 3 };

function checkKey(c: CheckResult): string {
  return c.key ?? `${c.id}/${c.label}`;
}

/** The value moved to the unsafe side: up against a maximum, down against a minimum. */
function gotWorse(comparison: "min" | "max", kind: PackageKind, a: number, b: number): boolean {
  if (isNoise(kind, a, b)) return false;
  return comparison === "max" ? b > a : b < a;
}

export function compareChecks(oldChecks: readonly CheckResult[], newChecks: readonly CheckResult[], system: UnitSystemKey): VerdictRow[] {
  const before = new Map(oldChecks.map((c) => [checkKey(c), c]));
  const after = new Map(newChecks.map((c) => [checkKey(c), c]));
  const keys = [...after.keys(), ...[...before.keys()].filter((k) => !after.has(k))];
  const rows: VerdictRow[] = [];
  for (const key of keys) {
    const o = before.get(key);
    const n = after.get(key);
    const c = (n ?? o) as CheckResult;
    const kind = kindOfCheck(c);
    const comparison = c.comparison ?? "max";
    const oldVerdict = o ? checkVerdict(o) : undefined;
    const newVerdict = n ? checkVerdict(n) : undefined;
    const valueMoved = !!o && !!n && !isNoise(kind, o.value, n.value);
    const limitMoved = !!o && !!n && !isNoise(kind, o.limit, n.limit);
    const flipped = !!o && !!n && oldVerdict !== newVerdict;
    if (o && n && !flipped && !valueMoved && !limitMoved && o.acceptance?.justification === n.acceptance?.justification) continue;
    const direction = !oldVerdict || !newVerdict || oldVerdict === newVerdict ? "same" : verdictRank[newVerdict] > verdictRank[oldVerdict] ? "better" : "worse";
    const worse = !!o && !!n && gotWorse(comparison, kind, o.value, n.value);
    const t = (v: number | undefined) => displayText(kind, v, system);
    rows.push({
      key,
      label: c.label,
      source: c.source,
      quantity: kind,
      unit: displayUnit(kind, system),
      comparison,
      ...(oldVerdict ? { oldVerdict } : {}),
      ...(newVerdict ? { newVerdict } : {}),
      flipped,
      direction,
      moved: valueMoved && limitMoved ? "both" : valueMoved ? "value" : limitMoved ? "limit" : "neither",
      ...(o ? { oldValue: o.value, oldLimit: o.limit } : {}),
      ...(n ? { newValue: n.value, newLimit: n.limit } : {}),
      oldValueText: t(o?.value),
      newValueText: t(n?.value),
      oldLimitText: t(o?.limit),
      newLimitText: t(n?.limit),
      worseWhileBetter: worse && (direction === "better" || (direction === "same" && newVerdict === "pass")),
      ...(c.soilCase ? { soilCase: c.soilCase } : {}),
      ...(c.soilFactor !== undefined ? { soilFactor: c.soilFactor } : {}),
      ...(n?.acceptance ? { justification: n.acceptance.justification } : {}),
      path: `checks[${JSON.stringify(key)}]`,
    });
  }
  // Flipped first (newly failing, then newly accepted, then newly passing), then added or
  // removed checks, then same verdict with moved numbers (worse first).
  const rank = (r: VerdictRow) => (r.flipped ? verdictRank[r.newVerdict as CheckVerdict] : !r.oldVerdict || !r.newVerdict ? 3 : r.worseWhileBetter ? 4 : 5);
  return rows.sort((x, y) => rank(x) - rank(y) || x.label.localeCompare(y.label));
}

// ---------------------------------------------------------------- quantity rows

function groupOfResultPath(path: string): Exclude<CompareGroup, "verdicts" | "inputs"> | "skip" | "criteria" {
  if (path.startsWith("checks[")) return "skip"; // shown as verdict rows
  if (path.startsWith("criteria")) return "criteria";
  if (/^modes\[\d+\]\.frequencyHz$/.test(path) || /frequencyRatios|frequenciesHz|\.ratios\[|massRatio|transmissibility$|naturalFrequenciesHz|crossCheck\..*Hz$/.test(path)) return "frequencies";
  if (/displacementPeak|velocityPeak|peakDisplacement|peakVelocity|governing\.|amplitude$/.test(path) && !/^sweep/.test(path)) return "amplitudes";
  return "results";
}

function quantityRow(e: DiffEntry, group: QuantityRow["group"], system: UnitSystemKey, labelPrefix = ""): QuantityRow {
  const kind = kindOfPath(e.path);
  const num = typeof e.old === "number" && typeof e.new === "number";
  const delta = num ? (kind ? toPackageUnit(kind, e.new as number, system) - toPackageUnit(kind, e.old as number, system) : (e.new as number) - (e.old as number)) : undefined;
  return {
    group,
    label: labelPrefix + labelOfPath(e.path),
    path: e.path,
    change: e.kind,
    ...(kind ? { quantity: kind } : {}),
    unit: typeof (e.new ?? e.old) === "number" ? displayUnit(kind, system) : "",
    ...(e.old !== undefined ? { old: e.old } : {}),
    ...(e.new !== undefined ? { new: e.new } : {}),
    oldText: displayText(kind, e.old, system),
    newText: displayText(kind, e.new, system),
    deltaText: delta === undefined ? "" : `${delta > 0 ? "+" : ""}${formatSignificant(delta, { digits: 3 })}`,
    ...(e.percentChange !== undefined ? { percentChange: e.percentChange } : {}),
  };
}

// `criteria.<name>.value|unit|source` of the result: the criterion as the engine used it
// (defaults filled in), named by the criterion and shown in its quantity's unit.
function criterionUsedRow(e: DiffEntry, system: UnitSystemKey): QuantityRow {
  const props = parsePath(e.path).filter((s): s is { prop: string } => "prop" in s).map((s) => s.prop);
  const name = props[1] ?? "";
  const field = props[2] ?? "value";
  const row = quantityRow(e, "inputs", system);
  const kind = field === "value" ? kindByKey[name] : undefined;
  const typed: QuantityRow = { ...row, label: `criterion as used · ${words[name] ?? camelWords(name)}${field === "value" ? "" : ` · ${field}`}` };
  if (!kind) return typed;
  const delta = typeof e.old === "number" && typeof e.new === "number" ? toPackageUnit(kind, e.new, system) - toPackageUnit(kind, e.old, system) : undefined;
  return {
    ...typed,
    quantity: kind,
    unit: displayUnit(kind, system),
    oldText: displayText(kind, e.old, system),
    newText: displayText(kind, e.new, system),
    deltaText: delta === undefined ? "" : `${delta > 0 ? "+" : ""}${formatSignificant(delta, { digits: 3 })}`,
  };
}

function isNoiseEntry(e: DiffEntry): boolean {
  return e.kind === "changed" && typeof e.old === "number" && typeof e.new === "number" && isNoise(kindOfPath(e.path), e.old, e.new);
}

/** Criteria (limits) first among the inputs: they decide verdicts without any result moving. */
function inputRank(path: string): number {
  if (path.startsWith("criteria")) return 0;
  if (path.startsWith("soilBand") || path.startsWith("acceptances")) return 1;
  return 2;
}

export interface RevisionSide {
  input: unknown;
  /** The sweep is not needed (and not read by the route). */
  result: ComparableResult;
}

/** The two revisions compared for a reader; the older one first. */
export function readableDiff(older: RevisionSide, newer: RevisionSide, system: UnitSystemKey): ReadableDiff {
  // Exact comparison underneath; the noise rule above decides what is listed.
  const raw = diffRevisions(older, newer, { relativeTolerance: 0 });
  let noiseCount = 0;
  const verdicts = compareChecks(older.result.checks, newer.result.checks, system);
  const frequencies: QuantityRow[] = [];
  const amplitudes: QuantityRow[] = [];
  const results: QuantityRow[] = [];
  const criteriaUsed: QuantityRow[] = [];
  for (const e of raw.result.entries) {
    const g = groupOfResultPath(e.path);
    if (g === "skip") continue;
    if (isNoiseEntry(e)) {
      noiseCount += 1;
      continue;
    }
    if (g === "criteria") criteriaUsed.push(criterionUsedRow(e, system));
    else (g === "frequencies" ? frequencies : g === "amplitudes" ? amplitudes : results).push(quantityRow(e, g, system));
  }
  const inputs: QuantityRow[] = [];
  for (const e of raw.input.entries) {
    if (isNoiseEntry(e)) {
      noiseCount += 1;
      continue;
    }
    inputs.push(quantityRow(e, "inputs", system));
  }
  inputs.sort((x, y) => inputRank(x.path) - inputRank(y.path));
  // An amplitude that grew while no verdict of its kind got worse: the checker should see it.
  const verdictOfKindWorse = (k: PackageKind | undefined) => verdicts.some((v) => v.quantity === k && v.direction === "worse");
  for (const a of amplitudes) {
    if (typeof a.old === "number" && typeof a.new === "number" && Math.abs(a.new) > Math.abs(a.old) && !verdictOfKindWorse(a.quantity)) a.worseWhileBetter = true;
  }
  // A frequency ratio nearer resonance (|r − 1| smaller) or a smaller mass ratio, while no
  // separation or mass-ratio verdict got worse.
  const idWorse = (prefix: string) => verdicts.some((v) => v.key.startsWith(prefix) && v.direction === "worse");
  for (const f of frequencies) {
    if (typeof f.old !== "number" || typeof f.new !== "number") continue;
    if (/frequencyRatios|\.ratios\[/.test(f.path) && Math.abs(f.new - 1) < Math.abs(f.old - 1) && !idWorse("frequency-separation")) f.worseWhileBetter = true;
    if (f.path === "massProperties.massRatio" && f.new < f.old && !idWorse("mass-ratio")) f.worseWhileBetter = true;
  }
  const criteriaFirst = [...inputs.filter((r) => inputRank(r.path) === 0), ...criteriaUsed, ...inputs.filter((r) => inputRank(r.path) > 0)];
  return { units: system, noise: COMPARE_NOISE_TEXT, verdicts, frequencies, amplitudes, inputs: criteriaFirst, results, noiseCount };
}

// ---------------------------------------------------------------- download

// A text cell a spreadsheet would read as a formula gets an apostrophe in front (a negative
// number shown as text, "-3.20", is left as it is).
function csvCell(v: unknown): string {
  let s = v === undefined || v === null ? "" : String(v);
  if (typeof v === "string" && /^([=+@\t\r]|-(?![0-9.]))/.test(s)) s = `'${s}`;
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/**
 * The comparison as CSV: one row per listed change, grouped as on the page, with the label,
 * the raw path, the stored (SI) values and the shown values with their unit. Text cells that a
 * spreadsheet would read as a formula are prefixed with an apostrophe.
 */
export function readableDiffCsv(d: ReadableDiff): string {
  const head = ["group", "label", "path", "change", "old_si", "new_si", "old_shown", "new_shown", "unit", "old_limit_shown", "new_limit_shown", "old_verdict", "new_verdict", "moved", "marked_worse_while_better", "soil_bound", "justification"];
  const lines = [head.join(",")];
  for (const v of d.verdicts) {
    lines.push(
      [
        "verdicts",
        v.label,
        v.path,
        v.flipped ? "verdict changed" : !v.oldVerdict ? "added" : !v.newVerdict ? "removed" : "changed",
        v.oldValue,
        v.newValue,
        v.oldValueText,
        v.newValueText,
        v.unit,
        v.oldLimitText,
        v.newLimitText,
        v.oldVerdict,
        v.newVerdict,
        v.moved,
        v.worseWhileBetter ? "yes" : "",
        v.soilCase ?? "",
        v.justification ?? "",
      ]
        .map(csvCell)
        .join(","),
    );
  }
  for (const r of [...d.frequencies, ...d.amplitudes, ...d.inputs, ...d.results]) {
    lines.push([r.group, r.label, r.path, r.change, r.old, r.new, r.oldText, r.newText, r.unit, "", "", "", "", "", r.worseWhileBetter ? "yes" : "", "", ""].map(csvCell).join(","));
  }
  return `${lines.join("\r\n")}\r\n`;
}
