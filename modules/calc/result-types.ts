// Analysis result of calc-contract.md version 1. Fields beyond the contract are optional
// additions (the contract allows adding optional fields); none changes a contract field.
import type { Dof6, DofKey } from "./dof";
import type { Vec3 } from "./vec3";

/** Horizontal shafts (x, y): vertical, horizontal, rotating. Vertical shafts (z): horizontal-x, horizontal-y, rotating. */
export type LoadCaseName = "vertical" | "horizontal" | "rotating" | "horizontal-x" | "horizontal-y";
export type UnbalanceModeName = "static" | "couple";

export interface MassPropertiesResult {
  blockMass: number;
  machineMass: number;
  totalMass: number;
  /** Combined centre of gravity, in the input's coordinates. */
  cg: Vec3;
  /** Combined inertia tensor about the combined centre of gravity (kg m^2). */
  inertiaAtCg: number[][];
  baseArea: number;
  /** Offset of the combined cg from O over the base length in x and width in y (signed). */
  eccentricity: [number, number];
  massRatio: number;
  staticBearingPressure: number;
  /** O (centroid of the base contact area at the underside), in the input's coordinates. */
  origin?: Vec3;
  /** Base length in x and width in y: the bounding rectangle of the contact area (m). */
  baseDimensions?: [number, number];
  /** Second moments of the contact area about the axes through O parallel to x and y (m^4). */
  baseMomentOfArea?: { aboutX: number; aboutY: number };
  /** 6 x 6 mass matrix about O in the order x, y, z, rx, ry, rz. */
  massMatrix?: number[][];
  /** Height of the thinnest solid resting on the soil (m). */
  baseThickness?: number;
}

/** One off-diagonal term K_ij, C_ij (i before j in x, y, z, rx, ry, rz) of a coupled support. */
export interface ImpedanceCouplingTerm {
  dofs: [DofKey, DofKey];
  /** N/rad (translation-rotation) or N m/rad (rotation-rotation) or N/m. */
  stiffness: number;
  dashpot: number;
}

export interface ImpedanceResult {
  method: "equivalent-radius" | "gazetas" | "user" | "springs" | "piles";
  staticStiffness: Dof6;
  stiffness: Dof6;
  dampingRatio: Dof6;
  /** Dashpot coefficients at the evaluation frequency (N s/m, N m s/rad). */
  dashpot?: Dof6;
  /** Frequency at which `stiffness`, `dampingRatio` and `dashpot` are evaluated (first rotor's rated speed, 0 without rotors). */
  evaluatedAtHz?: number;
  materialDamping?: number;
  shearModulus?: number;
  shearWaveVelocity?: number;
  /** Method-specific intermediate values (equivalent radii, mass ratios, Gazetas L, B, chi ...). */
  details?: Record<string, number>;
  /**
   * Coupled supports only (method "piles"): the non-zero off-diagonal terms of K and C at the
   * evaluation frequency (the matrix is symmetric, each pair once). Absent for the diagonal methods.
   */
  coupling?: ImpedanceCouplingTerm[];
}

export interface ModeResult {
  frequencyHz: number;
  dominant: DofKey;
  participation: Dof6;
  shape: number[];
  /** Springs on a base block only (engine 1.8.0): the base's six shape values (about B), the upper block's share of the kinetic energy and the block that dominates. */
  baseShape?: number[];
  upperShare?: number;
  block?: "upper" | "base";
}

export interface PointResult {
  name: string;
  /** Position in the input's coordinates. */
  position: Vec3;
  displacementPeak: Vec3;
  velocityPeak: Vec3;
  /** Largest displacement and velocity component over the rotor's speed range. */
  overSpeedRange?: { displacementPeak: number; velocityPeak: number };
}

export interface CaseResult {
  case: LoadCaseName;
  unbalanceMode: UnbalanceModeName;
  points: PointResult[];
  transmittedForce: Vec3;
  transmissibility: number;
  maxOverSpeedRange: {
    displacementPeak: number;
    atRpm: number;
    point?: string;
    velocityPeak?: number;
    velocityAtRpm?: number;
  };
}

export interface RotorResult {
  machine: string;
  rotor: string;
  speedRpm: number;
  forceAmplitude: number;
  frequencyRatios: number[];
  speedRangeRpm?: [number, number];
  cases: CaseResult[];
}

/** A point of a combination of rotors (combination.ts). */
export interface CombinedPointResult {
  name: string;
  position: Vec3;
  /**
   * Same speed: the worst relative unbalance phase per point and axis, sum_r |U_r| (m, m/s), at
   * the rated speed. Different speeds: the absolute sum of the speed groups' values.
   */
  displacementPeak: Vec3;
  velocityPeak: Vec3;
  /** Largest component over the speed range (different speeds: sum of each group's over its own range). */
  overSpeedRange: { displacementPeak: number; velocityPeak: number };
  /** Every rotor's force phasor in phase: |sum_r U_r| (different speeds: the sum of the groups' in-phase values). */
  inPhase: { displacementPeak: Vec3; velocityPeak: Vec3; overSpeedRange: { displacementPeak: number; velocityPeak: number } };
}

export interface CombinedCaseResult {
  case: LoadCaseName;
  unbalanceMode: UnbalanceModeName;
  points: CombinedPointResult[];
}

/** Rotors responding together: a same-speed group, or all rotors at different speeds. */
export interface CombinedResult {
  /** `rpm-<speed>-<from>-<to>` for a same-speed group, `all-speeds` for all rotors. */
  id: string;
  /** "<machine> <rotor>" of every rotor combined. */
  group: string[];
  rotors: { machine: string; rotor: string }[];
  /** The group's speed and range; absent for the combination of different speeds (a result holds no nulls). */
  speedRpm?: number;
  speedRangeRpm?: [number, number];
  rule: "same-speed" | "different-speeds-sum";
  ruleText: string;
  cases: CombinedCaseResult[];
}

export interface CheckResult {
  id: string;
  label: string;
  value: number;
  limit: number;
  pass: boolean;
  source: string;
  /** Unique key of the check within the result. */
  key?: string;
  unit?: string;
  /** "min": pass when value >= limit; "max": pass when value <= limit. */
  comparison?: "min" | "max";
  machine?: string;
  rotor?: string;
  case?: LoadCaseName;
  unbalanceMode?: UnbalanceModeName;
  point?: string;
  mode?: number;
  /** Combined checks (`displacement-combined`, `velocity-combined`): the `combined` entry's id. */
  combination?: string;
  /**
   * Soil case of a check of the soil band (band-checks.ts): absent at nominal soil. Band checks
   * have their own ids (`frequency-separation@soil-upper` ...), so a nominal id keeps its meaning.
   */
  soilCase?: "lower" | "upper";
  /** Factor on G (or on the user stiffness) of that bound. */
  soilFactor?: number;
  /**
   * A failing band check the designer accepted with a written justification (input
   * `acceptances`). `pass` stays false; the verdict reads "accepted with justification".
   */
  acceptance?: { justification: string };
  /**
   * A check kept in the list for information that does not apply to this support (the soil
   * bearing pressure under springs or piles), with the reason. It does not decide the verdict:
   * `pass` is true and the verdict reads "not applicable".
   */
  notApplicable?: { reason: string };
}

export interface SweepSeries {
  machine: string;
  rotor: string;
  case: LoadCaseName;
  unbalanceMode: UnbalanceModeName;
  point: string;
  /** Largest displacement component (m) at each frequency. */
  displacementPeak: number[];
  /** Largest velocity component (m/s) at each frequency. */
  velocityPeak: number[];
}

export interface TransmissibilitySeries {
  machine: string;
  rotor: string;
  case: LoadCaseName;
  unbalanceMode: UnbalanceModeName;
  values: number[];
}

export interface SweepResult {
  frequencyHz: number[];
  series: SweepSeries[];
  transmissibility?: TransmissibilitySeries[];
  operatingRangesHz?: { machine: string; rotor: string; fromHz: number; toHz: number; ratedHz: number }[];
  /** Band around each natural frequency that an operating speed must avoid (separation criterion). */
  avoidanceBandsHz?: { mode: number; fromHz: number; toHz: number }[];
}

export interface GoverningAmplitudes {
  /** Largest displacement component over all rotors, cases and points at rated speed (m). */
  displacementPeak: number;
  velocityPeak: number;
  /** The same enveloped over each rotor's speed range. */
  displacementPeakOverSpeedRange: number;
  velocityPeakOverSpeedRange: number;
}

export interface BoundResult {
  /** Factor applied to G (soil methods) or to the user stiffness. */
  factor: number;
  shearModulus?: number;
  frequenciesHz: number[];
  frequencyRatios: { machine: string; rotor: string; ratios: number[] }[];
  governing: GoverningAmplitudes;
}

export interface CrossCheckValue {
  closedFormHz: number;
  nearestModeHz: number;
  nearestMode: number;
}

export interface CrossCheckResult {
  source: string;
  vertical: CrossCheckValue & {
    /** SDOF amplitude and transmissibility for the first rotor's static vertical case at rated speed. */
    amplitude?: number;
    sixDofAmplitudeAtO?: number;
    transmissibility?: number;
    sixDofTransmissibility?: number;
  };
  torsion: CrossCheckValue;
  /** Sliding along x coupled with rocking about y. */
  rockingSlidingXZ: { low: CrossCheckValue; high: CrossCheckValue };
  /** Sliding along y coupled with rocking about x. */
  rockingSlidingYZ: { low: CrossCheckValue; high: CrossCheckValue };
}

export interface ResolvedCriterion {
  value: number;
  unit: string;
  source: string;
}

export interface TransientPeak {
  /** Largest displacement (m) or velocity (m/s) component at any of the rotor's bearings over the run. */
  value: number;
  atTimeS: number;
  /** Instantaneous speed when it occurs. */
  atRpm: number;
  point: string;
  /**
   * For comparison: the harmonic steady state (largest component at the same point) of the
   * frequency-domain analysis at the same speed, held constant.
   */
  steadyStateAtSameSpeed: number;
}

/** Start-up or coast-down through resonance by Newmark time integration (transient.ts). */
export interface TransientResult {
  machine: string;
  rotor: string;
  kind: "run-up" | "coast-down";
  case: LoadCaseName;
  unbalanceMode: UnbalanceModeName;
  fromRpm: number;
  toRpm: number;
  durationS: number;
  /** Constant angular acceleration (rad/s^2; negative for a coast-down). */
  angularAcceleration: number;
  timeStepS: number;
  steps: number;
  /** Time steps per period of the highest frequency of the run (natural or excitation). */
  stepsPerShortestPeriod: number;
  /** The frequency-independent springs and dashpots of the time-domain model. */
  model: {
    /** Frequency at which K and C are frozen and material damping is made viscous: the rotor's rated speed. */
    referenceHz: number;
    stiffness: Dof6;
    /** The engine's dashpots at the reference frequency plus the equivalent viscous material damping 2 beta K / w_ref. */
    dashpot: Dof6;
    /** Undamped natural frequencies of the block with these springs, ascending. */
    naturalFrequenciesHz: number[];
  };
  /** The rotor's bearings, in the input's coordinates. */
  points: { name: string; position: Vec3 }[];
  /** Decimated time history: one entry per output interval. */
  series: {
    /** Middle of each output interval (s). */
    timeS: number[];
    /** Instantaneous speed at that time. */
    speedRpm: number[];
    /** Per point of `points`: largest displacement component reached within each interval (m). */
    displacementPeak: number[][];
    /** Per point: largest velocity component reached within each interval (m/s). */
    velocityPeak: number[][];
  };
  peakDisplacement: TransientPeak;
  peakVelocity: TransientPeak;
  /** Largest harmonic steady-state components over the run's speed interval (frequency-domain analysis). */
  steadyStateMax: { displacementPeak: number; atRpm: number; velocityPeak: number; velocityAtRpm: number };
  warnings: string[];
}

export interface AnalysisResult {
  schemaVersion: 1;
  engineVersion: string;
  massProperties: MassPropertiesResult;
  impedance: ImpedanceResult;
  modes: ModeResult[];
  rotors: RotorResult[];
  checks: CheckResult[];
  sweep: SweepResult;
  warnings: string[];
  bounds?: { source: string; lower: BoundResult; upper: BoundResult };
  crossCheck?: CrossCheckResult;
  /** The criteria used, defaults filled in, each with its source. */
  criteria?: Record<string, ResolvedCriterion>;
  /** Start-up and coast-down runs, present only when the input asks for them (input.transient). */
  transient?: TransientResult[];
  /** Rotors responding together (present when the input has two or more rotors). */
  combined?: CombinedResult[];
  /** Block on steel springs only (impedance.method "springs", issue 16). */
  springs?: SpringsResult;
}

/** Results of a block on steel springs (springs-results.ts). */
export interface SpringsResult {
  /** Static load in each spring (N, compression positive, input order): rigid block on linear springs under its weight at the cg. Engine 1.7.0 on (absent in older stored results). */
  staticLoads?: number[];
  /** Static deflection W / sum kz (m). */
  staticDeflection: number;
  sumKz: number;
  sumKh: number;
  /** Vertical mode as an SDOF isolator: sqrt(sum kz / m) / 2 pi (Hz), and its damping ratio. */
  verticalFrequencyHz: number;
  verticalDampingRatio: number;
  /** Highest of the six natural frequencies (Hz): the isolator frequency of the ratio check. */
  highestNaturalFrequencyHz: number;
  transmissibilitySource: string;
  rotors: {
    machine: string;
    rotor: string;
    /** At the ends of the speed range and the rated speed: r = f / f_z, TR (Chopra §3.6), 1 - TR. */
    isolation: { speedRpm: number; frequencyRatio: number; transmissibility: number; isolationEfficiency: number }[];
    /** Per load case at the rated speed: force amplitude [x, y, z] in each spring, in input order (N). */
    springForces: { case: LoadCaseName; unbalanceMode: UnbalanceModeName; speedRpm: number; forces: [number, number, number][] }[];
  }[];
  /** Springs on a base block only (engine 1.8.0, two-stage.ts). */
  base?: SpringBaseResult;
}

/** The base block under the springs and the soil under it (two-stage isolation). */
export interface SpringBaseResult {
  /** B, the centre of the base's underside, in the input's coordinates. */
  position: Vec3;
  /** Length (x), width (y) and thickness of the base (m). */
  dimensions: Vec3;
  mass: number;
  /** From the base's top face up to the block's underside (m). */
  springHeight: number;
  /** Footprint on the soil (m^2). */
  area: number;
  /** (upper block, machines and base) x g over the base's footprint (Pa): the `bearing-pressure` check's value. */
  staticBearingPressure: number;
  /** The soil method under the base and its springs and dashpots at B. */
  supportMethod: "equivalent-radius" | "gazetas" | "user";
  soilStaticStiffness: Dof6;
  /** K_b, C_b at `evaluatedAtHz` (the first rotor's rated speed, as for the modes). */
  soilStiffness: Dof6;
  soilDashpot: Dof6;
  /** The soil's material damping under the base (beta in K_b (1 + 2 i beta)). */
  soilMaterialDamping: number;
  evaluatedAtHz: number;
  soilDetails: Record<string, number>;
  /** Closed-form two-mass vertical frequencies (sum kz on the upper mass, soil K_z under the base mass), Hz ascending. */
  twoMassVerticalHz: [number, number];
  /** Highest of the six modes of the same springs on a rigid floor (Hz). */
  rigidFloorHighestHz: number;
  /** Highest twelve-DOF mode in which the upper block carries most of the kinetic energy (Hz). */
  isolatorModesHighestHz: number;
  rotors: {
    machine: string;
    rotor: string;
    /** Per load case at the rated speed. */
    cases: {
      case: LoadCaseName;
      unbalanceMode: UnbalanceModeName;
      speedRpm: number;
      /** Force amplitude [x, y, z] into the soil under the base (N). */
      groundForce: Vec3;
      /** Largest displacement amplitude [x, y, z] of the base (over its corners, m). */
      baseDisplacementPeak: Vec3;
    }[];
  }[];
}
