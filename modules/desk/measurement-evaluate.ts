// A site measurement judged against its approved revision, and the soil calibrated from a
// measured resonance: the desk's glue between the parsed file and modules/commissioning (the
// conversions, zones, verdicts, prediction and the G search live there). Runs on the analysis
// pool (job "commission"): the calibration runs the engine many times.
import type { AnalysisInput, AnalysisResult } from "@/modules/calc";
import type { StoredCalibration, StoredVerdicts } from "./measurement-view";

export interface MeasurementEvaluationJob {
  input: AnalysisInput;
  result: AnalysisResult;
  speedRpm: number;
  readings: unknown;
  trace: unknown;
}

export interface MeasurementEvaluation {
  verdicts: StoredVerdicts;
  calibration: StoredCalibration | null;
  engineVersion: string;
  /** The soil flag to set (outside the band), null to clear (inside), undefined: no calibration. */
  soilFlag: { fittedShearModulus: number; bandLower: number; bandUpper: number; side: "below" | "above" } | null | undefined;
}
