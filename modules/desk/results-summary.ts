// The compact results summary the workspace keeps in view while the inputs are edited: the
// governing check and its verdict, the natural frequencies, each rotor's frequency ratio
// nearest to resonance (r = 1), and the soil band's verdict. Derived from the engine's result
// only; the full tables remain the record.
import { checkVerdict, type AnalysisResult, type CheckVerdict } from "@/modules/calc";
import { governingCheck, type GoverningSummary } from "./foundation-summary";

export interface RotorRatioSummary {
  machine: string;
  rotor: string;
  speedRpm: number;
  /** The ratio rated speed / natural frequency nearest to 1 (resonance), and its mode (1-based). */
  nearestRatio: number;
  mode: number;
}

export interface SoilBandSummary {
  /** Checks repeated at the lower and upper soil bound. */
  total: number;
  failing: number;
  /** Of the failing ones, how many are accepted with a written justification. */
  accepted: number;
  verdict: CheckVerdict;
  /** Natural frequencies at the lower and upper bound (Hz). */
  lowerHz: number[];
  upperHz: number[];
}

export interface ResultsSummary {
  governing: GoverningSummary | null;
  /** Checks failing their limit (accepted ones included) of all checks. */
  failing: number;
  total: number;
  frequenciesHz: number[];
  rotors: RotorRatioSummary[];
  /** null when the soil band was not analysed. */
  soilBand: SoilBandSummary | null;
}

export function summariseResults(result: AnalysisResult): ResultsSummary {
  const rotors = result.rotors.flatMap((r): RotorRatioSummary[] => {
    let best = -1;
    r.frequencyRatios.forEach((q, i) => {
      if (best < 0 || Math.abs(q - 1) < Math.abs((r.frequencyRatios[best] ?? Infinity) - 1)) best = i;
    });
    const nearest = r.frequencyRatios[best];
    return nearest === undefined ? [] : [{ machine: r.machine, rotor: r.rotor, speedRpm: r.speedRpm, nearestRatio: nearest, mode: best + 1 }];
  });
  const band = result.checks.filter((c) => c.soilCase);
  const bandFailing = band.filter((c) => !c.pass);
  const bandAccepted = bandFailing.filter((c) => checkVerdict(c) === "accepted");
  // Open failures make the band fail; only accepted failures: accepted; none: pass.
  const bandVerdict: CheckVerdict = bandFailing.length === 0 ? "pass" : bandAccepted.length === bandFailing.length ? "accepted" : "fail";
  return {
    governing: governingCheck(result),
    failing: result.checks.filter((c) => !c.pass).length,
    total: result.checks.filter((c) => !c.notApplicable).length,
    frequenciesHz: result.modes.map((m) => m.frequencyHz),
    rotors,
    soilBand: result.bounds
      ? {
          total: band.length,
          failing: bandFailing.length,
          accepted: bandAccepted.length,
          verdict: bandVerdict,
          lowerHz: result.bounds.lower.frequenciesHz,
          upperHz: result.bounds.upper.frequenciesHz,
        }
      : null,
  };
}
