// Gazetas (1991) charts as the default dynamic coefficients (engine 1.5.0). The tables are the
// digitisation published by geofound (eng-tools/geofound, geofound/tables_of_dyn_coefficients.py,
// MIT); expected values below are typed from that file or from its raw digitised curve points
// (geofound/_raw_data/*.csv), or from the closed forms of Pais & Kausel (1988) as reprinted in
// NIST GCR 12-917-21 (2012) Table 2-3a. The paper's own figures were not in hand (see
// CONVENTIONS.md, "What could be checked").
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { CHART_A0, GAZETAS_CHARTS, chartDashpotCoefficients, chartStiffnessCoefficients, readGazetasChart } from "@/modules/calc/gazetas-charts";
import { gazetasDashpots, gazetasDynamicMultipliers, gazetasRadiationCoefficients } from "@/modules/calc/impedance-gazetas";
import type { AnalysisInputDocument } from "@/modules/calc/schema";
import { G_SAND, NU, RHO_SOIL, relClose, symmetricBlock } from "./helpers";

const PK = "pais-kausel" as const;
const VS = Math.sqrt(G_SAND / RHO_SOIL);

function run(doc: AnalysisInputDocument) {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return analyse(parsed.input);
}

describe("digitised graphs of Gazetas (1991) Table 1 read back (geofound tables_of_dyn_coefficients.py)", () => {
  const C = GAZETAS_CHARTS;
  it("the a0 grid is geofound's linspace(0, 2, 10)", () => {
    expect(CHART_A0.length).toBe(10);
    expect(CHART_A0[9]).toBe(2);
    expect(CHART_A0[1]).toBeCloseTo(2 / 9, 15);
  });

  it("tabulated points come back exactly at the grid, graph by graph", () => {
    // k_z, nu <= 0.4: the "1-2" curve at a0 = 2 (geofound row 1.2: 0.6001), L/B = 6 at a0 = 8/9 (1.196)
    expect(readGazetasChart(C.kzNuUpTo04, 2, 1)).toBe(0.6001);
    expect(readGazetasChart(C.kzNuUpTo04, 2, 2)).toBe(0.6001);
    expect(readGazetasChart(C.kzNuUpTo04, 8 / 9, 6)).toBeCloseTo(1.196, 12);
    // k_z, nu = 0.5: L/B = 1 at a0 = 2 (0.2301); L/B = 6 falls below 0 at a0 = 14/9 (-0.1174)
    expect(readGazetasChart(C.kzNu05, 2, 1)).toBeCloseTo(0.2301, 12);
    expect(readGazetasChart(C.kzNu05, 14 / 9, 6)).toBeCloseTo(-0.1174, 12);
    // k_y: L/B = 4 at a0 = 2 (1.263)
    expect(readGazetasChart(C.ky, 2, 4)).toBeCloseTo(1.263, 12);
    // c_z, nu <= 0.4: L/B = 10 at a0 = 0 (1.773); factor for nu -> 0.5, L/B = 6 at a0 = 0 (1.12)
    expect(readGazetasChart(C.czNuUpTo04, 0, 10)).toBe(1.773);
    expect(readGazetasChart(C.czFactorNu05, 0, 6)).toBe(1.12);
    // c_y: L/B = 1 at a0 = 2 (0.8119)
    expect(readGazetasChart(C.cy, 2, 1)).toBeCloseTo(0.8119, 12);
    // c_rx: L/B = 2 at a0 = 10/9 (0.3839); c_ry: L/B = 4 at a0 = 2/9 (0.5096); c_t: L/B = 3 at a0 = 2 (0.9309)
    expect(readGazetasChart(C.crx, 10 / 9, 2)).toBeCloseTo(0.3839, 12);
    expect(readGazetasChart(C.cry, 2 / 9, 4)).toBeCloseTo(0.5096, 12);
    expect(readGazetasChart(C.ct, 2, 3)).toBeCloseTo(0.9309, 12);
    for (const chart of Object.values(C)) expect(chart.graph).toMatch(/^Table 1, /);
  });

  it("between the grid: linear in a0 and in L/B; clamped beyond a0 = 2 and beyond the largest curve", () => {
    // a0 = 1 is the midpoint of 8/9 and 10/9: c_ry, L/B = 1 = (0.2693 + 0.346) / 2
    expect(readGazetasChart(C.cry, 1, 1)).toBeCloseTo((0.2693 + 0.346) / 2, 12);
    // L/B = 3 is the midpoint of the 2 and 4 curves: c_rx at a0 = 2 = (0.5523 + 0.5814) / 2
    expect(readGazetasChart(C.crx, 2, 3)).toBeCloseTo((0.5523 + 0.5814) / 2, 12);
    expect(readGazetasChart(C.crx, 3.5, 2)).toBe(readGazetasChart(C.crx, 2, 2));
    expect(readGazetasChart(C.ct, 1, 20)).toBe(readGazetasChart(C.ct, 1, 6));
    // nu between 0.4 and 0.5: the two k_z graphs in proportion (nu = 0.45: their mean)
    expect(chartStiffnessCoefficients(2, 1, 0.45).z).toBeCloseTo((0.6001 + 0.2301) / 2, 12);
    expect(chartStiffnessCoefficients(2, 1, 0.3).z).toBe(0.6001);
    // c_z for nu -> 0.5: the factor applies in full at 0.5, half at 0.45
    expect(chartDashpotCoefficients(0, 1, 0.45).z).toBeCloseTo(0.9178 * (1 + 0.5 * 0.038), 12);
  });

  it("reproduces geofound's raw digitised curve points (before its resampling) within 0.015", () => {
    // [chart, L/B, a0, value] from geofound/_raw_data/{crx,kz_gazetas_v_lte_0p4,kz_gazetas_v_gt_0p4,czf_gazetas_v_gt_0p4}.csv
    const raw: [keyof typeof C, number, number, number][] = [
      ["crx", 1, 0.92018145, 0.27247095],
      ["crx", 1, 1.3762186, 0.39489534],
      ["crx", 10, 1.0726612, 0.46153516],
      ["crx", 4, 1.3272496, 0.45735973],
      ["kzNuUpTo04", 1, 1.0795537, 0.88146555],
      ["kzNuUpTo04", 1, 1.4395703, 0.7867388],
      ["kzNuUpTo04", 4, 1.4181077, 0.91498405],
      ["kzNuUpTo04", 10, 1.2571491, 1.1292417],
      ["kzNu05", 1, 1.2278236, 0.7062894],
      ["czFactorNu05", 4, 0.75036126, 1.0313233],
    ];
    for (const [name, lb, a0, v] of raw) expect(Math.abs(readGazetasChart(C[name], a0, lb) - v)).toBeLessThan(0.015);
  });
});

describe("limits and the square base", () => {
  it("a0 -> 0: k_z = k_y = 1 for every L/B; the rocking and torsion dashpot coefficients vanish (digitised within 0.025 of 0)", () => {
    for (const lb of [1, 1.5, 2, 3, 4, 6, 10]) {
      const k = gazetasDynamicMultipliers(0, lb, NU);
      expect(k.z).toBe(1);
      expect(k.y).toBe(1);
      const c = gazetasRadiationCoefficients(0, lb, "published", NU);
      expect(c.rx).toBeLessThan(0.025);
      expect(c.ry).toBeLessThan(0.025);
      expect(c.t).toBeLessThan(0.025);
      expect(c.ry).toBeGreaterThanOrEqual(0);
    }
  });

  it("a0 -> 0: c_z and c_y keep their low-frequency chart values (0.918 and 0.867 for the square) and grow with L/B", () => {
    const sq = gazetasRadiationCoefficients(0, 1, "published", NU);
    expect(sq.z).toBe(0.9178);
    expect(sq.y).toBe(0.867);
    expect(sq.x).toBe(1);
    const long = gazetasRadiationCoefficients(0, 10, "published", NU);
    expect(long.z).toBeGreaterThan(1.5 * sq.z);
    expect(long.y).toBeGreaterThan(2 * sq.y);
  });

  it("square base: the separately digitised c_rx and c_ry graphs agree within 10 % (symmetry: rocking about either axis is the same)", () => {
    for (const a0 of [0.5, 1, 1.5, 2]) {
      const c = gazetasRadiationCoefficients(a0, 1, "published", NU);
      expect(relClose(c.rx, c.ry, 0.1)).toBe(true);
    }
  });

  it("square base at low a0: the charts and Pais & Kausel's independent fit agree within 5 % for k_z, c_rx, c_ry (a0 = 0.5)", () => {
    const k = gazetasDynamicMultipliers(0.5, 1, NU);
    const kp = gazetasDynamicMultipliers(0.5, 1, NU, PK);
    const c = gazetasRadiationCoefficients(0.5, 1, "published", NU);
    const cp = gazetasRadiationCoefficients(0.5, 1, PK, NU);
    expect(relClose(k.z, kp.z, 0.05)).toBe(true);
    expect(relClose(c.rx, cp.rx, 0.05)).toBe(true);
    expect(relClose(c.ry, cp.ry, 0.05)).toBe(true);
  });
});

describe("where the charts (default) and Pais & Kausel (option pais-kausel) differ", () => {
  it("L/B = 1, a0 = 2: k_z 0.600 against 0.829; c_ry 0.549 against 0.690 and c_rx 0.507 against 0.690 (Pais & Kausel 26-36 % more rocking damping: their unsafe side); c_y 0.812 against 1", () => {
    const k = gazetasDynamicMultipliers(2, 1, NU);
    const kp = gazetasDynamicMultipliers(2, 1, NU, PK);
    expect(k.z).toBe(0.6001);
    expect(kp.z).toBeCloseTo(1 - (0.6 * 4) / 14, 12);
    const c = gazetasRadiationCoefficients(2, 1, "published", NU);
    const cp = gazetasRadiationCoefficients(2, 1, PK, NU);
    expect(c.ry).toBeCloseTo(0.5493, 12);
    expect(cp.ry).toBeCloseTo(4 / 5.8, 12);
    expect(cp.ry / c.ry).toBeGreaterThan(1.25);
    expect(c.rx).toBeCloseTo(0.5073, 12);
    expect(cp.rx / c.rx).toBeGreaterThan(1.35);
    expect(c.y).toBeCloseTo(0.8119, 12);
    expect(cp.y).toBe(1);
  });

  it("L/B = 1, a0 = 1: c_ry 0.308 against 0.357 (Pais & Kausel 16 % more)", () => {
    expect(gazetasRadiationCoefficients(1, 1, "published", NU).ry).toBeCloseTo((0.2693 + 0.346) / 2, 12);
    expect(gazetasRadiationCoefficients(1, 1, PK, NU).ry).toBeCloseTo(1 / 2.8, 12);
  });

  it("L/B = 4, a0 = 1: the charts give more rocking damping (c_ry 0.834 against 0.776) and k_y 1.26 against Pais & Kausel's 1", () => {
    const c = gazetasRadiationCoefficients(1, 4, "published", NU);
    expect(c.ry).toBeCloseTo((0.8182 + 0.85) / 2, 12);
    expect(gazetasRadiationCoefficients(1, 4, PK, NU).ry).toBeCloseTo(1 / (1.8 / 6.25 + 1), 12);
    expect(gazetasDynamicMultipliers(1, 4, NU).y).toBeCloseTo((1.248 + 1.272) / 2, 12);
    expect(gazetasDynamicMultipliers(1, 4, NU, PK).y).toBe(1);
  });
});

describe("the options in the analysis", () => {
  // 7 x 3 m block, L/B = 7/3, rated speed 1500 rpm: a0 = w B / Vs with B = 1.5 m
  const doc = symmetricBlock({ lx: 7, ly: 3, impedance: { method: "gazetas" } });
  const a0 = (2 * Math.PI * 25 * 1.5) / VS;
  const base = { L: 3.5, B: 1.5, area: 21, Ibx: (7 * 27) / 12, Iby: (3 * 343) / 12, Jt: (7 * 27) / 12 + (3 * 343) / 12 };

  it("default: every dashpot at the rated speed is C = rho V A c with c read from the charts (long side along x: our rx is Gazetas' rx)", () => {
    const imp = run(doc).impedance;
    const dash = gazetasDashpots(RHO_SOIL, VS, NU, base);
    const c = gazetasRadiationCoefficients(a0, 7 / 3, "published", NU);
    expect(relClose(imp.dashpot!.rx, dash.rx * c.rx, 1e-9)).toBe(true);
    expect(relClose(imp.dashpot!.ry, dash.ry * c.ry, 1e-9)).toBe(true);
    expect(relClose(imp.dashpot!.z, dash.z * c.z, 1e-9)).toBe(true);
    expect(relClose(imp.dashpot!.y, dash.y * c.y, 1e-9)).toBe(true);
    expect(relClose(imp.dashpot!.rz, dash.t * c.t, 1e-9)).toBe(true);
    // c_rx at a0 = 1.33, L/B = 2.33 by hand: rows L/B = 2 and 4 at a0 = 10/9 and 12/9
    const row = (r: readonly number[]) => r[5]! + ((a0 - 10 / 9) / (2 / 9)) * (r[6]! - r[5]!);
    const hand = row(GAZETAS_CHARTS.crx.rows[1]!) + ((7 / 3 - 2) / 2) * (row(GAZETAS_CHARTS.crx.rows[2]!) - row(GAZETAS_CHARTS.crx.rows[1]!));
    expect(c.rx).toBeCloseTo(hand, 12);
    expect(relClose(imp.stiffness.z, imp.staticStiffness.z * gazetasDynamicMultipliers(a0, 7 / 3, NU).z, 1e-12)).toBe(true);
    expect(run(doc).impedance.details!.chartDynamicCoefficients).toBe(1);
  });

  it("pais-kausel: an accepted option that reproduces the closed forms (engine 1.4.0's default)", () => {
    const r = run({ ...doc, impedance: { method: "gazetas", gazetasDynamic: PK } });
    const dash = gazetasDashpots(RHO_SOIL, VS, NU, base);
    const a2 = a0 * a0;
    expect(relClose(r.impedance.dashpot!.rx, dash.rx * (a2 / (2.2 - 0.4 / (7 / 3) ** 3 + a2)), 1e-9)).toBe(true);
    expect(relClose(r.impedance.dashpot!.z, dash.z, 1e-9)).toBe(true);
    const kz = 1 - ((0.4 + 0.2 / (7 / 3)) * a2) / (10 / (1 + 3 * (7 / 3 - 1)) + a2);
    expect(relClose(r.impedance.stiffness.z, r.impedance.staticStiffness.z * kz, 1e-12)).toBe(true);
    expect(r.impedance.details!.chartDynamicCoefficients).toBe(0);
    expect(r.impedance.details!.publishedDynamicCoefficients).toBe(1);
    expect(r.warnings.some((w) => w.includes("Lysmer-analog limit 1"))).toBe(false);
  });

  it("keeps the a0 > 1.5 warnings and adds, for the charts only, that their coefficients are held beyond a0 = 2", () => {
    // sweep to 50 Hz on B = 1.5 m: a0 = 1.5 at 1.5 Vs / (2 pi 1.5) = 28.3 Hz
    const def = run(doc).warnings.find((w) => w.startsWith("Sweep: above"));
    expect(def).toContain("exceeds 1.5");
    expect(def).toContain("held at that value beyond");
    const pk = run({ ...doc, impedance: { method: "gazetas", gazetasDynamic: PK } }).warnings.find((w) => w.startsWith("Sweep: above"));
    expect(pk).toContain("exceeds 1.5");
    expect(pk).not.toContain("held at that value");
  });

  it("warns when L/B lies beyond the charts' curves (c_t ends at L/B = 6, the others at 10), not inside them", () => {
    const inside = run(doc);
    expect(inside.warnings.some((w) => w.startsWith("Gazetas (1991) charts: L/B"))).toBe(false);
    const long = run(symmetricBlock({ lx: 14, ly: 2, impedance: { method: "gazetas" } }));
    const w = long.warnings.find((x) => x.startsWith("Gazetas (1991) charts: L/B"));
    expect(w).toContain("c_t (L/B = 6)");
    expect(w).not.toContain("c_rx");
    const veryLong = run(symmetricBlock({ lx: 24, ly: 2, impedance: { method: "gazetas" } }));
    expect(veryLong.warnings.find((x) => x.startsWith("Gazetas (1991) charts: L/B"))).toContain("c_rx (L/B = 10)");
    // the closed forms have no such range
    const pk = run(symmetricBlock({ lx: 14, ly: 2, impedance: { method: "gazetas", gazetasDynamic: PK } }));
    expect(pk.warnings.some((x) => x.startsWith("Gazetas (1991) charts: L/B"))).toBe(false);
  });
});
