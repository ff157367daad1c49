// The whole analysis of one input: model, nominal soil case, sweep, soil band, checks,
// cross-check, warnings and (when asked) start-up and coast-down runs, assembled into the
// contract's result.
import { analysisWarnings } from "./analysis-warnings";
import { applyAcceptances, boundChecks } from "./band-checks";
import { buildChecks, markNotApplicable, resolveCriteria } from "./checks";
import { buildCrossCheck } from "./closed-form";
import { assertFinite } from "./finite";
import { buildModel } from "./model";
import type { AnalysisResult } from "./result-types";
import type { AnalysisInput } from "./schema";
import { soilBand } from "./soil-band";
import { baseBearingPressure, springsResults } from "./springs-results";
import { runSoilCase } from "./soil-case";
import { frequencySweep } from "./sweep";
import { resolveSweep } from "./sweep-grid";
import { transientResults } from "./transient";

export const ENGINE_VERSION = "1.9.0";

/**
 * Springs on a base block: the `bearing-pressure` check applies to the base on the soil, its
 * value (upper block, machines and base) g / base footprint over the allowable pressure.
 */
function baseBearing(model: ReturnType<typeof buildModel>, checks: AnalysisResult["checks"]): AnalysisResult["checks"] {
  if (!model.baseBlock) return checks;
  const pressure = baseBearingPressure(model);
  return checks.map((c) => {
    if (c.id !== "bearing-pressure") return c;
    const value = pressure / model.input.soil.allowableBearingPressure;
    return { ...c, label: "Static bearing pressure under the base block (block, machines and base) over the allowable bearing pressure", value, pass: value <= c.limit };
  });
}

export interface AnalyseOptions {
  /** Skip the soil band (bounds absent); used by the benchmark's split timings. */
  soilBand?: boolean;
}

/** Analyses a valid input (see parseAnalysisInput). Throws only on an internal error. */
export function analyse(input: AnalysisInput, options: AnalyseOptions = {}): AnalysisResult {
  const model = buildModel(input);
  const nominal = runSoilCase(model, 1);
  const criteria = resolveCriteria(input);
  const sweepSettings = resolveSweep(input);
  const modesHz = nominal.modes.map((m) => m.frequencyHz);
  const sweep = frequencySweep(model, nominal.solver, sweepSettings, modesHz, criteria.frequencySeparation.value);
  const crossCheck = buildCrossCheck(model, nominal);
  const band = options.soilBand === false ? undefined : soilBand(model);
  const userSprings = input.impedance.method === "user" || input.impedance.method === "springs";
  // Nominal checks first (their ids and order unchanged), then the same soil-dependent checks at
  // the lower and the upper bound of the band; acceptances mark failing band checks, never pass them.
  const accepted = applyAcceptances(
    [
      ...baseBearing(model, markNotApplicable(buildChecks(criteria, model.massProperties, nominal.modes, nominal.rotors, input.soil.allowableBearingPressure, nominal.combined), input.impedance.method, model.baseBlock !== undefined)),
      ...(band ? [...boundChecks(criteria, "lower", band.cases.lower, band.source, userSprings), ...boundChecks(criteria, "upper", band.cases.upper, band.source, userSprings)] : []),
    ],
    input.acceptances,
  );
  const springs = springsResults(model, nominal, band ? [band.cases.lower, band.cases.upper] : []);
  const checks = [...accepted.checks, ...(springs?.checks ?? [])];
  // after the sweep and the rotor envelopes: the runs reuse the nominal case's harmonic solver
  const transient = input.transient ? transientResults(model, nominal, input.transient) : undefined;
  const warnings = [
    ...model.warnings,
    ...nominal.impedance.warnings,
    ...analysisWarnings(model, nominal, sweepSettings),
    ...(transient ?? []).flatMap((t) => t.warnings),
    ...accepted.warnings,
  ];
  const result: AnalysisResult = {
    schemaVersion: 1,
    engineVersion: ENGINE_VERSION,
    massProperties: model.massProperties,
    impedance: nominal.impedanceResult,
    modes: nominal.modes.map(({ frequencyHz, dominant, participation, shape, baseShape, upperShare, block }) => ({
      frequencyHz,
      dominant,
      participation,
      shape,
      ...(baseShape ? { baseShape, upperShare: upperShare ?? 0, block: block ?? "upper" } : {}),
    })),
    rotors: nominal.rotors,
    checks,
    sweep,
    warnings,
    ...(band ? { bounds: { source: band.source, lower: band.lower, upper: band.upper } } : {}),
    crossCheck,
    criteria,
    ...(transient ? { transient } : {}),
    ...(nominal.combined.length ? { combined: nominal.combined } : {}),
    ...(springs ? { springs: springs.result } : {}),
  };
  // the sweep's series are checked in the sweep loop itself
  assertFinite(result, new Set<object>([sweep.series, sweep.transmissibility ?? []]));
  return result;
}
