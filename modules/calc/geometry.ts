// Box geometry of the block: volumes, overlaps and the base contact area.
import type { Vec3 } from "./vec3";

export type Interval = readonly [number, number];
export interface Box {
  x: Interval;
  y: Interval;
  z: Interval;
}

/** Length tolerance used to decide that two faces lie at the same level (m). */
export const LEVEL_TOLERANCE_M = 1e-6;

export function boxVolume(b: Box): number {
  return (b.x[1] - b.x[0]) * (b.y[1] - b.y[0]) * (b.z[1] - b.z[0]);
}

export function boxCentre(b: Box): Vec3 {
  return [(b.x[0] + b.x[1]) / 2, (b.y[0] + b.y[1]) / 2, (b.z[0] + b.z[1]) / 2];
}

function overlap(a: Interval, b: Interval): number {
  return Math.max(0, Math.min(a[1], b[1]) - Math.max(a[0], b[0]));
}

/** Volume shared by two boxes (m^3). */
export function intersectionVolume(a: Box, b: Box): number {
  return overlap(a.x, b.x) * overlap(a.y, b.y) * overlap(a.z, b.z);
}

/**
 * Uniform box inertia about its own centre of gravity, per unit mass
 * (standard rigid-body result: I_xx = m (b^2 + c^2) / 12 ...).
 */
export function boxInertiaPerMass(b: Box): Vec3 {
  const a = b.x[1] - b.x[0];
  const w = b.y[1] - b.y[0];
  const h = b.z[1] - b.z[0];
  return [(w * w + h * h) / 12, (a * a + h * h) / 12, (a * a + w * w) / 12];
}

export interface ContactArea {
  /** Contact area A (m^2). */
  area: number;
  /** Centroid of the contact area. */
  centroid: [number, number];
  /** Second moment about the centroidal axis parallel to x: integral of (y - cy)^2 dA (m^4). */
  momentAboutX: number;
  /** Second moment about the centroidal axis parallel to y: integral of (x - cx)^2 dA (m^4). */
  momentAboutY: number;
  /** Bounding rectangle of the contact area. */
  bounds: { x: [number, number]; y: [number, number] };
  /** Level of the underside (m). */
  level: number;
}

interface Rect {
  x: Interval;
  y: Interval;
}

function covers(rects: Rect[], x: number, y: number): boolean {
  return rects.some((r) => x > r.x[0] && x < r.x[1] && y > r.y[0] && y < r.y[1]);
}

/**
 * The base contact area: footprint at the lowest underside level of the non-void solids whose
 * underside is at that level, minus the voids whose underside is at that level. Computed
 * exactly on the grid of all rectangle edges (coordinate compression), so overlapping or
 * touching rectangles are handled. Returns null when nothing touches the soil.
 */
export function contactArea(solids: Box[], voids: Box[]): ContactArea | null {
  if (solids.length === 0) return null;
  const level = Math.min(...solids.map((s) => s.z[0]));
  const atLevel = (b: Box) => Math.abs(b.z[0] - level) <= LEVEL_TOLERANCE_M;
  const base: Rect[] = solids.filter(atLevel);
  const holes: Rect[] = voids.filter(atLevel);
  const xs = [...new Set([...base, ...holes].flatMap((r) => [r.x[0], r.x[1]]))].sort((a, b) => a - b);
  const ys = [...new Set([...base, ...holes].flatMap((r) => [r.y[0], r.y[1]]))].sort((a, b) => a - b);
  let area = 0;
  let sx = 0;
  let sy = 0;
  let sxx = 0;
  let syy = 0;
  let xmin = Infinity;
  let xmax = -Infinity;
  let ymin = Infinity;
  let ymax = -Infinity;
  for (let i = 0; i + 1 < xs.length; i++) {
    const x0 = xs[i] as number;
    const x1 = xs[i + 1] as number;
    for (let j = 0; j + 1 < ys.length; j++) {
      const y0 = ys[j] as number;
      const y1 = ys[j + 1] as number;
      const mx = (x0 + x1) / 2;
      const my = (y0 + y1) / 2;
      if (!covers(base, mx, my) || covers(holes, mx, my)) continue;
      const a = (x1 - x0) * (y1 - y0);
      area += a;
      sx += a * mx;
      sy += a * my;
      sxx += ((x1 ** 3 - x0 ** 3) / 3) * (y1 - y0);
      syy += ((y1 ** 3 - y0 ** 3) / 3) * (x1 - x0);
      xmin = Math.min(xmin, x0);
      xmax = Math.max(xmax, x1);
      ymin = Math.min(ymin, y0);
      ymax = Math.max(ymax, y1);
    }
  }
  if (!(area > 1e-9)) return null;
  const cx = sx / area;
  const cy = sy / area;
  return {
    area,
    centroid: [cx, cy],
    momentAboutX: Math.max(syy - area * cy * cy, 0),
    momentAboutY: Math.max(sxx - area * cx * cx, 0),
    bounds: { x: [xmin, xmax], y: [ymin, ymax] },
    level,
  };
}
