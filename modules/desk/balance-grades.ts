// ISO 1940-1 (now ISO 21940-11) balance quality grades G = e w in mm/s, with the
// machine classes commonly given for each (typical grades recalled from memory;
// the vendor's figure takes precedence).
export const balanceGradeSeries = [0.4, 1, 2.5, 6.3, 16, 40, 100] as const;

export const balanceGradeClasses: { grade: number; label: string }[] = [
  { grade: 2.5, label: "G 2.5: gas and steam turbines, compressors, motors above 950 r/min" },
  { grade: 6.3, label: "G 6.3: pumps, fans, blowers, general machinery, motors up to 950 r/min" },
  { grade: 16, label: "G 16: agricultural machinery, crushers, drive shafts" },
  { grade: 1, label: "G 1: precision drives, small armatures" },
  { grade: 0.4, label: "G 0.4: gyroscopes, precision spindles" },
  { grade: 40, label: "G 40: rigidly mounted slow engines, car wheels" },
];

export const BALANCE_GRADE_SOURCE = "ISO 1940-1 (ISO 21940-11) balance quality grades; typical machine classes recalled from memory";

/** Soil property hints: typical ranges, shown beside the inputs (textbook ranges, recalled from memory). */
export const soilHints = {
  shearWaveVelocity: "Typical Vs: soft clay 80–180 m/s, medium-dense sand 180–350 m/s, dense gravel 350–750 m/s (site classes by Vs30 in ASCE 7 Table 20.3-1, recalled from memory)",
  shearModulus: "G = ρ Vs². Typical G: soft clay 5–40 MPa, medium-dense sand 40–150 MPa, dense gravel 150–600 MPa (recalled from memory)",
  poissonRatio: "Typical ν: dry sand 0.25–0.35, saturated clay 0.45–0.49 (values above 0.45 are nearly incompressible)",
  density: "Typical ρ: 1600–2100 kg/m³",
  materialDamping: "Blank means 0 (the contract's default). Typical β: 0.02–0.05 for sands and clays at small strain",
  allowableBearingPressure: "From the geotechnical report (allowable, not ultimate)",
  embedment: "Depth of the underside below grade; sidewall contact counts only the height in firm contact with the soil",
} as const;

/** Shear-wave velocity from the SPT blow count, Imai & Tonouchi (1982): Vs = 97.0 N^0.314 m/s. */
export function vsFromSpt(n: number): number {
  return 97.0 * Math.pow(n, 0.314);
}
