// The revision's prediction beside the measurement: at the same point, direction and speed,
// from the revision's own model (response.ts, the engine), in the design checks' basis (peak),
// with the ratio measured / predicted; and the predicted curve under a run-up trace.
import type { AnalysisInput } from "@/modules/calc/schema";
import type { Model } from "@/modules/calc/model";
import { axisOf, buildResponseModel, findPoint, lowestModeInAxis, modelPoints, SoilResponse, type AxisIndex, type ModelPoint } from "./response";
import { toDesignBasis, toVelocityRms } from "./conversions";
import type { AmplitudeQuantity, Direction, Reading, RunUpTrace } from "./types";
import type { SupportClass } from "./iso-zones";
import { supportClassOf } from "./iso-zones";
import { refinePeak } from "./peaks";

export interface Located {
  point: ModelPoint;
  axis: AxisIndex;
}

export class Predictor {
  readonly model: Model;
  readonly points: ModelPoint[];
  readonly design: SoilResponse;

  constructor(input: AnalysisInput) {
    this.model = buildResponseModel(input);
    this.points = modelPoints(this.model);
    this.design = new SoilResponse(this.model, 1);
  }

  locate(bearing: string, direction: Direction): Located | null {
    const point = findPoint(this.points, bearing);
    if (!point) return null;
    const axis = axisOf(direction, point.shaftAxis);
    return axis === null ? null : { point, axis };
  }

  /** Predicted amplitude of an amplitude reading at `rpm`, in the design basis (velocity or displacement peak). */
  predictedPeak(r: Reading, rpm: number): number | null {
    const at = this.locate(r.bearing, r.direction);
    if (!at) return null;
    const a = this.design.at(at.point, at.axis, rpm);
    const kind = r.quantity === "displacement peak-to-peak" ? "displacement" : "velocity";
    return kind === "displacement" ? a.displacementPeak : a.velocityPeak;
  }

  /** ISO 10816-3 support class of a reading from the design's modes at its point and direction. */
  supportOf(r: Reading, runningHz: number): SupportClass {
    const at = this.locate(r.bearing, r.direction);
    if (!at) return "rigid";
    return supportClassOf(lowestModeInAxis(this.design.case.modes, at.point.local, at.axis), runningHz);
  }

  /** The predicted curve at the trace's speeds in the trace's quantity (SI), or null when the point is unknown. */
  traceCurve(trace: RunUpTrace, response: SoilResponse = this.design): { hz: number; value: number }[] | null {
    const at = this.locate(trace.bearing, trace.direction);
    if (!at) return null;
    return trace.samples.map((s) => {
      const a = response.at(at.point, at.axis, s.rpm);
      return { hz: s.rpm / 60, value: amplitudeIn(trace.quantity, a.displacementPeak, a.velocityPeak, s.rpm / 60) };
    });
  }
}

/** A predicted (peak) response in a reading's own quantity. */
export function amplitudeIn(quantity: AmplitudeQuantity, displacementPeak: number, velocityPeak: number, hz: number): number {
  if (quantity === "displacement peak-to-peak") return 2 * displacementPeak;
  if (quantity === "velocity peak") return velocityPeak;
  return toVelocityRms("velocity peak", velocityPeak, hz);
}

/** The trace's samples in the design basis (peak), for the plot beside the prediction. */
export function traceInDesignBasis(trace: RunUpTrace): { hz: number; value: number }[] {
  return trace.samples.map((s) => ({ hz: s.rpm / 60, value: toDesignBasis(trace.quantity, s.value).value }));
}

/**
 * Resonances of a trace: the largest amplitude when it is inside the traced speeds (not at an
 * end), refined by a parabola through its neighbours, and any other local maximum at least half
 * as high that stands above the two samples either side. Speeds (rpm), highest amplitude first
 * (the first is the trace's peak: the one the calibration fits to the model's predicted peak).
 */
export function traceResonances(trace: RunUpTrace): number[] {
  const s = trace.samples;
  const n = s.length;
  if (n < 3) return [];
  const y = s.map((p) => p.value);
  const x = s.map((p) => p.rpm);
  const top = Math.max(...y);
  const found: { rpm: number; amplitude: number }[] = [];
  for (let k = 1; k < n - 1; k++) {
    const v = y[k] as number;
    if (!(v > 0 && v >= 0.5 * top)) continue;
    let standsOut = true;
    for (let j = Math.max(0, k - 2); j <= Math.min(n - 1, k + 2); j++) if (j !== k && (y[j] as number) >= v) standsOut = false;
    if (standsOut) found.push({ rpm: refinePeak(x, y, k), amplitude: v });
  }
  return found.sort((a, b) => b.amplitude - a.amplitude).map((f) => f.rpm);
}
