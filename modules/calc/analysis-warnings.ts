// Warnings about conditions outside a method's validity, found after the analysis.
import { GAZETAS_A0_LIMIT, NEARLY_INCOMPRESSIBLE_NU } from "./criteria-defaults";
import { CHART_A0_MAX } from "./gazetas-charts";
import type { Model } from "./model";
import type { SoilCase } from "./soil-case";
import type { SweepSettings } from "./sweep-grid";
import { CUTOFF_PROXIMITY } from "./soil-stratum";

export function analysisWarnings(model: Model, nominal: SoilCase, sweep: SweepSettings): string[] {
  const warnings: string[] = [];
  const nu = model.input.soil.poissonRatio;
  if (nu > NEARLY_INCOMPRESSIBLE_NU) {
    warnings.push(`Poisson's ratio ${nu} is above ${NEARLY_INCOMPRESSIBLE_NU}: the soil is nearly incompressible (saturated clay?) and the half-space formulas lose accuracy.`);
  }
  // springs on a base block with Gazetas soil under the base: the same validity warnings for the base's footprint
  const imp = model.input.impedance;
  const baseSupport = imp.method === "springs" && imp.base ? (imp.base.support ?? { method: "gazetas" as const }) : undefined;
  const gazetas = imp.method === "gazetas" ? imp : baseSupport?.method === "gazetas" ? baseSupport : undefined;
  const details = (baseSupport ? nominal.impedance.twoStage?.soil.details : undefined) ?? nominal.impedance.details;
  const who = baseSupport ? "Base block: " : "";
  if (gazetas) {
    const B = details.B ?? 0;
    const Vs = nominal.soil.shearWaveVelocity;
    const a0 = (hz: number) => (2 * Math.PI * hz * B) / Vs;
    const charts = (gazetas.gazetasDynamic ?? "published") === "published";
    const held = charts ? `; the charts' coefficients end at a0 = ${CHART_A0_MAX} and are held at that value beyond` : "";
    for (const r of model.rotors) {
      const top = a0(r.rangeRpm[1] / 60);
      if (top > GAZETAS_A0_LIMIT) {
        warnings.push(
          `${who}${r.machine} ${r.rotor}: a0 = w B / Vs reaches ${top.toFixed(2)} in the speed range, beyond ${GAZETAS_A0_LIMIT} where the straight-line dynamic multipliers of Gazetas (1991) are used here${held}.`,
        );
      }
    }
    const limitHz = (GAZETAS_A0_LIMIT * Vs) / (2 * Math.PI * B);
    if (sweep.toHz > limitHz) {
      warnings.push(`${who}Sweep: above ${limitHz.toFixed(1)} Hz a0 exceeds ${GAZETAS_A0_LIMIT}; the Gazetas (1991) multipliers are extrapolated there (floored at a small positive value)${held}.`);
    }
  }
  warnings.push(...cutoffWarnings(model, nominal, details, who));
  nominal.modes.forEach((m, i) => {
    for (const r of model.rotors) {
      const rpm = m.frequencyHz * 60;
      if (rpm >= r.rangeRpm[0] && rpm <= r.rangeRpm[1]) {
        warnings.push(
          `Resonance: mode ${i + 1} (${m.dominant}, ${m.frequencyHz.toFixed(2)} Hz = ${rpm.toFixed(0)} rpm) lies inside the speed range of ${r.machine} ${r.rotor} (${r.rangeRpm[0]}-${r.rangeRpm[1]} rpm).`,
        );
      }
    }
  });
  return warnings;
}

/**
 * An operating speed or a natural frequency near a stratum cutoff (within CUTOFF_PROXIMITY of
 * it, either side): there the radiation damping switches on or off, so the response is very
 * sensitive to the layer's thickness and Vs.
 */
function cutoffWarnings(model: Model, nominal: SoilCase, d: Record<string, number>, who: string): string[] {
  if (d.cutoffHzCompression === undefined || d.cutoffHzShear === undefined) return [];
  const cutoffs: [string, number][] = [
    ["vertical and rocking cutoff V_La / 4H", d.cutoffHzCompression],
    ["swaying and torsion cutoff Vs / 4H", d.cutoffHzShear],
  ];
  const near = (hz: number, fc: number) => Math.abs(hz - fc) <= CUTOFF_PROXIMITY * fc;
  const out: string[] = [];
  for (const [label, fc] of cutoffs) {
    for (const r of model.rotors) {
      const [lo, hi] = [r.rangeRpm[0] / 60, r.rangeRpm[1] / 60];
      if (hi >= fc * (1 - CUTOFF_PROXIMITY) && lo <= fc * (1 + CUTOFF_PROXIMITY)) {
        out.push(`${who}Stratum: the speed range of ${r.machine} ${r.rotor} (${r.rangeRpm[0]}-${r.rangeRpm[1]} rpm) lies within ${CUTOFF_PROXIMITY * 100} % of the ${label} (${fc.toFixed(2)} Hz): radiation damping changes abruptly there.`);
      }
    }
    nominal.modes.forEach((m, i) => {
      if (near(m.frequencyHz, fc)) {
        out.push(`${who}Stratum: mode ${i + 1} (${m.dominant}, ${m.frequencyHz.toFixed(2)} Hz) lies within ${CUTOFF_PROXIMITY * 100} % of the ${label} (${fc.toFixed(2)} Hz).`);
      }
    });
  }
  return out;
}
