// Product defaults for the acceptance criteria and the other optional inputs, each with the
// source shown to the user beside it. The user or the project may change every one of them.

export interface CriterionDefault {
  value: number;
  unit: string;
  source: string;
}

export const CRITERIA_DEFAULTS = {
  frequencySeparation: {
    value: 0.2,
    unit: "-",
    source:
      "common practice, discussed in ACI 351.3R: every natural frequency at least 20 % away from every operating speed (r < 0.8 or r > 1.2)",
  },
  maxVelocityPeak: {
    // 1.4 mm/s r.m.s. x sqrt(2) for a sinusoid.
    value: 1.4e-3 * Math.SQRT2,
    unit: "m/s",
    source:
      "ISO 10816-3 (retained in ISO 20816-3), group 2 machines on rigid supports, zone A/B boundary 1.4 mm/s r.m.s. (recalled from memory), converted to peak (x sqrt 2)",
  },
  maxDisplacementPeak: {
    // 22 um r.m.s. x sqrt(2) for a sinusoid.
    value: 22e-6 * Math.SQRT2,
    unit: "m",
    source:
      "ISO 10816-3 (retained in ISO 20816-3), group 2 machines on rigid supports, zone A/B boundary 22 um r.m.s. displacement (recalled from memory), converted to peak (x sqrt 2)",
  },
  minMassRatio: {
    value: 3,
    unit: "-",
    source: "common practice (ACI 351.3R; Arya, O'Neill & Pincus 1979): block mass at least 3 x machine mass for rotating machines",
  },
  maxEccentricity: {
    value: 0.05,
    unit: "-",
    source: "common practice (ACI 351.3R; Arya, O'Neill & Pincus 1979): combined centre of gravity within 5 % of the base dimension",
  },
  maxBearingRatio: {
    value: 0.5,
    unit: "-",
    source: "common practice (ACI 351.3R; Arya, O'Neill & Pincus 1979): static bearing pressure at most 50 % of the allowable",
  },
} as const satisfies Record<string, CriterionDefault>;

export type CriterionKey = keyof typeof CRITERIA_DEFAULTS;

/** Source text of a criterion the user has set: the default's source no longer applies. */
export const USER_CRITERION_SOURCE = "set in the input (project or user criterion)";

/** Block rules of thumb that only raise warnings. */
export const BLOCK_RULES = {
  minThicknessM: 0.6,
  minThicknessSource: "common practice (ACI 351.3R; Arya, O'Neill & Pincus 1979): block thickness at least 0.6 m",
  /** Rigid-block idealisation: thickness at least 1/5 of the least and 1/10 of the largest plan dimension. */
  minThicknessToLeastPlan: 1 / 5,
  minThicknessToLargestPlan: 1 / 10,
  slendernessSource:
    "common practice (Arya, O'Neill & Pincus 1979): thickness at least one fifth of the least and one tenth of the largest plan dimension for the block to act rigidly",
} as const;

export const SOIL_BAND_DEFAULTS = {
  lowerFactor: 1 / 1.5,
  upperFactor: 1.5,
  source:
    "common practice: shear modulus divided and multiplied by 1.5 (ASCE 4 uses BE / (1 + Cv) and BE (1 + Cv) with Cv >= 0.5, recalled from memory)",
} as const;

export const SWEEP_DEFAULTS = {
  fromHz: 0.5,
  toHz: 60,
  points: 600,
  /** The default upper end is raised to this multiple of the highest operating speed when that is above 60 Hz. */
  speedMargin: 1.25,
} as const;

export const MATERIAL_DAMPING_DEFAULT = 0;

/** Gazetas (1991) straight-line dynamic multipliers are used up to this a0 (engine choice). */
export const GAZETAS_A0_LIMIT = 1.5;
/** Floor applied to a Gazetas dynamic stiffness multiplier (engine choice, warned). */
export const GAZETAS_MULTIPLIER_FLOOR = 0.05;

/** Poisson's ratio above which the soil is treated as nearly incompressible (warning). */
export const NEARLY_INCOMPRESSIBLE_NU = 0.45;

/** Standard gravity for the static bearing pressure (contract). */
export const STANDARD_GRAVITY = 9.80665;

/** Tolerance on the input's base centroid and underside level before a shift is reported (m). */
export const ORIGIN_TOLERANCE_M = 1e-3;

/** Number of speeds in an operating range grid (plus natural frequencies inside it). */
export const SPEED_RANGE_GRID_POINTS = 101;
