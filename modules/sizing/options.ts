// Options of the block-sizing assistant: which base-mat dimensions may change (bounds and a
// step), where the mat is centred, whether the soil-uncertainty band must also clear the
// operating speeds, and how many analyses the search may spend. zod 4, strict.
import { z } from "zod";
import { formatPath, valueAt } from "@/modules/calc";

/**
 * Default step of a dimension: whole 100 mm. Common practice in detailing (formwork and
 * drawings are set out in 100 mm modules); not taken from a published source.
 */
export const DEFAULT_STEP_M = 0.1;
/** Default cap on the number of analyses of one search (each costs a few milliseconds). */
export const DEFAULT_MAX_ANALYSES = 400;
export const DEFAULT_PROPOSALS = 3;

// Software limits, not engineering ones: they keep one search well under a minute and the
// enumeration of the grid cheap.
export const MAX_ANALYSES_LIMIT = 5000;
export const MAX_PROPOSALS = 10;
export const MAX_VALUES_PER_DIMENSION = 1000;
export const MAX_GRID_CANDIDATES = 200_000;
/**
 * Largest required margin: a share of each limit, so 1 would ask for a zero response or an
 * infinite separation. 0.5 is a software bound, not an engineering one.
 */
export const MAX_MARGIN = 0.5;

/** Tolerance when deciding that a bound is a whole number of steps (relative to the step). */
const STEP_TOLERANCE = 1e-9;

const finite = () => z.number({ error: "must be a finite number (m)" });
const positive = () => finite().gt(0, { error: "must be greater than 0" });

/** Rounds away floating-point noise of k x step (values are lengths in m). */
export function roundLength(value: number): number {
  return Math.round(value * 1e9) / 1e9;
}

/** The multiples of `step` in [min, max], ascending (empty when there is none). */
export function gridValues(min: number, max: number, step: number): number[] {
  const first = Math.ceil(min / step - STEP_TOLERANCE);
  const last = Math.floor(max / step + STEP_TOLERANCE);
  const out: number[] = [];
  for (let k = first; k <= last && out.length <= MAX_VALUES_PER_DIMENSION; k++) out.push(roundLength(k * step));
  return out;
}

function countGridValues(min: number, max: number, step: number): number {
  return Math.max(0, Math.floor(max / step + STEP_TOLERANCE) - Math.ceil(min / step - STEP_TOLERANCE) + 1);
}

const dimensionRangeSchema = z
  .strictObject({
    min: positive(),
    max: positive(),
    step: positive().default(DEFAULT_STEP_M),
  })
  .superRefine((r, ctx) => {
    if (r.max < r.min) {
      // Numbers stay out of these messages: the bounds may have been typed in another unit
      // system, and echoing the SI float back ("7.010400000000001 m") helps nobody.
      ctx.addIssue({ code: "custom", path: ["max"], message: "must be at least min (the lower bound)" });
      return;
    }
    const n = countGridValues(r.min, r.max, r.step);
    // A step tiny against the bounds (or bounds near the float limit) makes the count NaN or
    // Infinity; it must be refused like any other too-fine grid, never searched.
    if (!Number.isFinite(n)) {
      ctx.addIssue({ code: "custom", path: ["step"], message: "is too fine for these bounds: use a coarser step or narrower bounds" });
    } else if (n === 0) {
      ctx.addIssue({ code: "custom", path: [], message: "no multiple of the step lies between min and max: widen the bounds or change the step" });
    } else if (n > MAX_VALUES_PER_DIMENSION) {
      ctx.addIssue({
        code: "custom",
        path: ["step"],
        message: `gives ${n} values between min and max; at most ${MAX_VALUES_PER_DIMENSION}: use a coarser step or narrower bounds`,
      });
    }
  });

const dimensionsSchema = z
  .strictObject({
    /** Mat length along x; absent keeps the current length. */
    length: dimensionRangeSchema.optional(),
    /** Mat width along y; absent keeps the current width. */
    width: dimensionRangeSchema.optional(),
    /** Mat thickness; absent keeps the current thickness. */
    thickness: dimensionRangeSchema.optional(),
  })
  .superRefine((d, ctx) => {
    const given = [d.length, d.width, d.thickness].filter((r) => r !== undefined);
    if (given.length === 0) {
      ctx.addIssue({ code: "custom", path: [], message: "let at least one of length, width and thickness change" });
      return;
    }
    const total = given.reduce((p, r) => p * countGridValues(r.min, r.max, r.step), 1);
    if (total > MAX_GRID_CANDIDATES) {
      ctx.addIssue({
        code: "custom",
        path: [],
        message: `the bounds and steps give ${total} combinations; at most ${MAX_GRID_CANDIDATES}: use coarser steps or narrower bounds`,
      });
    }
  });

/**
 * How many analyses a caller may spend on one search, and how many when it does not say: the
 * module's own limits by default; a server answering requests passes lower ones.
 */
export interface SizingLimits {
  maxAnalyses: number;
  defaultAnalyses: number;
}

export const MODULE_SIZING_LIMITS: SizingLimits = { maxAnalyses: MAX_ANALYSES_LIMIT, defaultAnalyses: DEFAULT_MAX_ANALYSES };

/** The options schema under the given limits on the analyses. */
export function makeSizingOptionsSchema(limits: SizingLimits) {
  return z.strictObject({
    dimensions: dimensionsSchema,
    /**
     * "current": the mat grows and shrinks about its current plan centre.
     * "load": the mat is centred on the plan centre of gravity of everything it carries
     * (machines, plinths, voids), which makes the eccentricity of the combined cg vanish.
     */
    centre: z.enum(["current", "load"], { error: 'must be "current" or "load"' }).default("current"),
    /** Also require the soil band's lower and upper frequencies to clear every operating range. */
    requireSoilBand: z.boolean({ error: "must be true or false" }).default(false),
    /**
     * Required margin inside every limit, as a share of the limit (0.1 = 10 %): a maximum
     * must be undershot by it (value <= (1 - margin) x limit), a minimum exceeded by it
     * (value >= (1 + margin) x limit), in the sense of checkMargin (evaluate.ts).
     */
    margin: z
      .number({ error: "must be a number (a share of each limit, 0.1 = 10 %)" })
      .min(0, { error: "must be at least 0" })
      .max(MAX_MARGIN, { error: `must be at most ${MAX_MARGIN} (a share of each limit, 0.1 = 10 %)` })
      .default(0),
    maxAnalyses: z
      .number({ error: "must be a whole number" })
      .int({ error: "must be a whole number" })
      .min(1, { error: "must be at least 1" })
      .max(limits.maxAnalyses, { error: `must be at most ${limits.maxAnalyses} (each analysis takes a few milliseconds)` })
      .default(limits.defaultAnalyses),
    proposals: z
      .number({ error: "must be a whole number" })
      .int({ error: "must be a whole number" })
      .min(1, { error: "must be at least 1" })
      .max(MAX_PROPOSALS, { error: `must be at most ${MAX_PROPOSALS}` })
      .default(DEFAULT_PROPOSALS),
  });
}

export const sizingOptionsSchema = makeSizingOptionsSchema(MODULE_SIZING_LIMITS);

/** Valid options, defaults applied. */
export type SizingOptions = z.output<typeof sizingOptionsSchema>;
/** Options as written (defaults may be absent). */
export type SizingOptionsDocument = z.input<typeof sizingOptionsSchema>;
export type DimensionRange = z.output<typeof dimensionRangeSchema>;
export type CentreMode = SizingOptions["centre"];

export interface OptionIssue {
  path: string;
  message: string;
}

export type ParseOptionsResult = { ok: true; options: SizingOptions } | { ok: false; issues: OptionIssue[] };

/** Validates the options; each problem carries its path, e.g. `dimensions.length.max`. */
export function parseSizingOptions(json: unknown, limits: SizingLimits = MODULE_SIZING_LIMITS): ParseOptionsResult {
  const parsed = (limits === MODULE_SIZING_LIMITS ? sizingOptionsSchema : makeSizingOptionsSchema(limits)).safeParse(json);
  if (parsed.success) return { ok: true, options: parsed.data };
  const issues = parsed.error.issues.flatMap((issue): OptionIssue[] => {
    if (issue.code === "unrecognized_keys") {
      return issue.keys.map((key) => ({ path: formatPath([...issue.path, key]), message: "unknown field" }));
    }
    if (issue.code === "invalid_type" && valueAt(json, issue.path) === undefined) {
      return [{ path: formatPath(issue.path), message: "is required" }];
    }
    return [{ path: formatPath(issue.path), message: issue.message }];
  });
  return { ok: false, issues };
}
