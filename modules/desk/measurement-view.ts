// What a measurement record stores of its evaluation (measurement_records.verdicts and
// .calibration, jsonb) and how the desk reads it back. The shape is the desk's own: the
// evaluation (modules/commissioning, run on the analysis pool) is mapped into it once, when
// the record is made, so a record reads the same whatever later engines compute.

/** One reading judged: as measured, in the design check's basis, beside the prediction. */
export interface StoredReading {
  location: string;
  direction: string;
  /** "velocity" | "displacement" | "frequency" (a frequency or speed reading is not judged against a limit). */
  kind: "velocity" | "displacement" | "frequency";
  /** The value as measured (SI: m/s, m or Hz) and its basis as stated ("rms", "peak", "peak-to-peak"). */
  measured: number;
  measuredBasis: string;
  /** The same in the basis of the design check (SI) and that basis. */
  value: number;
  basis: string;
  /** The revision's prediction at this bearing, direction and speed (SI, the same basis); null when none. */
  predicted: number | null;
  ratio: number | null;
  /** The revision's criterion (SI, same basis) and its source. */
  limit: number | null;
  limitSource: string | null;
  /** ISO 20816-3 zone (A, B, C, D) of an r.m.s. velocity reading, with the boundaries used. */
  zone: string | null;
  zoneSource: string | null;
  /** "pass", "fail" or "info" (nothing to judge against), and the words shown. */
  verdict: "pass" | "fail" | "info";
  verdictText: string;
}

export interface TracePlot {
  kind: "velocity" | "displacement";
  basis: string;
  location: string;
  direction: string;
  measured: { hz: number; value: number }[];
  predicted: { hz: number; value: number }[];
  /** What the predicted curve is (e.g. the bearing's steady-state response, or the envelope over the points). */
  predictedLabel: string;
}

export interface StoredVerdicts {
  record: { verdict: "pass" | "fail" | "info"; text: string };
  readings: StoredReading[];
  /** Measured resonance speeds of a run-up trace (rpm), and their frequencies (Hz). */
  resonances: { rpm: number; hz: number }[];
  /** A run-up trace and the revision's predicted response for it, both in the same basis (SI), for the plot. */
  tracePlot: TracePlot | null;
  /** Machine group and support the zones were read for, as stated. */
  zoneBasis: string | null;
  notes: string[];
}

export interface StoredCalibration {
  fittedShearModulus: number;
  designShearModulus: number;
  bandLower: number;
  bandUpper: number;
  position: "below" | "inside" | "above";
  /** The measured resonance(s) fitted (Hz) and what the fitted model gives for them (Hz). */
  measuredHz: number[];
  fittedHz: number[];
  /** The search: bounds of G (Pa) and tolerance as the engine states them. */
  searchLower: number;
  searchUpper: number;
  tolerance: string;
  /** The fitted model at the operating speed: natural frequencies near it and the governing check. */
  atOperating: { label: string; kind: "frequency" | "velocity" | "displacement" | "ratio"; designed: number | null; fitted: number | null }[];
  engineVersion: string;
  notes: string[];
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === "object" && v !== null && !Array.isArray(v);
}

/** The stored verdicts, or null for anything else (a record is never half-read as another shape). */
export function storedVerdicts(v: unknown): StoredVerdicts | null {
  if (!isObject(v) || !isObject(v.record) || !Array.isArray(v.readings)) return null;
  return v as unknown as StoredVerdicts;
}

export function storedCalibration(v: unknown): StoredCalibration | null {
  if (!isObject(v) || typeof v.fittedShearModulus !== "number") return null;
  return v as unknown as StoredCalibration;
}

export const RECORD_VERDICT_WORDS = { pass: "within limits", fail: "outside limits", info: "nothing to judge" } as const;

/** A record's verdict in words (list, register, revision page). */
export function recordVerdictText(v: unknown): string {
  const s = storedVerdicts(v);
  if (!s) return "—";
  return s.record.text || RECORD_VERDICT_WORDS[s.record.verdict];
}

export const POSITION_WORDS = { below: "below the design band (softer soil)", inside: "inside the design band", above: "above the design band (stiffer soil)" } as const;

/**
 * The verdicts as a reader without the design side (a vendor) gets them: readings against the
 * limits and zones, without the revision's prediction, ratio or predicted curve.
 */
export function verdictsWithoutDesignSide(v: unknown): unknown {
  const s = storedVerdicts(v);
  if (!s) return v;
  return {
    ...s,
    readings: s.readings.map((r) => ({ ...r, predicted: null, ratio: null })),
    tracePlot: s.tracePlot ? { ...s.tracePlot, predicted: [], predictedLabel: "" } : null,
  };
}
