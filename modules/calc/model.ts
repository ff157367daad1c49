// The internal model: every coordinate shifted so that O, the centroid of the base contact area
// at the underside, is the origin; mass properties and the 6 x 6 mass matrix about O; rotors
// with their unit load vectors and response points.
import { BLOCK_RULES, ORIGIN_TOLERANCE_M, STANDARD_GRAVITY } from "./criteria-defaults";
import { boxCentre, contactArea, type Box, type ContactArea } from "./geometry";
import { combineParts, concreteParts, machinePart, type MassPart } from "./mass-properties";
import { massMatrixAboutO } from "./mass-matrix";
import type { AnalysisInput, RotorInput } from "./schema";
import type { MassPropertiesResult } from "./result-types";
import { speedRangeRpm } from "./sweep-grid";
import { forceAtRatedSpeed, rpmToRadPerSec, unitLoads, type UnitLoad } from "./unbalance";
import { add3, sub3, type Vec3 } from "./vec3";
import { baseBlockModel, type BaseBlockModel } from "./two-stage";

export interface ResponsePoint {
  name: string;
  /** Position in the input's coordinates. */
  position: Vec3;
  /** Position relative to O. */
  local: Vec3;
}

export interface RotorModel {
  machine: string;
  rotor: string;
  input: RotorInput;
  speedRpm: number;
  omegaRated: number;
  rangeRpm: [number, number];
  /** Total force amplitude at rated speed, service factor included (N). */
  forceAtRated: number;
  loads: UnitLoad[];
  /** The rotor's bearings, then every check point. */
  points: ResponsePoint[];
  /** Flat [x0, y0, z0, x1, ...] of the points relative to O, for the hot loop. */
  pointCoords: Float64Array;
}

export interface Model {
  input: AnalysisInput;
  /** O in the input's coordinates (input = local + origin). */
  origin: Vec3;
  base: ContactArea;
  massMatrix: Float64Array;
  massDiagonal: number[];
  massProperties: MassPropertiesResult;
  rotors: RotorModel[];
  warnings: string[];
  /** Springs on a base block only (two-stage.ts). */
  baseBlock?: BaseBlockModel;
}

function shiftBox(b: Box, o: Vec3): Box {
  return {
    x: [b.x[0] - o[0], b.x[1] - o[0]],
    y: [b.y[0] - o[1], b.y[1] - o[1]],
    z: [b.z[0] - o[2], b.z[1] - o[2]],
  };
}

function findOrigin(input: AnalysisInput): { origin: Vec3; area: ContactArea } {
  const solids = input.block.solids;
  const area = contactArea(
    solids.filter((s) => !s.void),
    solids.filter((s) => s.void),
  );
  // The schema refuses a base without contact area.
  if (!area) throw new Error("the base has no contact area");
  return { origin: [area.centroid[0], area.centroid[1], area.level], area };
}

function blockWarnings(input: AnalysisInput, base: ContactArea, warnings: string[]): number {
  const baseSolids = input.block.solids.filter((s) => !s.void && Math.abs(s.z[0] - base.level) < 1e-6);
  const thickness = Math.min(...baseSolids.map((s) => s.z[1] - s.z[0]));
  const top = Math.max(...input.block.solids.filter((s) => !s.void).map((s) => s.z[1]));
  const height = top - base.level;
  const lx = base.bounds.x[1] - base.bounds.x[0];
  const ly = base.bounds.y[1] - base.bounds.y[0];
  if (thickness < BLOCK_RULES.minThicknessM) {
    warnings.push(
      `The base solids are ${thickness.toFixed(2)} m thick, thinner than ${BLOCK_RULES.minThicknessM} m (${BLOCK_RULES.minThicknessSource}).`,
    );
  }
  if (height < BLOCK_RULES.minThicknessToLeastPlan * Math.min(lx, ly) || height < BLOCK_RULES.minThicknessToLargestPlan * Math.max(lx, ly)) {
    warnings.push(
      `The block is slender (height ${height.toFixed(2)} m for a ${lx.toFixed(2)} m x ${ly.toFixed(2)} m base); the rigid-block idealisation may not hold (${BLOCK_RULES.slendernessSource}).`,
    );
  }
  return thickness;
}

export function buildModel(input: AnalysisInput): Model {
  const warnings: string[] = [];
  const { origin, area } = findOrigin(input);
  const shifted = Math.abs(origin[0]) > ORIGIN_TOLERANCE_M || Math.abs(origin[1]) > ORIGIN_TOLERANCE_M || Math.abs(origin[2]) > ORIGIN_TOLERANCE_M;
  if (shifted) {
    warnings.push(
      `The centroid of the base contact area is at [${origin.map((v) => v.toFixed(3)).join(", ")}] in the input's coordinates, not at [0, 0, 0]: O is taken there and positions are reported in the input's coordinates.`,
    );
  }
  const local = (p: Vec3): Vec3 => sub3(p, origin);
  const base: ContactArea = {
    ...area,
    centroid: [0, 0],
    bounds: {
      x: [area.bounds.x[0] - origin[0], area.bounds.x[1] - origin[0]],
      y: [area.bounds.y[0] - origin[1], area.bounds.y[1] - origin[1]],
    },
    level: 0,
  };
  const thickness = blockWarnings(input, area, warnings);

  const concrete = concreteParts(
    input.block.solids.map((s) => ({ ...shiftBox(s, origin), void: s.void })),
    input.block.concreteDensity,
  );
  const machines: MassPart[] = input.machines.map((m) => {
    if (m.box) {
      if (Math.hypot(...sub3(boxCentre(m.box), m.cg)) > ORIGIN_TOLERANCE_M) {
        warnings.push(`Machine "${m.name}": its box is taken as a uniform box of the machine's mass, so its centre (not cg) is the machine's centre of gravity.`);
      }
    }
    return machinePart(m.mass, local(m.cg), m.box ? shiftBox(m.box, origin) : undefined);
  });
  const parts = [...concrete, ...machines];
  const massMatrix = massMatrixAboutO(parts);
  const combined = combineParts(parts);
  const blockMass = concrete.reduce((s, p) => s + p.mass, 0);
  const machineMass = machines.reduce((s, p) => s + p.mass, 0);
  const lx = base.bounds.x[1] - base.bounds.x[0];
  const ly = base.bounds.y[1] - base.bounds.y[0];
  const massProperties: MassPropertiesResult = {
    blockMass,
    machineMass,
    totalMass: combined.mass,
    cg: add3(combined.cg, origin),
    inertiaAtCg: combined.inertiaAtCg,
    baseArea: base.area,
    eccentricity: [combined.cg[0] / lx, combined.cg[1] / ly],
    massRatio: blockMass / machineMass,
    staticBearingPressure: (combined.mass * STANDARD_GRAVITY) / base.area,
    origin,
    baseDimensions: [lx, ly],
    baseMomentOfArea: { aboutX: base.momentAboutX, aboutY: base.momentAboutY },
    massMatrix: [0, 1, 2, 3, 4, 5].map((i) => Array.from(massMatrix.subarray(i * 6, i * 6 + 6))),
    baseThickness: thickness,
  };

  const checkPoints: ResponsePoint[] = (input.checkPoints ?? []).map((c) => ({
    name: c.name,
    position: c.position,
    local: local(c.position),
  }));
  const rotors: RotorModel[] = input.machines.flatMap((m) =>
    m.rotors.map((r) => {
      const bearings = r.bearings.map(local);
      const points: ResponsePoint[] = [
        ...r.bearings.map((b, i) => ({ name: `${m.name} ${r.name} bearing ${i + 1}`, position: b, local: local(b) })),
        ...checkPoints,
      ];
      return {
        machine: m.name,
        rotor: r.name,
        input: r,
        speedRpm: r.speedRpm,
        omegaRated: rpmToRadPerSec(r.speedRpm),
        rangeRpm: speedRangeRpm(r),
        forceAtRated: forceAtRatedSpeed(r),
        loads: unitLoads(r, bearings),
        points,
        pointCoords: Float64Array.from(points.flatMap((p) => p.local)),
      };
    }),
  );
  const imp = input.impedance;
  const baseBlock = imp.method === "springs" && imp.base ? baseBlockModel(imp.base, input.block.concreteDensity, origin) : undefined;
  return {
    ...(baseBlock ? { baseBlock } : {}),
    input,
    origin,
    base,
    massMatrix,
    massDiagonal: [0, 1, 2, 3, 4, 5].map((i) => massMatrix[i * 7] as number),
    massProperties,
    rotors,
    warnings,
  };
}
