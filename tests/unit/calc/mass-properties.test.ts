// Mass properties of boxes, voids and machines (uniform-box inertia, parallel-axis theorem)
// and the rigid-body mass matrix about O.
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput } from "@/modules/calc";
import { massMatrixAboutO } from "@/modules/calc/mass-matrix";
import type { AnalysisInputDocument } from "@/modules/calc/schema";
import { relClose, symmetricBlock } from "./helpers";

function run(doc: AnalysisInputDocument) {
  const parsed = parseAnalysisInput(doc);
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.issues));
  return analyse(parsed.input);
}

describe("composite block with a void and a box machine", () => {
  const doc: AnalysisInputDocument = {
    ...symmetricBlock(),
    block: {
      concreteDensity: 2500,
      solids: [
        { name: "mat", x: [-3, 3], y: [-2, 2], z: [0, 1] },
        { name: "pit", x: [1, 2], y: [-1, 1], z: [0.5, 1], void: true },
      ],
    },
    machines: [{ name: "M", mass: 4000, cg: [0, 0, 1.5], box: { x: [-1, 1], y: [-0.5, 0.5], z: [1, 2] }, rotors: [] }],
  };
  const result = run(doc);
  const mp = result.massProperties;
  const mMat = 2500 * 24;
  const mPit = 2500 * 1;
  const mBlock = mMat - mPit;

  it("block mass, total mass, mass ratio, bearing pressure (g = 9.80665)", () => {
    expect(mp.blockMass).toBeCloseTo(mBlock, 6);
    expect(mp.totalMass).toBeCloseTo(mBlock + 4000, 6);
    expect(mp.massRatio).toBeCloseTo(mBlock / 4000, 12);
    expect(mp.staticBearingPressure).toBeCloseTo(((mBlock + 4000) * 9.80665) / 24, 6);
  });

  it("combined cg and inertia about it by the parallel-axis theorem", () => {
    const M = mMat - mPit + 4000;
    const cx = (-mPit * 1.5) / M;
    const cz = (mMat * 0.5 - mPit * 0.75 + 4000 * 1.5) / M;
    expect(mp.cg[0]).toBeCloseTo(cx, 12);
    expect(mp.cg[1]).toBeCloseTo(0, 12);
    expect(mp.cg[2]).toBeCloseTo(cz, 12);
    // I_yy about the combined cg: uniform boxes (a^2 + c^2) / 12 plus m d^2
    const Iyy =
      (mMat * (36 + 1)) / 12 + mMat * (cx ** 2 + (0.5 - cz) ** 2) -
      ((mPit * (1 + 0.25)) / 12 + mPit * ((1.5 - cx) ** 2 + (0.75 - cz) ** 2)) +
      (4000 * (4 + 1)) / 12 + 4000 * (cx ** 2 + (1.5 - cz) ** 2);
    expect(relClose(mp.inertiaAtCg[1]![1]!, Iyy, 1e-12)).toBe(true);
    expect(mp.eccentricity[0]).toBeCloseTo(cx / 6, 12);
  });
});

describe("mass matrix about O", () => {
  it("is symmetric with m I3, -m [r]x and I_cg + m (|r|^2 I - r r^T) blocks for a point mass", () => {
    const r: [number, number, number] = [0.7, -1.1, 2.3];
    const m = 1234;
    const M = massMatrixAboutO([{ mass: m, cg: r, inertiaAtCg: [10, 20, 30] }]);
    const at = (i: number, j: number) => M[i * 6 + j]!;
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) expect(at(i, j)).toBe(at(j, i));
    expect(at(0, 0)).toBe(m);
    // kinetic energy of the point: velocity u_t + theta x r; e.g. theta_y moves x by +z
    expect(at(0, 4)).toBeCloseTo(m * r[2], 12);
    expect(at(0, 5)).toBeCloseTo(-m * r[1], 12);
    expect(at(1, 3)).toBeCloseTo(-m * r[2], 12);
    expect(at(2, 3)).toBeCloseTo(m * r[1], 12);
    expect(at(3, 3)).toBeCloseTo(10 + m * (r[1] ** 2 + r[2] ** 2), 9);
    expect(at(3, 4)).toBeCloseTo(-m * r[0] * r[1], 9);
  });

  it("the kinetic energy 1/2 v^T M v equals that of the point moving with u_t + theta x r", () => {
    const r: [number, number, number] = [1.5, 0.4, -0.9];
    const m = 800;
    const M = massMatrixAboutO([{ mass: m, cg: r, inertiaAtCg: [0, 0, 0] }]);
    const v = [0.3, -0.2, 0.5, 0.11, -0.07, 0.13];
    const [tx, ty, tz] = [v[3]!, v[4]!, v[5]!];
    const vp = [v[0]! + ty * r[2] - tz * r[1], v[1]! + tz * r[0] - tx * r[2], v[2]! + tx * r[1] - ty * r[0]];
    let quad = 0;
    for (let i = 0; i < 6; i++) for (let j = 0; j < 6; j++) quad += v[i]! * M[i * 6 + j]! * v[j]!;
    expect(quad).toBeCloseTo(m * (vp[0]! ** 2 + vp[1]! ** 2 + vp[2]! ** 2), 9);
  });
});
