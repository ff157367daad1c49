// Head impedance of one flexible pile (method "piles", pile-single.ts), checked against the
// published forms written out here independently of the code:
// - Gazetas, G. (1991), "Foundation vibrations", Foundation Engineering Handbook 2nd ed., ch. 15,
//   flexible-pile closed forms and damping ratios (recalled from memory, as the code cites them;
//   K_HH uniform, its damping ratio and K_V also in a second public statement of the handbook).
// - Randolph, M. F. & Wroth, C. P. (1978), J. Geotech. Eng. Div. ASCE 104(GT12), the static
//   axial head stiffness as given in Fleming, Weltman, Randolph & Elson, Piling Engineering
//   (recalled), and its rigid-pile and rigid-stratum limits.
import { describe, expect, it } from "vitest";
import {
  activeLength,
  pileHeadDynamic,
  pileHeadStatic,
  randolphWrothVertical,
  soilYoungsModulus,
  verticalRodImpedance,
  type PileSoil,
  type PileSpec,
} from "@/modules/calc/pile-single";
import { relClose } from "./helpers";

// the pile-cap example: Vs 140 m/s, rho 1900, nu 0.3; d 0.5 m, L 14 m, Ep 30 GPa
const VS = 140;
const SOIL: PileSoil = { shearModulus: 1900 * VS * VS, density: 1900, poissonRatio: 0.3 };
const PILE: PileSpec = { diameter: 0.5, length: 14, youngsModulus: 3e10, density: 2500, tip: "floating", profile: "uniform" };
const ES = 2 * SOIL.shearModulus * 1.3;
const LAMBDA = PILE.youngsModulus / ES;

/** Randolph & Wroth (1978) as printed in Fleming et al., written out for the test (eta = 1). */
function rwByHand(G_L: number, rho: number, xi: number, nu: number, Ep: number, r0: number, L: number): number {
  const lambda = Ep / G_L;
  const rm = (0.25 + xi * (2.5 * rho * (1 - nu) - 0.25)) * L;
  const zeta = Math.log(rm / r0);
  const muL = Math.sqrt(2 / (zeta * lambda)) * (L / r0);
  const t = Math.tanh(muL) / muL;
  const tip = 4 / ((1 - nu) * xi);
  return (G_L * r0 * (tip + ((2 * Math.PI * rho) / zeta) * t * (L / r0))) / (1 + (1 / (Math.PI * lambda)) * tip * t * (L / r0));
}

describe("Gazetas (1991) flexible-pile head stiffness", () => {
  it("uniform soil: K_HH = d Es L^0.21, K_MM = 0.15 d^3 Es L^0.75, |K_HM| = 0.22 d^2 Es L^0.50 (L = Ep/Es)", () => {
    const s = pileHeadStatic(PILE, SOIL);
    expect(soilYoungsModulus(SOIL)).toBeCloseTo(ES, 0);
    expect(s.stiffnessRatio).toBeCloseTo(LAMBDA, 9);
    const d = PILE.diameter;
    expect(relClose(s.khh, d * ES * LAMBDA ** 0.21, 1e-12)).toBe(true);
    expect(relClose(s.kmm, 0.15 * d ** 3 * ES * LAMBDA ** 0.75, 1e-12)).toBe(true);
    expect(relClose(s.khm, 0.22 * d ** 2 * ES * LAMBDA ** 0.5, 1e-12)).toBe(true);
    // hand figures for the example: Es = 96.8 MPa, Ep/Es = 309.8, K_HH = 161.5 MN/m
    expect(ES / 1e6).toBeCloseTo(96.82, 2);
    expect(s.khh / 1e6).toBeCloseTo(161.5, 1);
  });

  it("modulus linear with depth Es z/d: K_HH = 0.6 d Es L^0.35, K_MM = 0.14 d^3 Es L^0.80, |K_HM| = 0.17 d^2 Es L^0.60", () => {
    const s = pileHeadStatic({ ...PILE, profile: "linear" }, SOIL);
    const d = PILE.diameter;
    expect(relClose(s.khh, 0.6 * d * ES * LAMBDA ** 0.35, 1e-12)).toBe(true);
    expect(relClose(s.kmm, 0.14 * d ** 3 * ES * LAMBDA ** 0.8, 1e-12)).toBe(true);
    expect(relClose(s.khm, 0.17 * d ** 2 * ES * LAMBDA ** 0.6, 1e-12)).toBe(true);
  });

  it("active length La = 2 d (Ep/Es)^(1/4) uniform, 2 d (Ep/Es)^(1/5) linear; La grows with the stiffness ratio", () => {
    expect(activeLength(0.5, 309.84, "uniform")).toBeCloseTo(2 * 0.5 * 309.84 ** 0.25, 12);
    expect(activeLength(0.5, 309.84, "linear")).toBeCloseTo(2 * 0.5 * 309.84 ** 0.2, 12);
    // hand: 309.84^0.25 = 4.1955 -> La = 4.20 m for the example pile
    expect(pileHeadStatic(PILE, SOIL).activeLength).toBeCloseTo(4.1955, 3);
    expect(activeLength(0.5, 3000, "uniform")).toBeGreaterThan(activeLength(0.5, 300, "uniform"));
  });
});

describe("Gazetas (1991) damping ratios of the pile head", () => {
  it("lateral: xi = 0.8 beta + 1.10 (f d / Vs) L^0.17, so the radiation dashpot c = K 1.10 d L^0.17 / (pi Vs) does not depend on f", () => {
    const s = pileHeadStatic(PILE, SOIL);
    const expected = (s.khh * 1.1 * PILE.diameter * LAMBDA ** 0.17) / (Math.PI * VS);
    for (const f of [2, 10, 40]) {
      const w = 2 * Math.PI * f;
      const z = pileHeadDynamic(PILE, SOIL, s, 0, w);
      expect(relClose(z.hh.c, expected, 1e-12)).toBe(true);
      // total imaginary part with the engine's K (1 + 2 i beta): 2 K (0.8 beta + xi_rad)
      const beta = 0.05;
      const zb = pileHeadDynamic(PILE, SOIL, s, beta, w);
      const xiRad = (1.1 * f * PILE.diameter * LAMBDA ** 0.17) / VS;
      expect(relClose(2 * beta * zb.hh.k + w * zb.hh.c, 2 * s.khh * (0.8 * beta + xiRad), 1e-12)).toBe(true);
      // rocking: 0.35 beta + 0.35 (f d / Vs) L^0.20
      const xiMm = (0.35 * f * PILE.diameter * LAMBDA ** 0.2) / VS;
      expect(relClose(2 * beta * zb.mm.k + w * zb.mm.c, 2 * s.kmm * (0.35 * beta + xiMm), 1e-12)).toBe(true);
    }
  });

  it("no material correction at w = 0 (the dashpot there is the radiation part only)", () => {
    const s = pileHeadStatic(PILE, SOIL);
    const z = pileHeadDynamic(PILE, SOIL, s, 0.05, 0);
    expect(z.hh.cMaterial).toBe(0);
    expect(z.hh.c).toBeGreaterThan(0);
  });
});

describe("vertical head stiffness: Randolph & Wroth (1978) and the rod", () => {
  const r0 = PILE.diameter / 2;

  it("the coded form equals the printed form (floating: xi = 1) and the rod's static limit (uniform soil)", () => {
    const byHand = rwByHand(SOIL.shearModulus, 1, 1, 0.3, PILE.youngsModulus, r0, PILE.length);
    expect(relClose(randolphWrothVertical(PILE, SOIL), byHand, 1e-12)).toBe(true);
    expect(relClose(verticalRodImpedance(PILE, SOIL, 0)[0], byHand, 1e-9)).toBe(true);
    // hand figure: 485 MN/m for the example pile
    expect(byHand / 1e6).toBeCloseTo(485.5, 0);
  });

  it("end-bearing on a rigid stratum: the printed form as xi -> 0 equals the rod fixed at the tip and exceeds the floating pile", () => {
    const eb = { ...PILE, tip: "end-bearing" as const };
    const limit = rwByHand(SOIL.shearModulus, 1, 1e-9, 0.3, PILE.youngsModulus, r0, PILE.length);
    expect(relClose(randolphWrothVertical(eb, SOIL), limit, 1e-6)).toBe(true);
    expect(relClose(verticalRodImpedance(eb, SOIL, 0)[0], limit, 1e-6)).toBe(true);
    expect(verticalRodImpedance(eb, SOIL, 0)[0]).toBeGreaterThan(verticalRodImpedance(PILE, SOIL, 0)[0]);
    expect(pileHeadStatic({ ...PILE, tip: "end-bearing", profile: "linear" }, SOIL).kv).toBeGreaterThan(pileHeadStatic({ ...PILE, profile: "linear" }, SOIL).kv);
  });

  it("rigid pile limit (Ep -> infinity): Boussinesq tip 4 G r0 / (1 - nu) plus the shaft 2 pi rho G_L L / zeta, both profiles", () => {
    for (const profile of ["uniform", "linear"] as const) {
      // the linear profile's rod is discretised: a finite Ep keeps the element stiffness resolvable (its flexibility is below 0.1 %)
      const rigid = { ...PILE, youngsModulus: profile === "uniform" ? 1e20 : 1e15, profile };
      const gL = profile === "uniform" ? SOIL.shearModulus : (SOIL.shearModulus * PILE.length) / PILE.diameter;
      const rho = profile === "uniform" ? 1 : 0.5;
      const zeta = Math.log((2.5 * rho * 0.7 * PILE.length) / r0);
      const expected = (4 * gL * r0) / 0.7 + (2 * Math.PI * rho * gL * PILE.length) / zeta;
      expect(relClose(verticalRodImpedance(rigid, SOIL, 0)[0], expected, profile === "uniform" ? 1e-6 : 2e-3)).toBe(true);
      expect(relClose(randolphWrothVertical(rigid, SOIL), expected, profile === "uniform" ? 1e-6 : 2e-3)).toBe(true);
    }
  });

  it("very long pile: the head stiffness tends to sqrt(EA k_s), the tip no longer counts", () => {
    const long = { ...PILE, length: 400 };
    const zeta = Math.log((2.5 * 0.7 * 400) / r0);
    const ks = (2 * Math.PI * SOIL.shearModulus) / zeta;
    const ea = PILE.youngsModulus * Math.PI * r0 * r0;
    expect(relClose(verticalRodImpedance(long, SOIL, 0)[0], Math.sqrt(ea * ks), 1e-6)).toBe(true);
  });

  it("linear profile, long compressible pile: the Airy-function solution 0.72901 EA kappa of EA u'' = a z u, kappa = (a / EA)^(1/3) (Abramowitz & Stegun 10.4: -Ai'(0)/Ai(0) = 0.258819/0.355028)", () => {
    for (const tip of ["floating", "end-bearing"] as const) {
      const long = { ...PILE, length: 30, tip, profile: "linear" as const };
      // R&W's zeta for the linear profile (rho = 1/2) at this length, as the springs use it
      const xi = tip === "floating" ? 1 : 0;
      const zeta = Math.log(((0.25 + xi * (2.5 * 0.5 * 0.7 - 0.25)) * 30) / r0);
      const a = (2 * Math.PI * SOIL.shearModulus) / (PILE.diameter * zeta);
      const ea = PILE.youngsModulus * Math.PI * r0 * r0;
      const kappa = (a / ea) ** (1 / 3);
      expect(kappa * 30).toBeGreaterThan(6); // long: the tip does not count
      expect(relClose(verticalRodImpedance(long, SOIL, 0)[0], ((0.258819403792807 / 0.355028053887817) * ea * kappa), 2e-4)).toBe(true);
    }
  });

  it("linear profile: far below a rod with the shaft's mean G (the soil near the head is softer), and end-bearing above floating", () => {
    const lin = { ...PILE, profile: "linear" as const };
    const zeta = Math.log((2.5 * 0.5 * 0.7 * PILE.length) / r0);
    const meanKs = (2 * Math.PI * 0.5 * ((SOIL.shearModulus * PILE.length) / PILE.diameter)) / zeta;
    const ea = PILE.youngsModulus * Math.PI * r0 * r0;
    expect(verticalRodImpedance(lin, SOIL, 0)[0]).toBeLessThan(0.7 * Math.sqrt(ea * meanKs));
    expect(verticalRodImpedance({ ...lin, tip: "end-bearing" }, SOIL, 0)[0]).toBeGreaterThan(verticalRodImpedance(lin, SOIL, 0)[0]);
  });

  it("close to Gazetas' (1991) floating-pile form K_V = 1.9 Es d (L/d)^(2/3) L^(-(L/d)/L) (recalled) for the example", () => {
    const ld = PILE.length / PILE.diameter;
    const gazetas = 1.9 * ES * PILE.diameter * ld ** (2 / 3) * LAMBDA ** (-ld / LAMBDA);
    // two independent published forms of the same quantity: within 10 % (they differ by 4 % here)
    expect(relClose(pileHeadStatic(PILE, SOIL).kv, gazetas, 0.1)).toBe(true);
  });

  it("dynamic: the shaft dashpot tends to pi d rho Vs L (Novak's high-frequency limit, recalled) for a floating pile with a small tip share", () => {
    const w = 2 * Math.PI * 30;
    const z = pileHeadDynamic(PILE, SOIL, pileHeadStatic(PILE, SOIL), 0, w);
    // the rod's dashpot is positive and of the order of the shaft's plane-strain limit
    const shaft = Math.PI * PILE.diameter * SOIL.density * VS * PILE.length;
    expect(z.v.c).toBeGreaterThan(0);
    expect(z.v.c).toBeLessThan(1.5 * shaft);
    expect(z.v.c).toBeGreaterThan(0.3 * shaft);
  });
});
