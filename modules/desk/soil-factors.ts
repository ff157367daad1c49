// The soil factors of an impedance result (embedment, stratum) and the stratum's cutoff
// frequencies, as rows with their published sources: shown in the explanation panel, the
// frequency-response plots and the package's soil-springs sheet.
import { GAZETAS_DYNAMIC_SOURCES, type GazetasDynamic } from "@/modules/calc/impedance-gazetas";
import type { ImpedanceResult } from "@/modules/calc/result-types";

export const FACTOR_DOFS = ["X", "Y", "Z", "Rx", "Ry", "Rz"] as const;
export const FACTOR_DOF_LABELS = ["sliding x", "sliding y", "vertical", "rocking about x", "rocking about y", "torsion"] as const;

export interface SoilFactorRow {
  label: string;
  /** One value per DOF x, y, z, rx, ry, rz. */
  values: number[];
  source: string;
}

const EMBEDMENT_SOURCE: Record<ImpedanceResult["method"], string> = {
  gazetas: "Gazetas (1991) Table 2, J. Geotech. Eng. ASCE 117(9) (K_t,emb recalled); forms checked against a second statement, see CONVENTIONS.md",
  "equivalent-radius": "Arya, O'Neill & Pincus (1979) (recalled); torsion unfactored",
  user: "",
  springs: "",
};

const STRATUM_SOURCE =
  "Kausel (1974) circular-footing stratum factors 1 + 1.28 R/H, 1 + R/2H, 1 + R/6H, as tabulated in Gazetas (1983) Table 1 (recalled); torsion 1";

/** Factor rows present in the result's details (none for user springs or a surface base on a half-space). */
export function soilFactorRows(imp: ImpedanceResult): SoilFactorRow[] {
  const d = imp.details ?? {};
  const row = (prefix: string): number[] | null => {
    const v = FACTOR_DOFS.map((k) => d[`${prefix}${k}`]);
    return v.every((x) => typeof x === "number") ? (v as number[]) : null;
  };
  const rows: SoilFactorRow[] = [];
  const emb = row("embedmentFactor");
  if (emb && emb.some((x) => x !== 1)) rows.push({ label: "Embedment factor", values: emb, source: EMBEDMENT_SOURCE[imp.method] });
  const strat = row("stratumFactor");
  if (strat) rows.push({ label: "Stratum factor (layer over rock)", values: strat, source: STRATUM_SOURCE });
  return rows;
}

export interface StratumSummary {
  thickness: number;
  cutoffCompressionHz: number;
  cutoffShearHz: number;
  /** The equivalent stratum of a layered profile, when the input gave layers. */
  profile?: { shearWaveVelocity: number; density: number; poissonRatio: number };
  source: string;
}

export function stratumSummary(imp: ImpedanceResult): StratumSummary | null {
  const d = imp.details ?? {};
  if (d.stratumThickness === undefined || d.cutoffHzCompression === undefined || d.cutoffHzShear === undefined) return null;
  return {
    thickness: d.stratumThickness,
    cutoffCompressionHz: d.cutoffHzCompression,
    cutoffShearHz: d.cutoffHzShear,
    ...(d.profileShearWaveVelocity !== undefined
      ? { profile: { shearWaveVelocity: d.profileShearWaveVelocity, density: d.profileDensity ?? NaN, poissonRatio: d.profilePoissonRatio ?? NaN } }
      : {}),
    source:
      "Cutoffs V_La/4H (vertical, rocking) and Vs/4H (sliding, torsion), Gazetas (1991); no radiation damping below them. Layers: travel-time average Vs over the depth to rock (the Vs30 rule, ASCE 7-16 eq. 20.4-1, EN 1998-1 eq. 3.1)",
  };
}

/** Cutoff lines for the frequency-response plots. */
export function cutoffMarkers(imp: ImpedanceResult): { hz: number; label: string }[] {
  const s = stratumSummary(imp);
  if (!s) return [];
  return [
    { hz: s.cutoffShearHz, label: "cutoff Vs/4H" },
    { hz: s.cutoffCompressionHz, label: "cutoff V_La/4H" },
  ];
}

export interface DynamicCoefficientSource {
  option: GazetasDynamic;
  /** The option as the desk names it. */
  label: string;
  source: string;
}

const DYNAMIC_LABELS: Record<GazetasDynamic, string> = {
  published: "Gazetas' charts (default)",
  "pais-kausel": "Pais & Kausel closed forms",
  simplified: "Simplified k = 1, c = 1",
};

/**
 * Which dynamic coefficients a Gazetas result used, read from its details (so a stored revision
 * names what its engine did: engines 1.1.0-1.4.0 have no chart flag and their default was the
 * Pais & Kausel closed forms; engine 1.0.0 has neither flag and used k = 1, c = 1). Null for the
 * other methods.
 */
export function dynamicCoefficientSource(imp: ImpedanceResult): DynamicCoefficientSource | null {
  if (imp.method !== "gazetas") return null;
  const d = imp.details ?? {};
  // no flag at all: an engine before issue 13, which took k = 1, c = 1
  const option: GazetasDynamic = d.publishedDynamicCoefficients !== 1 ? "simplified" : d.chartDynamicCoefficients === 1 ? "published" : "pais-kausel";
  return { option, label: DYNAMIC_LABELS[option], source: GAZETAS_DYNAMIC_SOURCES[option] };
}
