// A sampled curve's maximum, refined: the vertex of the parabola through the sample and its two
// neighbours (three-point quadratic interpolation; unequal spacing allowed).

export function refinePeak(x: number[], y: number[], k: number): number {
  const x0 = x[k - 1] as number, x1 = x[k] as number, x2 = x[k + 1] as number;
  const y0 = y[k - 1] as number, y1 = y[k] as number, y2 = y[k + 1] as number;
  const denom = (x0 - x1) * (x0 - x2) * (x1 - x2);
  if (denom === 0) return x1;
  const a = (x2 * (y1 - y0) + x1 * (y0 - y2) + x0 * (y2 - y1)) / denom;
  const b = (x2 * x2 * (y0 - y1) + x1 * x1 * (y2 - y0) + x0 * x0 * (y1 - y2)) / denom;
  if (a >= 0) return x1;
  const v = -b / (2 * a);
  return v >= x0 && v <= x2 ? v : x1;
}
