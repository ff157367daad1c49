// Writes new mat dimensions into an analysis input document. Everything the mat carries keeps
// its height above the mat top and its plan position relative to the other carried items; the
// whole layout is then moved so that the mat (the base contact area) is centred on x = y = 0
// with its underside at z = 0, i.e. O stays at the origin.
import { LENGTH_TOLERANCE_M, type BaseMat, type MatDimensions } from "./base-mat";
import type { CentreMode } from "./options";

type Pair = [number, number];
type Triple = [number, number, number];

/** The parts of an analysis input document (as written or parsed) that carry coordinates. */
export interface ResizableDocument {
  block: { solids: { x: Pair; y: Pair; z: Pair }[] };
  machines: { cg: Triple; box?: { x: Pair; y: Pair; z: Pair } | undefined; rotors?: { bearings: Triple[] }[] | undefined }[];
  checkPoints?: { position: Triple }[] | undefined;
}

/**
 * Drawings dimension the mat's set-out to the millimetre; a load-centred mat is placed to the
 * nearest millimetre so the coordinates stay readable (the eccentricity this leaves is under
 * 1 mm over the base length).
 */
const PLACEMENT_ROUNDING_M = 1e-3;

/** Plan centre of the resized mat, in the input's coordinates. */
export function matCentre(mat: BaseMat, mode: CentreMode): [number, number] {
  if (mode === "current") return [(mat.x[0] + mat.x[1]) / 2, (mat.y[0] + mat.y[1]) / 2];
  const r = (v: number) => Math.round(Math.round(v / PLACEMENT_ROUNDING_M) * PLACEMENT_ROUNDING_M * 1e9) / 1e9;
  return [r(mat.loadCentre[0]), r(mat.loadCentre[1])];
}

/** Adds a shift, removing floating-point noise only when something was added. */
function shifted(value: number, by: number): number {
  return by === 0 ? value : Math.round((value + by) * 1e9) / 1e9;
}

export interface Placement {
  /** Plan centre of the mat in the original document's coordinates. */
  matCentre: [number, number];
  /** Translation applied to everything the mat carries: [dx, dy, dz] (dz includes the change of thickness). */
  shift: Triple;
}

export function placementFor(mat: BaseMat, mode: CentreMode, d: MatDimensions): Placement {
  const centre = matCentre(mat, mode);
  const dz = -mat.z[0] + (d.thickness - mat.dimensions.thickness);
  return { matCentre: centre, shift: [shifted(0, -centre[0]), shifted(0, -centre[1]), shifted(0, dz)] };
}

/** A copy of the document with the mat at the given dimensions; the input is not changed. */
export function resizeDocument<T extends ResizableDocument>(doc: T, mat: BaseMat, mode: CentreMode, d: MatDimensions): T {
  const out = structuredClone(doc);
  const { shift } = placementFor(mat, mode, d);
  const [dx, dy, dzTop] = shift;
  const dzBase = shifted(0, -mat.z[0]);
  const box = (b: { x: Pair; y: Pair; z: Pair }) => {
    b.x = [shifted(b.x[0], dx), shifted(b.x[1], dx)];
    b.y = [shifted(b.y[0], dy), shifted(b.y[1], dy)];
    b.z = [shifted(b.z[0], dzTop), shifted(b.z[1], dzTop)];
  };
  const point = (p: Triple): Triple => [shifted(p[0], dx), shifted(p[1], dy), shifted(p[2], dzTop)];

  out.block.solids.forEach((s, i) => {
    if (i === mat.index) {
      s.x = [-d.length / 2, d.length / 2];
      s.y = [-d.width / 2, d.width / 2];
      s.z = [0, d.thickness];
    } else {
      box(s);
    }
  });
  for (const machine of out.machines) {
    machine.cg = point(machine.cg);
    if (machine.box) box(machine.box);
    for (const rotor of machine.rotors ?? []) rotor.bearings = rotor.bearings.map(point);
  }
  // A check point on an edge or at the top of the mat follows that edge or the top (a "mat
  // corner" stays at the corner); others move with the machines, except points inside or
  // under the mat, which keep their height above the underside.
  const edge = (v: number, lo: number, hi: number, half: number, by: number) =>
    Math.abs(v - lo) <= LENGTH_TOLERANCE_M ? -half : Math.abs(v - hi) <= LENGTH_TOLERANCE_M ? half : shifted(v, by);
  for (const cp of out.checkPoints ?? []) {
    const [x, y, z] = cp.position;
    cp.position = [
      edge(x, mat.x[0], mat.x[1], d.length / 2, dx),
      edge(y, mat.y[0], mat.y[1], d.width / 2, dy),
      shifted(z, z >= mat.z[1] - LENGTH_TOLERANCE_M ? dzTop : dzBase),
    ];
  }
  return out;
}
