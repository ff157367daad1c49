// Verdicts of a site measurement: each reading converted to the basis of the design checks
// (velocity peak, displacement peak: how the engine stores its criteria, maxVelocityPeak and
// maxDisplacementPeak) and judged against the revision's criteria, and, as r.m.s. velocity,
// against the ISO 10816-3 / 20816-3 zones; the record takes its worst reading.
import { AMPLITUDE_QUANTITIES, type AmplitudeQuantity, type Reading } from "./types";
import { fromDesignBasis, toDesignBasis, toVelocityRms } from "./conversions";
import { ISO_ZONE_SOURCE, ZONE_WORDS, zoneBoundaries, zoneFails, zoneOf, type MachineGroup, type SupportClass, type Zone } from "./iso-zones";

export interface Criterion {
  /** SI, peak (m/s or m). */
  value: number;
  source: string;
}

export interface JudgeContext {
  runningHz: number;
  group: MachineGroup;
  criteria: { velocityPeak: Criterion | null; displacementPeak: Criterion | null };
  /** Support class for a reading (ISO 10816-3's 25 % rule from the revision's modes); rigid when not known. */
  supportOf?: (r: Reading) => SupportClass;
  /** The revision's predicted amplitude for a reading, in the design basis (peak, SI); null when none. */
  predictedPeak?: (r: Reading) => number | null;
}

export type Verdict = "pass" | "fail" | "info";

export interface JudgedReading {
  location: string;
  direction: string;
  kind: "velocity" | "displacement" | "frequency";
  measured: number;
  measuredBasis: string;
  value: number;
  basis: string;
  predicted: number | null;
  ratio: number | null;
  limit: number | null;
  limitSource: string | null;
  zone: Zone | null;
  zoneSource: string | null;
  verdict: Verdict;
  verdictText: string;
}

const basisOf: Record<AmplitudeQuantity, string> = { "velocity rms": "r.m.s.", "velocity peak": "peak", "displacement peak-to-peak": "peak-to-peak" };

export function isAmplitude(r: Reading): r is Reading & { quantity: AmplitudeQuantity } {
  return (AMPLITUDE_QUANTITIES as readonly string[]).includes(r.quantity);
}

export function judgeReading(r: Reading, ctx: JudgeContext): JudgedReading {
  if (!isAmplitude(r)) {
    return {
      location: r.bearing,
      direction: r.direction,
      kind: "frequency",
      measured: r.value,
      measuredBasis: r.quantity,
      value: r.value,
      basis: r.quantity,
      predicted: null,
      ratio: null,
      limit: null,
      limitSource: null,
      zone: null,
      zoneSource: null,
      verdict: "info",
      verdictText: r.quantity === "resonance" ? "used by the soil calibration" : "recorded, not judged",
    };
  }
  const design = toDesignBasis(r.quantity, r.value);
  const criterion = design.kind === "velocity" ? ctx.criteria.velocityPeak : ctx.criteria.displacementPeak;
  const support = ctx.supportOf?.(r) ?? "rigid";
  const bounds = zoneBoundaries(ctx.group, support);
  const zone = zoneOf(toVelocityRms(r.quantity, r.value, ctx.runningHz), bounds);
  const predicted = ctx.predictedPeak?.(r) ?? null;
  const overLimit = criterion !== null && design.value > criterion.value;
  const zoneBad = zoneFails(zone);
  const fail = overLimit || zoneBad;
  const reasons: string[] = [];
  if (criterion) reasons.push(overLimit ? "above the design limit" : "within the design limit");
  reasons.push(ZONE_WORDS[zone]);
  const zoneSource = `${ISO_ZONE_SOURCE}; group ${ctx.group}, ${support} support: A/B ${fmt(bounds.ab)}, B/C ${fmt(bounds.bc)}, C/D ${fmt(bounds.cd)} mm/s r.m.s.${r.quantity === "velocity rms" ? "" : " (the reading converted to r.m.s. velocity at the running speed, single frequency)"}`;
  return {
    location: r.bearing,
    direction: r.direction,
    kind: design.kind,
    measured: r.value,
    measuredBasis: basisOf[r.quantity],
    value: design.value,
    basis: design.basis,
    predicted,
    ratio: predicted !== null && predicted > 0 ? design.value / predicted : null,
    limit: criterion?.value ?? null,
    limitSource: criterion?.source ?? null,
    zone,
    zoneSource,
    verdict: fail ? "fail" : "pass",
    verdictText: `${fail ? "outside limits" : "within limits"}: ${reasons.join(", ")}`,
  };
}

const fmt = (v: number) => String(Math.round(v * 1e4) / 10);

/** The record's verdict: its worst reading (fail over pass over info). */
export function judgeRecord(readings: { verdict: Verdict }[]): { verdict: Verdict; text: string } {
  const fails = readings.filter((r) => r.verdict === "fail").length;
  const passes = readings.filter((r) => r.verdict === "pass").length;
  if (fails) return { verdict: "fail", text: `outside limits (${fails} of ${fails + passes} reading${fails + passes === 1 ? "" : "s"})` };
  if (passes) return { verdict: "pass", text: `within limits (${passes} reading${passes === 1 ? "" : "s"})` };
  return { verdict: "info", text: "nothing to judge" };
}

/** A predicted design-basis amplitude in the reading's own quantity (predicted beside measured as measured). */
export function predictedAsMeasured(quantity: AmplitudeQuantity, peak: number): number {
  return fromDesignBasis(quantity, peak);
}
