// Mass properties of the composite block and the machines (rigid-body mechanics: uniform boxes,
// parallel-axis theorem). Coordinates are relative to O.
import { boxCentre, boxInertiaPerMass, boxVolume, type Box } from "./geometry";
import { sub3, type Vec3 } from "./vec3";

/** A rigid part: mass at its cg with an axis-aligned principal inertia about that cg. */
export interface MassPart {
  mass: number;
  cg: Vec3;
  /** Diagonal of the inertia tensor about the part's own cg (kg m^2). */
  inertiaAtCg: Vec3;
}

/** A uniform box of mass m (negative for a void, which subtracts). */
export function boxPart(box: Box, mass: number): MassPart {
  const perMass = boxInertiaPerMass(box);
  return { mass, cg: boxCentre(box), inertiaAtCg: [perMass[0] * mass, perMass[1] * mass, perMass[2] * mass] };
}

/** Concrete solids of density rho; voids are boxes of negative mass. */
export function concreteParts(solids: (Box & { void: boolean })[], density: number): MassPart[] {
  return solids.map((s) => boxPart(s, (s.void ? -1 : 1) * density * boxVolume(s)));
}

/** A machine: a point mass at its cg, or a uniform box of its mass when a box is given. */
export function machinePart(mass: number, cg: Vec3, box: Box | undefined): MassPart {
  return box ? boxPart(box, mass) : { mass, cg, inertiaAtCg: [0, 0, 0] };
}

export interface CombinedMass {
  mass: number;
  cg: Vec3;
  /** Full 3 x 3 inertia tensor about the combined cg. */
  inertiaAtCg: number[][];
}

/** Combined mass, cg and inertia about the combined cg (parallel-axis theorem). */
export function combineParts(parts: MassPart[]): CombinedMass {
  const mass = parts.reduce((s, p) => s + p.mass, 0);
  const cg: Vec3 = [0, 0, 0];
  for (const p of parts) for (let i = 0; i < 3; i++) cg[i] = (cg[i] as number) + (p.mass * (p.cg[i] as number)) / mass;
  const inertia = [
    [0, 0, 0],
    [0, 0, 0],
    [0, 0, 0],
  ];
  for (const p of parts) {
    const d = sub3(p.cg, cg);
    const dd = d[0] * d[0] + d[1] * d[1] + d[2] * d[2];
    for (let i = 0; i < 3; i++) {
      const row = inertia[i] as number[];
      for (let j = 0; j < 3; j++) {
        const own = i === j ? (p.inertiaAtCg[i] as number) : 0;
        row[j] = (row[j] as number) + own + p.mass * ((i === j ? dd : 0) - (d[i] as number) * (d[j] as number));
      }
    }
  }
  return { mass, cg, inertiaAtCg: inertia };
}
