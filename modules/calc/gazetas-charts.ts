// Digitised charts of Gazetas (1991), "Formulas and charts for impedances of surface and
// embedded foundations", J. Geotech. Eng. ASCE 117(9): the graphs of the paper's Table 1
// (surface foundations; Table 15.1 of Gazetas' chapter 15, "Foundation vibrations", Foundation
// Engineering Handbook, 2nd ed., 1991, which is the table geofound cites) for the dynamic
// stiffness coefficients k_z, k_y and the radiation dashpot coefficients c_z, c_y, c_rx, c_ry,
// c_t as functions of a0 = w B / Vs and L/B. CONVENTIONS.md names the graph of each table.
//
// The numbers are the digitisation published in the open-source library geofound
// (https://github.com/eng-tools/geofound, file geofound/tables_of_dyn_coefficients.py, as
// stored at commit 1234d7c4bc56caf54c6c4b05cd6d93b1a980644f): its curves resampled at ten
// values of a0 from 0 to 2 (a0 = 2 i / 9). Only the numbers are taken, not that library's code.
// The strip curves (L/B = infinity, geofound's row 1000) are not ported: beyond the largest
// finite curve the engine holds that curve and warns (gazetasChartAspectWarnings).
//
// geofound's licence, reproduced as it asks:
//
//   MIT License
//
//   Copyright (c) 2017 eng-tools
//
//   Permission is hereby granted, free of charge, to any person obtaining a copy
//   of this software and associated documentation files (the "Software"), to deal
//   in the Software without restriction, including without limitation the rights
//   to use, copy, modify, merge, publish, distribute, sublicense, and/or sell
//   copies of the Software, and to permit persons to whom the Software is
//   furnished to do so, subject to the following conditions:
//
//   The above copyright notice and this permission notice shall be included in all
//   copies or substantial portions of the Software.
//
//   THE SOFTWARE IS PROVIDED "AS IS", WITHOUT WARRANTY OF ANY KIND, EXPRESS OR
//   IMPLIED, INCLUDING BUT NOT LIMITED TO THE WARRANTIES OF MERCHANTABILITY,
//   FITNESS FOR A PARTICULAR PURPOSE AND NONINFRINGEMENT. IN NO EVENT SHALL THE
//   AUTHORS OR COPYRIGHT HOLDERS BE LIABLE FOR ANY CLAIM, DAMAGES OR OTHER
//   LIABILITY, WHETHER IN AN ACTION OF CONTRACT, TORT OR OTHERWISE, ARISING FROM,
//   OUT OF OR IN CONNECTION WITH THE SOFTWARE OR THE USE OR OTHER DEALINGS IN THE
//   SOFTWARE.

/** One digitised graph: rows[i][j] is the coefficient on the curve L/B = aspects[i] at a0 = CHART_A0[j]. */
export interface DigitisedChart {
  /** The graph of Gazetas (1991) Table 1 the numbers are read from. */
  graph: string;
  aspects: readonly number[];
  rows: readonly (readonly number[])[];
}

/** The a0 values of every table: 0, 2/9, 4/9, ..., 2 (geofound's resampling). */
export const CHART_A0: readonly number[] = Array.from({ length: 10 }, (_, i) => (2 * i) / 9);
export const CHART_A0_MAX = 2;

// geofound labels the lowest k_z curve "1.2" (its data column is named "1p2"); read here as the
// paper's curve for L/B = 1 to 2, so it is placed at both L/B = 1 and L/B = 2 (an interpretation,
// stated in CONVENTIONS.md).
const KZ_CURVE_1_TO_2 = [1, 1, 0.9885, 0.9677, 0.9216, 0.8732, 0.8147, 0.7504, 0.6791, 0.6001];

export const GAZETAS_CHARTS = {
  kzNuUpTo04: {
    graph: "Table 1, dynamic stiffness coefficient k_z, nu <= 0.4",
    aspects: [1, 2, 4, 6, 10],
    rows: [
      KZ_CURVE_1_TO_2,
      KZ_CURVE_1_TO_2,
      [1, 1.012, 1.032, 1.042, 1.023, 0.986, 0.9348, 0.8665, 0.7861, 0.6985],
      [1, 1.069, 1.142, 1.199, 1.196, 1.135, 1.043, 0.9441, 0.8508, 0.7575],
      [1, 1.124, 1.225, 1.275, 1.252, 1.184, 1.094, 0.9916, 0.8906, 0.8016],
    ],
  },
  kzNu05: {
    graph: "Table 1, dynamic stiffness coefficient k_z, nu = 0.5",
    aspects: [1, 6],
    rows: [
      [1, 1.007, 0.9804, 0.9235, 0.853, 0.7575, 0.6508, 0.5295, 0.3859, 0.2301],
      [1, 1.03, 1.043, 0.9886, 0.8232, 0.567, 0.2662, -0.1174, -0.5485, -0.5485],
    ],
  },
  ky: {
    graph: "Table 1, dynamic stiffness coefficient k_y (swaying along the short side)",
    aspects: [1, 2, 4, 6, 10],
    rows: [
      [1, 1.033, 1.035, 1.014, 0.9868, 0.9596, 0.9346, 0.9174, 0.9025, 0.8892],
      [1, 1.05, 1.087, 1.09, 1.09, 1.088, 1.083, 1.081, 1.083, 1.092],
      [1, 1.099, 1.165, 1.214, 1.248, 1.272, 1.28, 1.275, 1.264, 1.263],
      [1, 1.142, 1.245, 1.317, 1.366, 1.4, 1.418, 1.423, 1.423, 1.421],
      [1, 1.193, 1.344, 1.47, 1.539, 1.564, 1.572, 1.577, 1.575, 1.573],
    ],
  },
  czNuUpTo04: {
    graph: "Table 1, radiation dashpot coefficient c_z, nu <= 0.4",
    aspects: [1, 2, 4, 6, 10],
    rows: [
      [0.9178, 0.9252, 0.9327, 0.9402, 0.9478, 0.9555, 0.9633, 0.9711, 0.9856, 1.001],
      [0.9716, 0.9784, 0.9852, 0.9921, 0.9988, 1.005, 1.011, 1.017, 1.025, 1.037],
      [1.109, 1.102, 1.095, 1.088, 1.08, 1.07, 1.061, 1.057, 1.059, 1.061],
      [1.486, 1.29, 1.174, 1.114, 1.085, 1.072, 1.063, 1.06, 1.06, 1.061],
      [1.773, 1.416, 1.252, 1.176, 1.143, 1.121, 1.106, 1.096, 1.092, 1.088],
    ],
  },
  czFactorNu05: {
    graph: "Table 1, c_z graph for nu -> 0.5, as the factor on the nu <= 0.4 curve (geofound's 'czf')",
    aspects: [1, 2, 4, 6],
    rows: [
      [1.038, 1.03, 1.022, 1.015, 1.009, 1.006, 1.003, 1.003, 1.004, 1.004],
      [1.038, 1.03, 1.022, 1.015, 1.009, 1.006, 1.003, 1.003, 1.004, 1.004],
      [1.077, 1.061, 1.047, 1.035, 1.028, 1.023, 1.019, 1.017, 1.017, 1.017],
      [1.12, 1.096, 1.077, 1.062, 1.052, 1.045, 1.04, 1.036, 1.034, 1.036],
    ],
  },
  // geofound gives c_y for nu = 0.3 and nu = 0.5; the two differ only on the strip curve, which is
  // not ported, so one table serves every nu.
  cy: {
    graph: "Table 1, radiation dashpot coefficient c_y (swaying along the short side)",
    aspects: [1, 2, 4, 6, 10],
    rows: [
      [0.867, 0.823, 0.7952, 0.7786, 0.7699, 0.7627, 0.7586, 0.7624, 0.7748, 0.8119],
      [0.9977, 0.9977, 0.9963, 0.9901, 0.9632, 0.9317, 0.8953, 0.8737, 0.8619, 0.8601],
      [1.19, 1.185, 1.164, 1.103, 1.038, 0.9992, 0.9608, 0.9327, 0.909, 0.922],
      [1.369, 1.337, 1.255, 1.102, 1.02, 0.9654, 0.9254, 0.8997, 0.89, 0.8876],
      [1.899, 1.537, 1.289, 1.112, 1.029, 0.9787, 0.9361, 0.9051, 0.8951, 0.8945],
    ],
  },
  crx: {
    graph: "Table 1, radiation dashpot coefficient c_rx (rocking about the long axis x)",
    aspects: [1, 2, 4, 6, 10],
    rows: [
      [0.001, 0.04695, 0.107, 0.1845, 0.2618, 0.3281, 0.3844, 0.4283, 0.4682, 0.5073],
      [0.001, 0.07291, 0.1533, 0.2436, 0.3237, 0.3839, 0.4322, 0.4749, 0.5138, 0.5523],
      [0.001, 0.09579, 0.192, 0.2875, 0.3575, 0.4117, 0.4584, 0.4976, 0.5355, 0.5814],
      [0.001, 0.1211, 0.2245, 0.3158, 0.3921, 0.4433, 0.4834, 0.523, 0.5611, 0.6017],
      [0.001, 0.1527, 0.2606, 0.3435, 0.4129, 0.47, 0.5168, 0.5536, 0.593, 0.6308],
    ],
  },
  cry: {
    graph: "Table 1, radiation dashpot coefficient c_ry (rocking about the short axis y)",
    aspects: [1, 2, 4, 6, 10],
    rows: [
      [-0.002241, 0.04273, 0.1082, 0.1805, 0.2693, 0.346, 0.4115, 0.4635, 0.5075, 0.5493],
      [0.005605, 0.1354, 0.2878, 0.4248, 0.5328, 0.6157, 0.6876, 0.7459, 0.7954, 0.8386],
      [0.00897, 0.5096, 0.7022, 0.7836, 0.8182, 0.85, 0.8825, 0.9124, 0.9444, 0.9798],
      [0.02242, 0.721, 0.905, 0.9614, 0.9652, 0.9741, 0.9849, 0.9965, 0.9982, 1],
      [0.02018, 0.8797, 0.9786, 0.9983, 1, 1, 1, 1, 1, 1],
    ],
  },
  ct: {
    graph: "Table 1, radiation dashpot coefficient c_t (torsion)",
    aspects: [1, 2, 3, 4, 6],
    rows: [
      [0.001, 0.03851, 0.09381, 0.1696, 0.256, 0.3491, 0.4404, 0.5306, 0.621, 0.7171],
      [0.001, 0.09122, 0.2596, 0.4182, 0.5407, 0.6424, 0.7191, 0.7833, 0.8374, 0.8866],
      [0.001, 0.1896, 0.4323, 0.6588, 0.784, 0.8414, 0.8719, 0.8898, 0.9095, 0.9309],
      [0.001, 0.3115, 0.6502, 0.8543, 0.9193, 0.9532, 0.9651, 0.9658, 0.9677, 0.9713],
      [0.001, 0.5007, 0.853, 0.9474, 0.9834, 1, 1, 1, 1, 1],
    ],
  },
} as const satisfies Record<string, DigitisedChart>;

export type GazetasChartName = keyof typeof GAZETAS_CHARTS;

/** Index i and weight t with x between xs[i] and xs[i + 1] (x clamped to the ends). */
function bracket(xs: readonly number[], x: number): [number, number] {
  const n = xs.length;
  if (n < 2 || !(x > (xs[0] as number))) return [0, 0];
  if (x >= (xs[n - 1] as number)) return [n - 2, 1];
  let i = 0;
  while (x > (xs[i + 1] as number)) i++;
  const x0 = xs[i] as number;
  return [i, (x - x0) / ((xs[i + 1] as number) - x0)];
}

/**
 * The chart's value at (a0, L/B): linear in a0 and linear in L/B between the digitised curves;
 * a0 above 2 and L/B beyond the largest curve take the last value (clamped, warned elsewhere).
 */
export function readGazetasChart(chart: DigitisedChart, a0: number, aspect: number): number {
  const [j, s] = bracket(CHART_A0, a0);
  const [i, t] = bracket(chart.aspects, aspect);
  const at = (row: number) => {
    const r = chart.rows[row] as readonly number[];
    return (r[j] as number) * (1 - s) + (r[j + 1] as number) * s;
  };
  return chart.aspects.length < 2 ? at(0) : at(i) * (1 - t) + at(i + 1) * t;
}

/** Weight of the nu = 0.5 graph: 0 up to nu = 0.4, 1 at 0.5, linear between (engine choice). */
export function nuWeightTowardHalf(nu: number): number {
  return Math.min(Math.max((nu - 0.4) / 0.1, 0), 1);
}

/** k_z and k_y read from the charts (k_z between its nu <= 0.4 and nu = 0.5 graphs). */
export function chartStiffnessCoefficients(a0: number, aspect: number, nu: number): { z: number; y: number } {
  const w = nuWeightTowardHalf(nu);
  const low = readGazetasChart(GAZETAS_CHARTS.kzNuUpTo04, a0, aspect);
  const z = w === 0 ? low : low * (1 - w) + readGazetasChart(GAZETAS_CHARTS.kzNu05, a0, aspect) * w;
  return { z, y: readGazetasChart(GAZETAS_CHARTS.ky, a0, aspect) };
}

/**
 * c_z, c_y, c_rx, c_ry, c_t read from the charts, each at least 0 (the digitised rocking curve
 * of the square starts at -0.002, digitising noise about the curve's zero at a0 = 0). c_z takes
 * the nu -> 0.5 factor in proportion to nuWeightTowardHalf.
 */
export function chartDashpotCoefficients(a0: number, aspect: number, nu: number): { z: number; y: number; rx: number; ry: number; t: number } {
  const w = nuWeightTowardHalf(nu);
  const factor = w === 0 ? 1 : 1 + w * (readGazetasChart(GAZETAS_CHARTS.czFactorNu05, a0, aspect) - 1);
  const pos = (v: number) => Math.max(v, 0);
  return {
    z: pos(readGazetasChart(GAZETAS_CHARTS.czNuUpTo04, a0, aspect) * factor),
    y: pos(readGazetasChart(GAZETAS_CHARTS.cy, a0, aspect)),
    rx: pos(readGazetasChart(GAZETAS_CHARTS.crx, a0, aspect)),
    ry: pos(readGazetasChart(GAZETAS_CHARTS.cry, a0, aspect)),
    t: pos(readGazetasChart(GAZETAS_CHARTS.ct, a0, aspect)),
  };
}

/** The charts a base of this L/B lies beyond (largest digitised curve below L/B), for a warning. */
export function chartsBeyondAspect(aspect: number, nu: number): { name: string; largest: number }[] {
  const used: [string, DigitisedChart][] = [
    ["k_z", GAZETAS_CHARTS.kzNuUpTo04],
    ["k_y", GAZETAS_CHARTS.ky],
    ["c_z", GAZETAS_CHARTS.czNuUpTo04],
    ["c_y", GAZETAS_CHARTS.cy],
    ["c_rx", GAZETAS_CHARTS.crx],
    ["c_ry", GAZETAS_CHARTS.cry],
    ["c_t", GAZETAS_CHARTS.ct],
  ];
  if (nuWeightTowardHalf(nu) > 0) used.push(["k_z (nu = 0.5)", GAZETAS_CHARTS.kzNu05], ["c_z (nu = 0.5 factor)", GAZETAS_CHARTS.czFactorNu05]);
  return used
    .map(([name, c]) => ({ name, largest: c.aspects[c.aspects.length - 1] as number }))
    .filter((c) => aspect > c.largest * (1 + 1e-9));
}
