// Calibration of the soil from measured resonances: a one-dimensional search over the soil
// shear modulus G, each trial the engine's own soil case (runSoilCase, the path of the soil
// band: G times a factor, whatever way the input gives G: directly, from Vs, or from layers).
//   - a resonance stated as such ("resonance" rows, e.g. a bump test) is fitted to the model's
//     nearest undamped natural frequency (chosen at the design G, then followed by its index);
//   - the resonance of a run-up trace is fitted to the model's own predicted response peak at
//     the same point, direction and quantity over the trace's speeds: the measured peak of a
//     damped foundation under unbalance is not its undamped natural frequency, so like is
//     compared with like.
// One target: bracketing at the bounds, then bisection on ln G (the model's frequencies rise
// monotonically with G). Several: golden-section search on ln G minimising the sum of squared
// log misfits. Bounds: 0.25 x to 4 x the design G (a product choice, stated with the result).
import type { AnalysisInput } from "@/modules/calc/schema";
import { governingAmplitudes } from "@/modules/calc/rotor-response";
import { AXIS_SHARE_MIN, axisShare, buildResponseModel, SoilResponse, type AxisIndex, type ModelPoint } from "./response";
import { toVelocityRms } from "./conversions";
import type { AmplitudeQuantity } from "./types";
import { refinePeak } from "./peaks";
import { goldenSectionMaximum } from "@/modules/calc/golden-section";

export const CALIBRATION_BOUNDS = { lowerFactor: 0.25, upperFactor: 4 } as const;
/** Search tolerance on ln G: 1e-4, i.e. G to about 0.01 %. */
export const CALIBRATION_TOLERANCE = 1e-4;
export const CALIBRATION_TOLERANCE_TEXT = "search tolerance 0.01 % on G (1e-4 on ln G)";

export type CalibrationTarget =
  | { kind: "natural"; hz: number; at?: { point: ModelPoint; axis: AxisIndex } }
  | { kind: "peak"; hz: number; point: ModelPoint; axis: AxisIndex; quantity: AmplitudeQuantity; fromRpm: number; toRpm: number };

export interface CalibrationFit {
  ok: true;
  factor: number;
  fittedShearModulus: number;
  designShearModulus: number;
  searchLower: number;
  searchUpper: number;
  /** Each target's measured frequency and what the fitted model gives for it (Hz). */
  measuredHz: number[];
  fittedHz: number[];
  /** The fit stopped at a search bound: the soil is at least that far from the design. */
  atBound: "lower" | "upper" | null;
  /** Engine runs used. */
  evaluations: number;
  design: SoilResponse;
  fitted: SoilResponse;
  notes: string[];
}

export type CalibrationOutcome = CalibrationFit | { ok: false; reason: string };

/** Predicted response peak (Hz) of a trace target over its speeds, or null when it has none inside them. */
export function predictedPeakHz(response: SoilResponse, t: Extract<CalibrationTarget, { kind: "peak" }>, gridPoints = 241): number | null {
  const values: number[] = [];
  const rpms: number[] = [];
  for (let i = 0; i < gridPoints; i++) {
    const rpm = t.fromRpm + ((t.toRpm - t.fromRpm) * i) / (gridPoints - 1);
    const a = response.at(t.point, t.axis, rpm);
    const hz = rpm / 60;
    values.push(t.quantity === "displacement peak-to-peak" ? 2 * a.displacementPeak : toVelocityRms("velocity peak", a.velocityPeak, hz));
    rpms.push(rpm);
  }
  let k = 0;
  for (let i = 1; i < values.length; i++) if ((values[i] as number) > (values[k] as number)) k = i;
  if (k === 0 || k === values.length - 1) return null;
  return refinePeak(rpms, values, k) / 60;
}

/**
 * Fits G to the targets with the revision's model. `input` is the revision's analysis input;
 * its impedance method must be a soil method (equivalent radius or Gazetas): springs and user
 * stiffness have no G to fit.
 */
export function calibrateShearModulus(input: AnalysisInput, targets: CalibrationTarget[], bounds: { lowerFactor: number; upperFactor: number } = CALIBRATION_BOUNDS): CalibrationOutcome {
  if (input.impedance.method === "user" || input.impedance.method === "springs") {
    return { ok: false, reason: `The revision's foundation is on ${input.impedance.method === "springs" ? "steel springs" : "user-given springs"}: there is no soil shear modulus to calibrate.` };
  }
  if (targets.length === 0) return { ok: false, reason: "No measured resonance to calibrate from." };
  const model = buildResponseModel(input);
  const design = new SoilResponse(model, 1);
  const designG = design.case.soil.shearModulus;
  let evaluations = 1;
  // A natural target follows one mode (by index, ascending): of the modes that move its point in
  // its direction (when the reading says where), the one nearest it at the design G. Which mode a
  // resonance belongs to is a judgement; it is stated with the result.
  const modeOf = targets.map((t) => {
    if (t.kind !== "natural") return -1;
    const candidates = design.case.modes.map((m, i) => ({ i, hz: m.frequencyHz, share: t.at ? axisShare(m.shape, t.at.point.local, t.at.axis) : 1 }));
    const moving = candidates.filter((c) => c.share >= AXIS_SHARE_MIN);
    const pool = moving.length ? moving : candidates;
    let best = pool[0] as { i: number; hz: number };
    for (const c of pool) if (Math.abs(Math.log(c.hz / t.hz)) < Math.abs(Math.log(best.hz / t.hz))) best = c;
    return best.i;
  });
  const cache = new Map<number, { response: SoilResponse; hz: (number | null)[] }>();
  const evaluate = (s: number) => {
    const hit = cache.get(s);
    if (hit) return hit;
    const response = s === 0 ? design : new SoilResponse(model, Math.exp(s));
    if (s !== 0) evaluations += 1;
    const hz = targets.map((t, i) => (t.kind === "natural" ? ((response.naturalHz[modeOf[i] as number] as number | undefined) ?? null) : predictedPeakHz(response, t)));
    const out = { response, hz };
    cache.set(s, out);
    return out;
  };
  const misfit = (s: number): number => {
    const { hz } = evaluate(s);
    let sum = 0;
    targets.forEach((t, i) => {
      const f = hz[i];
      // A trace whose predicted peak leaves the traced speeds: a large misfit, pushing the search back.
      const r = f === null || f === undefined ? 10 : Math.log(f / t.hz);
      sum += r * r;
    });
    return sum;
  };
  const lo = Math.log(bounds.lowerFactor);
  const hi = Math.log(bounds.upperFactor);
  const notes: string[] = [];
  let s: number;
  let atBound: "lower" | "upper" | null = null;
  if (targets.length === 1) {
    const t = targets[0] as CalibrationTarget;
    const residual = (x: number): number | null => {
      const f = evaluate(x).hz[0];
      return f === null || f === undefined ? null : Math.log(f / t.hz);
    };
    const rLo = residual(lo);
    const rHi = residual(hi);
    if (rLo === null || rHi === null) {
      // The predicted peak is not inside the trace at a bound: fall back to the golden search.
      s = golden(misfit, lo, hi);
    } else if (rLo >= 0) {
      s = lo;
      atBound = "lower";
    } else if (rHi <= 0) {
      s = hi;
      atBound = "upper";
    } else {
      let a = lo;
      let b = hi;
      while (b - a > CALIBRATION_TOLERANCE) {
        const m = (a + b) / 2;
        const r = residual(m);
        if (r === null) break;
        if (r < 0) a = m;
        else b = m;
      }
      s = (a + b) / 2;
    }
  } else {
    s = golden(misfit, lo, hi);
    if (s - lo < 2 * CALIBRATION_TOLERANCE) atBound = "lower";
    else if (hi - s < 2 * CALIBRATION_TOLERANCE) atBound = "upper";
  }
  const fit = evaluate(s);
  if (atBound) {
    notes.push(
      `The measured resonance${targets.length > 1 ? "s are" : " is"} outside what the model reaches within the search bounds: G is reported at the ${atBound} bound (${bounds[atBound === "lower" ? "lowerFactor" : "upperFactor"]} x the design G); the soil is at least that ${atBound === "lower" ? "soft" : "stiff"}, or the model (mass, geometry, method) does not represent the foundation as built.`,
    );
  }
  if (targets.some((t) => t.kind === "peak")) notes.push("A run-up resonance is fitted to the model's predicted response peak at the same bearing and direction over the traced speeds, not to an undamped natural frequency.");
  targets.forEach((t, i) => {
    if (t.kind === "natural") notes.push(`The resonance at ${t.hz.toPrecision(4)} Hz is fitted to the model's undamped natural frequency of mode ${(modeOf[i] as number) + 1} (${design.case.modes[modeOf[i] as number]?.dominant ?? "?"}), the nearest at the design G${t.at ? " of the modes moving that point in that direction" : ""}.`);
  });
  return {
    ok: true,
    factor: Math.exp(s),
    fittedShearModulus: fit.response.case.soil.shearModulus,
    designShearModulus: designG,
    searchLower: designG * bounds.lowerFactor,
    searchUpper: designG * bounds.upperFactor,
    measuredHz: targets.map((t) => t.hz),
    fittedHz: fit.hz.map((f) => f ?? Number.NaN),
    atBound,
    evaluations,
    design,
    fitted: fit.response,
    notes,
  };
}

/** Golden-section minimum of f on [a, b] to CALIBRATION_TOLERANCE (f unimodal there): the shared search on -f. */
function golden(f: (x: number) => number, lo: number, hi: number): number {
  const { a, b } = goldenSectionMaximum((x) => -f(x), lo, hi, { tolerance: CALIBRATION_TOLERANCE });
  const m = (a + b) / 2;
  // the ends themselves, when the minimum sits on one
  const fa = f(a), fb = f(b), fm = f(m);
  return fa < fm && fa <= fb ? a : fb < fm ? b : m;
}

/** The design and the fitted model side by side at the operating speed. */
export function atOperating(fit: CalibrationFit): { label: string; kind: "frequency" | "velocity" | "displacement" | "ratio"; designed: number | null; fitted: number | null }[] {
  const rows: { label: string; kind: "frequency" | "velocity" | "displacement" | "ratio"; designed: number | null; fitted: number | null }[] = [];
  const d = fit.design.case;
  const f = fit.fitted.case;
  d.modes.forEach((m, i) => rows.push({ label: `Natural frequency, mode ${i + 1} (${m.dominant})`, kind: "frequency", designed: m.frequencyHz, fitted: f.modes[i]?.frequencyHz ?? null }));
  const gd = governingAmplitudes(d.rotors);
  const gf = governingAmplitudes(f.rotors);
  rows.push({ label: "Largest velocity at the rated speed (peak)", kind: "velocity", designed: gd.velocityPeak, fitted: gf.velocityPeak });
  rows.push({ label: "Largest displacement at the rated speed (peak)", kind: "displacement", designed: gd.displacementPeak, fitted: gf.displacementPeak });
  const closest = (rs: typeof d.rotors) => {
    let best: number | null = null;
    for (const r of rs) for (const x of r.frequencyRatios) if (best === null || Math.abs(x - 1) < Math.abs(best - 1)) best = x;
    return best;
  };
  rows.push({ label: "Frequency ratio (running speed over natural frequency) nearest 1", kind: "ratio", designed: closest(d.rotors), fitted: closest(f.rotors) });
  return rows;
}
