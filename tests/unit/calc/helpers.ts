// Builders shared by the calculation-core tests.
import fc from "fast-check";
import type { AnalysisInputDocument } from "@/modules/calc/schema";

export const G_SAND = 6.0e7;
export const NU = 1 / 3;
export const RHO_SOIL = 1900;
export const RHO_CONCRETE = 2400;

/** Relative closeness |a - b| <= tol * max(|a|, |b|, floor). */
export function relClose(a: number, b: number, tol: number, floor = 0): boolean {
  return Math.abs(a - b) <= tol * Math.max(Math.abs(a), Math.abs(b), floor);
}

export interface SymmetricBlockOptions {
  lx?: number;
  ly?: number;
  h?: number;
  machineMass?: number;
  machineHeight?: number;
  impedance?: AnalysisInputDocument["impedance"];
  materialDamping?: number;
  rotor?: Partial<NonNullable<AnalysisInputDocument["machines"][number]["rotors"]>[number]>;
}

/**
 * A single uniform box centred on O with one machine (point mass) on the vertical axis through O,
 * so the combined cg lies above O: vertical and torsional motion decouple from the rest.
 */
export function symmetricBlock(o: SymmetricBlockOptions = {}): AnalysisInputDocument {
  const lx = o.lx ?? 6;
  const ly = o.ly ?? 4;
  const h = o.h ?? 1.5;
  const zm = o.machineHeight ?? h + 0.7;
  return {
    schemaVersion: 1,
    block: { concreteDensity: RHO_CONCRETE, solids: [{ name: "block", x: [-lx / 2, lx / 2], y: [-ly / 2, ly / 2], z: [0, h] }] },
    soil: {
      shearModulus: G_SAND,
      poissonRatio: NU,
      density: RHO_SOIL,
      materialDamping: o.materialDamping ?? 0,
      allowableBearingPressure: 150000,
    },
    impedance: o.impedance ?? { method: "equivalent-radius" },
    machines: [
      {
        name: "M",
        mass: o.machineMass ?? 5000,
        cg: [0, 0, zm],
        rotors: [
          {
            name: "R",
            mass: 1000,
            speedRpm: 1500,
            balanceGrade: 6.3,
            axis: "x",
            bearings: [[0, 0, zm]],
            ...o.rotor,
          },
        ],
      },
    ],
    sweep: { fromHz: 1, toHz: 50, points: 50 },
  };
}

const coord = (lo: number, hi: number) => fc.double({ min: lo, max: hi, noNaN: true, noDefaultInfinity: true });

/** Arbitrary valid inputs: boxes, an optional pedestal and void, 1-3 machines, every impedance method. */
export function arbitraryInput(): fc.Arbitrary<AnalysisInputDocument> {
  const rotor = (cx: number, cy: number, cz: number, machineMass: number) =>
    fc
      .record({
        mass: fc.double({ min: 0.02, max: 0.3, noNaN: true }).map((f) => f * machineMass),
        speedRpm: fc.double({ min: 300, max: 6000, noNaN: true }),
        low: fc.double({ min: 0.6, max: 1, noNaN: true }),
        grade: fc.constantFrom(1, 2.5, 6.3, 16),
        vendor: fc.option(fc.double({ min: 50, max: 20000, noNaN: true }), { nil: undefined }),
        serviceFactor: fc.double({ min: 1, max: 2.5, noNaN: true }),
        axis: fc.constantFrom("x" as const, "y" as const),
        mode: fc.constantFrom("static" as const, "couple" as const, "both" as const),
        span: fc.double({ min: 0.3, max: 2, noNaN: true }),
        offset: fc.double({ min: -0.3, max: 0.3, noNaN: true }),
      })
      .map((r) => {
        const along = r.axis === "x" ? 0 : 1;
        const b1: [number, number, number] = [cx, cy, cz];
        const b2: [number, number, number] = [cx, cy, cz];
        b1[along] -= r.span / 2;
        b2[along] += r.span / 2;
        b1[2] += r.offset;
        return {
          name: "",
          mass: r.mass,
          speedRpm: r.speedRpm,
          speedRangeRpm: [r.speedRpm * r.low, r.speedRpm] as [number, number],
          ...(r.vendor === undefined ? { balanceGrade: r.grade } : { unbalanceForce: r.vendor }),
          serviceFactor: r.serviceFactor,
          axis: r.axis,
          unbalanceMode: r.mode,
          bearings: [b1, b2],
        };
      });
  const block = fc.record({
    lx: coord(1.5, 10),
    ly: coord(1.5, 8),
    h: coord(0.4, 2.5),
    cx: coord(-5, 5),
    cy: coord(-5, 5),
    pedestal: fc.boolean(),
    hole: fc.boolean(),
  });
  return block.chain((b) => {
    const machine = fc
      .record({
        mass: fc.double({ min: 300, max: 40000, noNaN: true }),
        fx: coord(-0.45, 0.45),
        fy: coord(-0.45, 0.45),
        dz: coord(0.2, 1.5),
        withBox: fc.boolean(),
      })
      .chain((m) => {
        const cx = b.cx + m.fx * b.lx;
        const cy = b.cy + m.fy * b.ly;
        const cz = b.h + m.dz;
        return fc.array(rotor(cx, cy, cz, m.mass), { minLength: 0, maxLength: 2 }).map((rotors) => ({
          name: "",
          mass: m.mass,
          cg: [cx, cy, cz] as [number, number, number],
          ...(m.withBox
            ? { box: { x: [cx - 0.4, cx + 0.4] as [number, number], y: [cy - 0.3, cy + 0.3] as [number, number], z: [cz - 0.3, cz + 0.3] as [number, number] } }
            : {}),
          rotors: rotors.map((r, i) => ({ ...r, name: `rotor ${i + 1}` })),
        }));
      });
    const soil = fc.record({
      useVs: fc.boolean(),
      G: fc.double({ min: 1e7, max: 5e8, noNaN: true }),
      nu: fc.double({ min: 0.05, max: 0.49, noNaN: true }),
      rho: fc.double({ min: 1500, max: 2300, noNaN: true }),
      beta: fc.double({ min: 0, max: 0.1, noNaN: true }),
      embed: fc.double({ min: 0, max: 2, noNaN: true }),
      wall: fc.double({ min: 0, max: 1, noNaN: true }),
    });
    const impedance = fc.oneof(
      fc.constant({ method: "equivalent-radius" as const }),
      fc.constant({ method: "gazetas" as const }),
      fc.constant({ method: "gazetas" as const, gazetasDynamic: "pais-kausel" as const }),
      fc
        .record({ k: fc.array(fc.double({ min: 1e8, max: 1e10, noNaN: true }), { minLength: 6, maxLength: 6 }), d: fc.array(fc.double({ min: 0.005, max: 0.5, noNaN: true }), { minLength: 6, maxLength: 6 }) })
        .map(({ k, d }) => ({
          method: "user" as const,
          stiffness: { x: k[0]!, y: k[1]!, z: k[2]!, rx: k[3]!, ry: k[4]!, rz: k[5]! },
          dampingRatio: { x: d[0]!, y: d[1]!, z: d[2]!, rx: d[3]!, ry: d[4]!, rz: d[5]! },
        })),
    );
    return fc.record({ machines: fc.array(machine, { minLength: 1, maxLength: 3 }), soil, impedance }).map(({ machines, soil: s, impedance: imp }) => {
      const solids: NonNullable<AnalysisInputDocument["block"]["solids"]> = [
        { name: "mat", x: [b.cx - b.lx / 2, b.cx + b.lx / 2], y: [b.cy - b.ly / 2, b.cy + b.ly / 2], z: [0, b.h] },
      ];
      if (b.pedestal) solids.push({ name: "pedestal", x: [b.cx - b.lx / 4, b.cx + b.lx / 4], y: [b.cy - b.ly / 4, b.cy], z: [b.h, b.h + 0.5] });
      if (b.hole) solids.push({ name: "pit", x: [b.cx + b.lx / 8, b.cx + b.lx / 3], y: [b.cy - b.ly / 3, b.cy - b.ly / 8], z: [b.h / 2, b.h], void: true });
      return {
        schemaVersion: 1 as const,
        block: { concreteDensity: RHO_CONCRETE, solids },
        soil: {
          ...(s.useVs ? { shearWaveVelocity: Math.sqrt(s.G / s.rho) } : { shearModulus: s.G }),
          poissonRatio: s.nu,
          density: s.rho,
          materialDamping: s.beta,
          allowableBearingPressure: 200000,
          embedmentDepth: s.embed,
          sidewallContactHeight: s.wall * s.embed,
        },
        impedance: imp,
        machines: machines.map((m, i) => ({ ...m, name: `machine ${i + 1}` })),
        checkPoints: [{ name: "corner", position: [b.cx + b.lx / 2, b.cy + b.ly / 2, b.h] as [number, number, number] }],
        sweep: { fromHz: 0.5, toHz: 80, points: 40 },
      };
    });
  });
}
