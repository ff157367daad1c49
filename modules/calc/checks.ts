// Acceptance checks: frequency separation of every mode from every operating range, displacement
// and velocity at every point for every case (enveloped over the speed range), mass ratio,
// eccentricity of the combined cg and static bearing pressure.
import { CRITERIA_DEFAULTS, USER_CRITERION_SOURCE, type CriterionKey } from "./criteria-defaults";
import type { Mode } from "./eigen";
import type { AnalysisInput } from "./schema";
import type { CheckResult, CombinedResult, MassPropertiesResult, ResolvedCriterion, RotorResult } from "./result-types";

export type Criteria = Record<CriterionKey, ResolvedCriterion>;

/** Criteria with the product defaults filled in, each with its source. */
export function resolveCriteria(input: AnalysisInput): Criteria {
  const given = input.criteria ?? {};
  const out = {} as Criteria;
  for (const key of Object.keys(CRITERIA_DEFAULTS) as CriterionKey[]) {
    const d = CRITERIA_DEFAULTS[key];
    const v = given[key];
    out[key] = v === undefined ? { value: d.value, unit: d.unit, source: d.source } : { value: v, unit: d.unit, source: USER_CRITERION_SOURCE };
  }
  return out;
}

/** Smallest |r - 1| of r = speed / fn over a speed range; 0 when the range crosses the mode. */
export function separationOverRange(rangeHz: [number, number], naturalHz: number): number {
  const lo = rangeHz[0] / naturalHz;
  const hi = rangeHz[1] / naturalHz;
  if (lo <= 1 && hi >= 1) return 0;
  return Math.min(Math.abs(lo - 1), Math.abs(hi - 1));
}

function check(
  base: Omit<CheckResult, "pass">,
): CheckResult {
  const pass = base.comparison === "min" ? base.value >= base.limit : base.value <= base.limit;
  return { ...base, pass };
}

/**
 * The checks that depend on the soil stiffness (frequency separation, displacement, velocity) for
 * one soil case's modes and rotor responses: at nominal here, at the band's bounds in
 * band-checks.ts, with the same measures and criteria.
 */
export function soilDependentChecks(criteria: Criteria, modes: Mode[], rotors: RotorResult[], combined: CombinedResult[] = []): CheckResult[] {
  const checks: CheckResult[] = [];
  for (const r of rotors) {
    const range = r.speedRangeRpm ?? [r.speedRpm, r.speedRpm];
    modes.forEach((m, i) => {
      const value = separationOverRange([range[0] / 60, range[1] / 60], m.frequencyHz);
      checks.push(
        check({
          id: "frequency-separation",
          key: `frequency-separation/${r.machine}/${r.rotor}/mode-${i + 1}`,
          label: `Mode ${i + 1} (${m.dominant}, ${m.frequencyHz.toFixed(2)} Hz) against ${r.machine} ${r.rotor} ${range[0]}-${range[1]} rpm: smallest |r - 1|`,
          value,
          limit: criteria.frequencySeparation.value,
          comparison: "min",
          unit: "-",
          source: criteria.frequencySeparation.source,
          machine: r.machine,
          rotor: r.rotor,
          mode: i + 1,
        }),
      );
    });
  }
  for (const r of rotors) {
    for (const c of r.cases) {
      for (const p of c.points) {
        checks.push(
          ...amplitudeChecks(criteria, {
            kind: "single",
            keyTail: `${r.machine}/${r.rotor}/${c.case}/${c.unbalanceMode}/${p.name}`,
            where: `${p.name}, ${r.machine} ${r.rotor} ${c.case} ${c.unbalanceMode} unbalance, over the speed range`,
            displacement: p.overSpeedRange?.displacementPeak ?? Math.max(...p.displacementPeak),
            velocity: p.overSpeedRange?.velocityPeak ?? Math.max(...p.velocityPeak),
            common: { machine: r.machine, rotor: r.rotor, case: c.case, unbalanceMode: c.unbalanceMode, point: p.name },
          }),
        );
      }
    }
  }
  checks.push(...combinedChecks(criteria, combined));
  return checks;
}

/**
 * The displacement and velocity checks of one point and load case, a single rotor's
 * (`displacement`, `velocity`) or a combination's (`displacement-combined`, `velocity-combined`),
 * against the same two limits.
 */
function amplitudeChecks(
  criteria: Criteria,
  at: { kind: "single" | "combined"; keyTail: string; where: string; displacement: number; velocity: number; common: Partial<CheckResult> },
): CheckResult[] {
  const suffix = at.kind === "combined" ? "-combined" : "";
  const lead = at.kind === "combined" ? "Combined peak" : "Peak";
  return [
    check({
      id: `displacement${suffix}`,
      key: `displacement${suffix}/${at.keyTail}`,
      label: `${lead} displacement at ${at.where}`,
      value: at.displacement,
      limit: criteria.maxDisplacementPeak.value,
      comparison: "max",
      unit: "m",
      source: criteria.maxDisplacementPeak.source,
      ...at.common,
    }),
    check({
      id: `velocity${suffix}`,
      key: `velocity${suffix}/${at.keyTail}`,
      label: `${lead} velocity at ${at.where}`,
      value: at.velocity,
      limit: criteria.maxVelocityPeak.value,
      comparison: "max",
      unit: "m/s",
      source: criteria.maxVelocityPeak.source,
      ...at.common,
    }),
  ];
}

/**
 * `displacement-combined` and `velocity-combined`: every point of every combination (same-speed
 * groups at their worst relative phase, then all speeds by the absolute sum), every combined case,
 * the value enveloped over the speed range as for the single-rotor checks, against the same limits.
 * The single-rotor checks above are unchanged.
 */
export function combinedChecks(criteria: Criteria, combined: CombinedResult[]): CheckResult[] {
  const checks: CheckResult[] = [];
  for (const g of combined) {
    const what = g.speedRpm === undefined ? `${g.group.join(" + ")} at their different speeds (sum of peaks)` : `${g.group.join(" + ")} together at ${g.speedRpm} rpm (worst phase)`;
    for (const c of g.cases) {
      for (const p of c.points) {
        checks.push(
          ...amplitudeChecks(criteria, {
            kind: "combined",
            keyTail: `${g.id}/${c.case}/${c.unbalanceMode}/${p.name}`,
            where: `${p.name}, ${what}, ${c.case} ${c.unbalanceMode} unbalance, over the speed range`,
            displacement: p.overSpeedRange.displacementPeak,
            velocity: p.overSpeedRange.velocityPeak,
            common: { combination: g.id, case: c.case, unbalanceMode: c.unbalanceMode, point: p.name },
          }),
        );
      }
    }
  }
  return checks;
}

export function buildChecks(
  criteria: Criteria,
  mass: MassPropertiesResult,
  modes: Mode[],
  rotors: RotorResult[],
  allowableBearingPressure: number,
  combined: CombinedResult[] = [],
): CheckResult[] {
  const checks = soilDependentChecks(criteria, modes, rotors, combined);
  checks.push(
    check({
      id: "mass-ratio",
      key: "mass-ratio",
      label: "Block mass over machine mass",
      value: mass.massRatio,
      limit: criteria.minMassRatio.value,
      comparison: "min",
      unit: "-",
      source: criteria.minMassRatio.source,
    }),
    check({
      id: "eccentricity",
      key: "eccentricity/x",
      label: "Offset of the combined centre of gravity from O along x over the base length",
      value: Math.abs(mass.eccentricity[0]),
      limit: criteria.maxEccentricity.value,
      comparison: "max",
      unit: "-",
      source: criteria.maxEccentricity.source,
    }),
    check({
      id: "eccentricity",
      key: "eccentricity/y",
      label: "Offset of the combined centre of gravity from O along y over the base width",
      value: Math.abs(mass.eccentricity[1]),
      limit: criteria.maxEccentricity.value,
      comparison: "max",
      unit: "-",
      source: criteria.maxEccentricity.source,
    }),
    check({
      id: "bearing-pressure",
      key: "bearing-pressure",
      label: "Static bearing pressure over the allowable bearing pressure",
      value: mass.staticBearingPressure / allowableBearingPressure,
      limit: criteria.maxBearingRatio.value,
      comparison: "max",
      unit: "-",
      source: criteria.maxBearingRatio.source,
    }),
  );
  return checks;
}

/** Why the soil bearing-pressure check does not apply, for the supports that carry the load themselves. */
export const BEARING_NOT_APPLICABLE: Partial<Record<AnalysisInput["impedance"]["method"], string>> = {
  springs: "the block's weight goes through the springs into the supporting structure, not by contact pressure on soil",
  piles: "the cap's weight goes through the piles (the cap-soil contact is ignored), not by contact pressure on soil",
};

/**
 * Under springs and piles the static bearing pressure (kept in `massProperties`) is not the load
 * path: the `bearing-pressure` check stays in the list with its value for information, marked
 * not applicable with the reason, and does not decide the verdict. Soil methods: unchanged.
 */
export function markNotApplicable(checks: CheckResult[], method: AnalysisInput["impedance"]["method"], onBaseBlock = false): CheckResult[] {
  // springs on a base block: the base bears on the soil, so the check applies (analyse.ts)
  const reason = onBaseBlock ? undefined : BEARING_NOT_APPLICABLE[method];
  if (!reason) return checks;
  return checks.map((c) => (c.id === "bearing-pressure" ? { ...c, pass: true, notApplicable: { reason } } : c));
}
