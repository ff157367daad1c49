// Conversions between the bases of a vibration reading, for a SINGLE-FREQUENCY (sinusoidal)
// vibration at the running speed: x(t) = X sin(w t). Overall readings of a real machine hold
// several harmonics; for them these identities are an approximation (peak > sqrt 2 rms for a
// spiky signal), which is why every converted value is shown beside the value as measured.
//   peak = sqrt(2) x rms                          (sine: rms = peak / sqrt 2)
//   velocity peak = w x displacement peak          (v = dx/dt = w X cos(w t))
//   displacement peak-to-peak = 2 x displacement peak = 2 x velocity peak / w
// (any vibration textbook, e.g. Harris' Shock and Vibration Handbook, ch. 1; ISO 20816-1 §3
// defines r.m.s. and peak-to-peak as used here).
import type { AmplitudeQuantity } from "./types";

export const SINGLE_FREQUENCY_NOTE =
  "Conversions between r.m.s., peak and peak-to-peak, and between velocity and displacement, assume a single-frequency (sinusoidal) vibration at the running speed: peak = sqrt 2 x r.m.s., velocity = omega x displacement.";

export const rmsToPeak = (rms: number): number => rms * Math.SQRT2;
export const peakToRms = (peak: number): number => peak / Math.SQRT2;
export const radPerSec = (hz: number): number => 2 * Math.PI * hz;

/** Velocity peak (m/s) to displacement peak-to-peak (m) at frequency hz. */
export function velocityPeakToDisplacementPeakToPeak(vPeak: number, hz: number): number {
  return (2 * vPeak) / radPerSec(hz);
}

/** Displacement peak-to-peak (m) to velocity peak (m/s) at frequency hz. */
export function displacementPeakToPeakToVelocityPeak(dPp: number, hz: number): number {
  return (dPp / 2) * radPerSec(hz);
}

/**
 * A reading in the basis of the design checks: velocity peak (m/s) or displacement peak (m),
 * as the engine's criteria are stored (maxVelocityPeak, maxDisplacementPeak).
 */
export function toDesignBasis(quantity: AmplitudeQuantity, value: number): { kind: "velocity" | "displacement"; value: number; basis: "peak" } {
  if (quantity === "velocity rms") return { kind: "velocity", value: rmsToPeak(value), basis: "peak" };
  if (quantity === "velocity peak") return { kind: "velocity", value, basis: "peak" };
  return { kind: "displacement", value: value / 2, basis: "peak" };
}

/** A reading as r.m.s. velocity (m/s), the quantity of the ISO 10816-3 / 20816-3 zones. */
export function toVelocityRms(quantity: AmplitudeQuantity, value: number, hz: number): number {
  if (quantity === "velocity rms") return value;
  if (quantity === "velocity peak") return peakToRms(value);
  return peakToRms(displacementPeakToPeakToVelocityPeak(value, hz));
}

/** Design-basis value (peak) back into the reading's own quantity (for predicted beside measured). */
export function fromDesignBasis(quantity: AmplitudeQuantity, peak: number): number {
  if (quantity === "velocity rms") return peakToRms(peak);
  if (quantity === "velocity peak") return peak;
  return 2 * peak;
}
