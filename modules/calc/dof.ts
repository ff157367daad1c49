// Degrees of freedom of the rigid block at O, in the order of the contract:
// translations x, y, z, then rotations rx, ry, rz about axes through O.
export const DOF_KEYS = ["x", "y", "z", "rx", "ry", "rz"] as const;
export type DofKey = (typeof DOF_KEYS)[number];
export type Dof6 = Record<DofKey, number>;

export function dofFromArray(values: ArrayLike<number>): Dof6 {
  return {
    x: values[0] ?? 0,
    y: values[1] ?? 0,
    z: values[2] ?? 0,
    rx: values[3] ?? 0,
    ry: values[4] ?? 0,
    rz: values[5] ?? 0,
  };
}
