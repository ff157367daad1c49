// Analysis input of calc-contract.md version 1, as a zod 4 schema. This schema is the source
// of truth for the contract: every object is strict (unknown fields are refused), numbers must
// be finite, and the physical consistency rules of input-consistency.ts run on top.
import { z } from "zod";
import { BAND_CHECK_KEY_PATTERN } from "./band-checks";
import { checkInputConsistency } from "./input-consistency";
import { TRANSIENT_LIMITS } from "./transient-settings";
import { INPUT_LIMITS, seriesOfRotor, sweepValuesMessage } from "./input-limits";
import { resolveSweep } from "./sweep-grid";

const L = INPUT_LIMITS;
const atMost = (max: number, what: string) => ({ error: (issue: { input?: unknown }) => `at most ${max} ${what}${Array.isArray(issue.input) ? ` (${issue.input.length} given)` : ""}` });

const finite = () =>
  z
    .number({ error: "must be a finite number" })
    .min(-L.maxAbsNumber, { error: `must lie within ±${L.maxAbsNumber.toExponential().replace("+", "")} (SI units)` })
    .max(L.maxAbsNumber, { error: `must lie within ±${L.maxAbsNumber.toExponential().replace("+", "")} (SI units)` });
const positive = () => finite().gt(0, { error: "must be greater than 0" });
const nonNegative = () => finite().min(0, { error: "must be 0 or more" });
const name = () => z.string({ error: "must be a text" }).trim().min(1, { error: "must not be empty" }).max(L.maxTextLength, { error: `must be at most ${L.maxTextLength} characters` });

const vec3Schema = z.tuple([finite(), finite(), finite()], { error: "must be [x, y, z] in m" });

const intervalSchema = z
  .tuple([finite(), finite()], { error: "must be [from, to]" })
  .refine(([a, b]) => b > a, { error: "must be [from, to] with from < to" });

const boxSchema = z.strictObject({ x: intervalSchema, y: intervalSchema, z: intervalSchema });

const solidSchema = z.strictObject({
  name: name(),
  x: intervalSchema,
  y: intervalSchema,
  z: intervalSchema,
  void: z.boolean({ error: "must be true or false" }).default(false),
});

const blockSchema = z.strictObject({
  concreteDensity: positive(),
  solids: z.array(solidSchema, { error: "must be a list of boxes" }).min(1, { error: "the block needs at least one solid" }).max(L.maxSolids, atMost(L.maxSolids, "solids")),
});

const soilLayerSchema = z.strictObject({
  thickness: positive(),
  shearWaveVelocity: positive().optional(),
  shearModulus: positive().optional(),
  density: positive(),
  poissonRatio: finite()
    .gt(0, { error: "Poisson's ratio must lie in (0, 0.5)" })
    .lt(0.5, { error: "Poisson's ratio must lie in (0, 0.5)" })
    .optional(),
});

const soilSchema = z.strictObject({
  shearModulus: positive().optional(),
  shearWaveVelocity: positive().optional(),
  poissonRatio: finite()
    .gt(0, { error: "Poisson's ratio must lie in (0, 0.5)" })
    .lt(0.5, { error: "Poisson's ratio must lie in (0, 0.5)" }),
  density: positive(),
  materialDamping: finite()
    .min(0, { error: "must lie in [0, 0.5)" })
    .lt(0.5, { error: "must lie in [0, 0.5)" })
    .default(0),
  allowableBearingPressure: positive(),
  embedmentDepth: nonNegative().default(0),
  sidewallContactHeight: nonNegative().default(0),
  // Optional (issue 13): a soil layer of thickness H over a rigid base, and/or a layered
  // borehole profile reduced to one equivalent stratum (soil-stratum.ts).
  stratum: z.strictObject({ thickness: positive(), base: z.literal("rigid", { error: 'base must be "rigid"' }) }).optional(),
  layers: z.array(soilLayerSchema, { error: "must be a list of layers" }).min(1, { error: "give at least one layer, or leave the field out" }).max(20, { error: "at most 20 layers" }).optional(),
});

const dofStiffnessSchema = z.strictObject({
  x: positive(),
  y: positive(),
  z: positive(),
  rx: positive(),
  ry: positive(),
  rz: positive(),
});
const ratio = () =>
  finite().min(0, { error: "must lie in [0, 1)" }).lt(1, { error: "must lie in [0, 1)" });
const dofRatioSchema = z.strictObject({ x: ratio(), y: ratio(), z: ratio(), rx: ratio(), ry: ratio(), rz: ratio() });

const springSchema = z.strictObject({
  /** Position of the spring's axis in plan (input coordinates, m); the spring top bears on the underside. */
  x: finite(),
  y: finite(),
  /** Catalogue vertical and horizontal stiffness of the spring (N/m). */
  kz: positive(),
  kh: positive(),
  /** Optional viscous damper at the spring (N s/m). */
  cz: nonNegative().optional(),
  ch: nonNegative().optional(),
});

// Optional (issue 16, engine 1.8.0): the springs stand on a second concrete block (the base)
// that rests on the soil: two-stage isolation (two-stage.ts). Absent: the rigid floor of 1.7.0.
// The soil methods of the block on soil, also the soil under a base block.
const equivalentRadiusSchema = z.strictObject({ method: z.literal("equivalent-radius") });
const gazetasSchema = z.strictObject({
  method: z.literal("gazetas"),
  // "published" (default): k(a0), c(a0) from Gazetas' charts (digitised); "pais-kausel": the
  // closed forms of Pais & Kausel (1988); "simplified": k_z = k_y = 1, c = 1 (warned).
  gazetasDynamic: z.enum(["published", "pais-kausel", "simplified"], { error: 'must be "published", "pais-kausel" or "simplified"' }).optional(),
});
const userImpedanceSchema = z.strictObject({ method: z.literal("user"), stiffness: dofStiffnessSchema, dampingRatio: dofRatioSchema });

const baseSupportSchema = z.discriminatedUnion("method", [equivalentRadiusSchema, gazetasSchema, userImpedanceSchema], {
  error: 'method must be "equivalent-radius", "gazetas" or "user"',
});

const springBaseSchema = z.strictObject({
  /** The base block, a rectangular concrete box in the input's coordinates (m); the spring bottoms bear on its top face. */
  x: intervalSchema,
  y: intervalSchema,
  z: intervalSchema,
  /** Density of the base's concrete (kg/m^3); default block.concreteDensity. */
  concreteDensity: positive().optional(),
  /** The soil under the base: a soil method evaluated for the base's footprint (default Gazetas, published charts). */
  support: baseSupportSchema.optional(),
});

const pileSchema = z.strictObject({
  /** Position of the pile head's axis in plan (input coordinates, m); the head is at the cap's underside. */
  x: finite(),
  y: finite(),
});

// Optional (issue 16): a pile cap (the block) on a group of vertical piles (impedance-piles.ts).
const pilesImpedanceSchema = z.strictObject({
  method: z.literal("piles"),
  piles: z
    .array(pileSchema, { error: "must be a list of pile heads" })
    .min(2, { error: "give at least 2 piles (pile torsion is neglected, so one pile has no torsional stiffness)" })
    .max(L.maxPiles, atMost(L.maxPiles, "piles")),
  /** Circular pile, solid section (m). */
  diameter: positive(),
  /** Embedded length below the head (m). */
  length: positive(),
  /** Young's modulus of the pile (Pa). */
  youngsModulus: positive(),
  /** Density of the pile material (kg/m^3, default 2500): the pile's mass in the vertical rod. */
  pileDensity: positive().optional(),
  /** "floating": the tip in the same soil; "end-bearing": the tip on a rigid stratum. */
  tip: z.enum(["floating", "end-bearing"], { error: 'must be "floating" or "end-bearing"' }),
  /** Soil along the shaft: "uniform" (default) G as given; "linear": G(z) = G z / d, G given at depth z = d below the head. */
  soilProfile: z.enum(["uniform", "linear"], { error: 'must be "uniform" or "linear"' }).optional(),
  /** Pile-to-pile interaction: "dynamic-factors" (default, Dobry & Gazetas 1988) or "none" (each pile alone). */
  interaction: z.enum(["dynamic-factors", "none"], { error: 'must be "dynamic-factors" or "none"' }).optional(),
});

const impedanceSchema = z.discriminatedUnion(
  "method",
  [
    equivalentRadiusSchema,
    gazetasSchema,
    userImpedanceSchema,
    // Optional (issue 16): a block on steel springs at given positions (impedance-springs.ts).
    z
      .strictObject({
        method: z.literal("springs"),
        springs: z
          .array(springSchema, { error: "must be a list of springs" })
          .min(3, { error: "give at least 3 springs (a block on fewer springs is not stable in rocking)" })
          .max(L.maxSprings, atMost(L.maxSprings, "springs")),
        // one damping ratio for all six DOFs when the springs have no dampers (default 0.005)
        dampingRatio: ratio().optional(),
        // the springs rest on a base block on the soil (two-stage isolation); absent: a rigid floor
        base: springBaseSchema.optional(),
      })
      .superRefine((imp, ctx) => {
        const dampers = imp.springs.some((s) => s.cz !== undefined || s.ch !== undefined);
        if (dampers && imp.dampingRatio !== undefined) ctx.addIssue({ code: "custom", path: ["dampingRatio"], message: "give either dampers (cz, ch) on the springs or one damping ratio, not both" });
      }),
    pilesImpedanceSchema,
  ],
  { error: 'method must be "equivalent-radius", "gazetas", "user", "springs" or "piles"' },
);

const rotorSchema = z.strictObject({
  name: name(),
  mass: positive(),
  speedRpm: positive(),
  speedRangeRpm: z
    .tuple([positive(), positive()], { error: "must be [from, to] in rpm" })
    .refine(([a, b]) => b >= a, { error: "must be [from, to] with from <= to" })
    .optional(),
  balanceGrade: positive().optional(),
  unbalanceForce: positive().optional(),
  serviceFactor: positive().default(1),
  // "z": a vertical shaft (vertical pumps); its load cases are horizontal along x and y and rotating in the plan.
  axis: z.enum(["x", "y", "z"], { error: 'must be "x" or "y" (horizontal shaft) or "z" (vertical shaft)' }),
  unbalanceMode: z.enum(["static", "couple", "both"], { error: 'must be "static", "couple" or "both"' }).default("static"),
  bearings: z.array(vec3Schema, { error: "must be a list of [x, y, z]" }).min(1, { error: "a rotor needs at least one bearing" }).max(L.maxBearingsPerRotor, atMost(L.maxBearingsPerRotor, "bearings per rotor")),
});

const machineSchema = z.strictObject({
  name: name(),
  mass: positive(),
  cg: vec3Schema,
  box: boxSchema.optional(),
  rotors: z.array(rotorSchema, { error: "must be a list of rotors" }).max(L.maxRotorsPerMachine, atMost(L.maxRotorsPerMachine, "rotors per machine")).default([]),
});

const checkPointSchema = z.strictObject({ name: name(), position: vec3Schema });

const criteriaSchema = z.strictObject({
  frequencySeparation: finite()
    .gt(0, { error: "must lie in (0, 1)" })
    .lt(1, { error: "must lie in (0, 1)" })
    .optional(),
  maxDisplacementPeak: positive().optional(),
  maxVelocityPeak: positive().optional(),
  minMassRatio: positive().optional(),
  maxEccentricity: positive().optional(),
  maxBearingRatio: positive().optional(),
});

const sweepSchema = z.strictObject({
  fromHz: nonNegative().optional(),
  toHz: positive().optional(),
  points: z
    .number({ error: "must be a whole number" })
    .int({ error: "must be a whole number" })
    .min(2, { error: "must be at least 2" })
    .max(L.maxSweepPoints, { error: `must be at most ${L.maxSweepPoints}` })
    .optional(),
});

const soilBandSchema = z.strictObject({
  lowerFactor: finite()
    .gt(0, { error: "must lie in (0, 1]" })
    .max(1, { error: "must lie in (0, 1]" })
    .optional(),
  upperFactor: finite().min(1, { error: "must be 1 or more" }).optional(),
});

/** Shortest written justification of an acceptance (software rule: a word or two is no justification). */
export const ACCEPTANCE_JUSTIFICATION_MIN = 20;
export const ACCEPTANCE_JUSTIFICATION_MAX = L.maxJustificationLength;

/** The designer's acceptance of one failing soil-band check, with the written justification. */
const acceptanceSchema = z.strictObject({
  checkKey: z
    .string({ error: "must be a text" })
    .trim()
    .regex(BAND_CHECK_KEY_PATTERN, { error: "must be the key of a soil-band check (frequency-separation, displacement, velocity, displacement-combined or velocity-combined @soil-lower or @soil-upper); only band checks can be accepted" }),
  justification: z
    .string({ error: "must be a text" })
    .trim()
    .min(ACCEPTANCE_JUSTIFICATION_MIN, { error: `write the justification (at least ${ACCEPTANCE_JUSTIFICATION_MIN} characters)` })
    .max(ACCEPTANCE_JUSTIFICATION_MAX, { error: `at most ${ACCEPTANCE_JUSTIFICATION_MAX} characters` }),
});

const acceptancesSchema = z
  .array(acceptanceSchema, { error: "must be a list of acceptances" })
  .max(500, { error: "at most 500 acceptances" })
  .superRefine((list, ctx) => {
    const seen = new Set<string>();
    list.forEach((a, i) => {
      if (seen.has(a.checkKey)) ctx.addIssue({ code: "custom", path: [i, "checkKey"], message: "this check is already accepted above" });
      seen.add(a.checkKey);
    });
  });

/**
 * One start-up or coast-down run through resonance (transient.ts). Speeds default to standstill
 * and the rated speed; the consistency rules check the names and the direction of the run.
 */
export const transientRequestSchema = z.strictObject({
  machine: name(),
  rotor: name(),
  kind: z.enum(["run-up", "coast-down"], { error: 'must be "run-up" or "coast-down"' }),
  fromRpm: nonNegative().optional(),
  toRpm: nonNegative().optional(),
  durationS: positive().max(TRANSIENT_LIMITS.maxDurationS, { error: `must be at most ${TRANSIENT_LIMITS.maxDurationS} s` }),
  case: z
    .enum(["vertical", "horizontal", "rotating", "horizontal-x", "horizontal-y"], {
      error: 'must be "vertical", "horizontal" or "rotating" (horizontal shaft), or "horizontal-x", "horizontal-y" or "rotating" (vertical shaft)',
    })
    .default("rotating"),
  unbalanceMode: z.enum(["static", "couple"], { error: 'must be "static" or "couple"' }).optional(),
  outputPoints: z
    .number({ error: "must be a whole number" })
    .int({ error: "must be a whole number" })
    .min(TRANSIENT_LIMITS.minOutputPoints, { error: `must be at least ${TRANSIENT_LIMITS.minOutputPoints}` })
    .max(TRANSIENT_LIMITS.maxOutputPoints, { error: `must be at most ${TRANSIENT_LIMITS.maxOutputPoints}` })
    .default(TRANSIENT_LIMITS.defaultOutputPoints),
});

export const analysisInputBaseSchema = z.strictObject({
  schemaVersion: z.literal(1, { error: "must be 1" }),
  block: blockSchema,
  soil: soilSchema,
  impedance: impedanceSchema,
  machines: z.array(machineSchema, { error: "must be a list of machines" }).min(1, { error: "at least one machine is needed" }).max(L.maxMachines, atMost(L.maxMachines, "machines")),
  checkPoints: z.array(checkPointSchema, { error: "must be a list of check points" }).max(L.maxCheckPoints, atMost(L.maxCheckPoints, "check points")).optional(),
  criteria: criteriaSchema.optional(),
  sweep: sweepSchema.optional(),
  soilBand: soilBandSchema.optional(),
  transient: z
    .array(transientRequestSchema, { error: "must be a list of runs" })
    .min(1, { error: "give at least one run, or leave the field out" })
    .max(TRANSIENT_LIMITS.maxRuns, { error: `at most ${TRANSIENT_LIMITS.maxRuns} runs` })
    .optional(),
  /** Failing soil-band checks accepted with a written justification (band-checks.ts). */
  acceptances: acceptancesSchema.optional(),
});

/** Limits over several lists (INPUT_LIMITS): rotors of all machines, and the size of the sweep's output. */
function checkCombinedLimits(input: z.output<typeof analysisInputBaseSchema>, add: (path: (string | number)[], message: string) => void): void {
  const rotors = input.machines.flatMap((m) => m.rotors);
  if (rotors.length > L.maxRotors) add(["machines"], `at most ${L.maxRotors} rotors in all machines together (${rotors.length} given)`);
  const checkPoints = input.checkPoints?.length ?? 0;
  const series = rotors.reduce((n, r) => n + seriesOfRotor(r.unbalanceMode, r.bearings.length, checkPoints), 0);
  if (resolveSweep(input).points * series > L.maxSweepValues) add(["sweep", "points"], sweepValuesMessage(series));
}

/** The analysis input schema (contract v1) with its limits and physical consistency rules. */
export const analysisInputSchema = analysisInputBaseSchema.superRefine((input, ctx) => {
  let overLimit = false;
  checkCombinedLimits(input, (path, message) => {
    overLimit = true;
    ctx.addIssue({ code: "custom", path, message });
  });
  // the consistency rules compare solids pairwise: not worth running on a refused input
  if (overLimit) return;
  checkInputConsistency(input, (path, message) => ctx.addIssue({ code: "custom", path, message }));
});

/** A parsed, valid analysis input (defaults applied). */
export type AnalysisInput = z.output<typeof analysisInputBaseSchema>;
/** The analysis input document as written (optional fields may be absent). */
export type AnalysisInputDocument = z.input<typeof analysisInputBaseSchema>;
export type SolidInput = AnalysisInput["block"]["solids"][number];
export type MachineInput = AnalysisInput["machines"][number];
export type RotorInput = MachineInput["rotors"][number];
export type SoilInput = AnalysisInput["soil"];
export type ImpedanceInput = AnalysisInput["impedance"];
export type PilesImpedanceInput = z.infer<typeof pilesImpedanceSchema>;
export type SpringBaseInput = z.output<typeof springBaseSchema>;
export type BaseSupportInput = z.output<typeof baseSupportSchema>;
/** A parsed start-up or coast-down request (defaults applied). */
export type TransientRequest = z.output<typeof transientRequestSchema>;
export type AcceptanceInput = z.output<typeof acceptanceSchema>;
/** The request as written. */
export type TransientRequestDocument = z.input<typeof transientRequestSchema>;

export type { AnalysisResult } from "./result-types";
