// Warnings about conditions outside a method's validity, found after the analysis.
import { GAZETAS_A0_LIMIT, NEARLY_INCOMPRESSIBLE_NU } from "./criteria-defaults";
import type { Model } from "./model";
import type { SoilCase } from "./soil-case";
import type { SweepSettings } from "./sweep-grid";

export function analysisWarnings(model: Model, nominal: SoilCase, sweep: SweepSettings): string[] {
  const warnings: string[] = [];
  const nu = model.input.soil.poissonRatio;
  if (nu > NEARLY_INCOMPRESSIBLE_NU) {
    warnings.push(`Poisson's ratio ${nu} is above ${NEARLY_INCOMPRESSIBLE_NU}: the soil is nearly incompressible (saturated clay?) and the half-space formulas lose accuracy.`);
  }
  if (model.input.impedance.method === "gazetas") {
    const B = nominal.impedance.details.B ?? 0;
    const Vs = nominal.soil.shearWaveVelocity;
    const a0 = (hz: number) => (2 * Math.PI * hz * B) / Vs;
    for (const r of model.rotors) {
      const top = a0(r.rangeRpm[1] / 60);
      if (top > GAZETAS_A0_LIMIT) {
        warnings.push(
          `${r.machine} ${r.rotor}: a0 = w B / Vs reaches ${top.toFixed(2)} in the speed range, beyond ${GAZETAS_A0_LIMIT} where the straight-line dynamic multipliers of Gazetas (1991) are used here.`,
        );
      }
    }
    const limitHz = (GAZETAS_A0_LIMIT * Vs) / (2 * Math.PI * B);
    if (sweep.toHz > limitHz) {
      warnings.push(`Sweep: above ${limitHz.toFixed(1)} Hz a0 exceeds ${GAZETAS_A0_LIMIT}; the Gazetas (1991) multipliers are extrapolated there (floored at a small positive value).`);
    }
  }
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
