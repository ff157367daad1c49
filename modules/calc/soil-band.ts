// Soil-uncertainty band: the same analysis at a lower and an upper soil stiffness (G times the
// factor for the soil methods, the user stiffness times the factor for user springs).
import { SOIL_BAND_DEFAULTS } from "./criteria-defaults";
import type { Model } from "./model";
import type { BoundResult } from "./result-types";
import { governingAmplitudes } from "./rotor-response";
import { runSoilCase, type SoilCase } from "./soil-case";

export function boundFromCase(model: Model, sc: SoilCase): BoundResult {
  return {
    factor: sc.factor,
    ...(model.input.impedance.method === "user" || model.input.impedance.method === "springs" ? {} : { shearModulus: sc.soil.shearModulus }),
    frequenciesHz: sc.modes.map((m) => m.frequencyHz),
    frequencyRatios: sc.rotors.map((r) => ({ machine: r.machine, rotor: r.rotor, ratios: r.frequencyRatios })),
    governing: governingAmplitudes(sc.rotors),
  };
}

export interface SoilBandRun {
  source: string;
  lower: BoundResult;
  upper: BoundResult;
  /** The two soil cases themselves, for the band checks (band-checks.ts). */
  cases: { lower: SoilCase; upper: SoilCase };
}

export function soilBand(model: Model): SoilBandRun {
  const band = model.input.soilBand;
  const lowerFactor = band?.lowerFactor ?? SOIL_BAND_DEFAULTS.lowerFactor;
  const upperFactor = band?.upperFactor ?? SOIL_BAND_DEFAULTS.upperFactor;
  const lower = runSoilCase(model, lowerFactor);
  const upper = runSoilCase(model, upperFactor);
  return {
    source: band?.lowerFactor === undefined && band?.upperFactor === undefined ? SOIL_BAND_DEFAULTS.source : "factors set in the input",
    lower: boundFromCase(model, lower),
    upper: boundFromCase(model, upper),
    cases: { lower, upper },
  };
}
