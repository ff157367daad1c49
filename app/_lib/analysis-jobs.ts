// The jobs the analysis pool runs, shared by the pool and its worker.
import type { AnalysisInput } from "../../modules/calc/schema";
import type { SizingLimits } from "../../modules/sizing/options";
import type { SeriesMode } from "../../modules/calc/sweep-downsample";
import type { MeasurementEvaluationJob } from "../../modules/desk/measurement-evaluate";

export type AnalysisJob =
  | { kind: "analyse"; input: AnalysisInput; series?: SeriesMode }
  | { kind: "governing"; input: AnalysisInput }
  | { kind: "sizing"; document: unknown; options: unknown; limits: SizingLimits }
  | { kind: "commission"; evaluation: MeasurementEvaluationJob }
  | { kind: "spin" };
