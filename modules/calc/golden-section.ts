// Golden-section search for the maximum of a unimodal function on [a, b] (Kiefer 1953; as in
// Press et al., Numerical Recipes, section 10.2). One helper for the engine's refinement of a
// speed-ramp maximum (transient.ts) and the soil calibration's least-squares minimum
// (modules/commissioning/calibrate.ts, which maximises the negated misfit).

/** 1 / phi, the golden-section ratio. */
export const GOLDEN_RATIO_INVERSE = (Math.sqrt(5) - 1) / 2;

export interface GoldenSectionBracket {
  /** The final bracket. */
  a: number;
  b: number;
  /** Its two interior points and their values (x1 < x2). */
  x1: number;
  f1: number;
  x2: number;
  f2: number;
}

/**
 * Narrows [a, b] around the maximum of f: either a fixed number of steps (`iterations`) or until
 * b - a is at most `tolerance`. Each step costs one evaluation of f. Ties keep the right part.
 */
export function goldenSectionMaximum(f: (x: number) => number, a: number, b: number, stop: { iterations: number } | { tolerance: number }): GoldenSectionBracket {
  const g = GOLDEN_RATIO_INVERSE;
  let x1 = b - g * (b - a);
  let x2 = a + g * (b - a);
  let f1 = f(x1);
  let f2 = f(x2);
  const more = "iterations" in stop ? (() => { let left = stop.iterations; return () => left-- > 0; })() : () => b - a > stop.tolerance;
  while (more()) {
    if (f1 > f2) {
      b = x2;
      x2 = x1;
      f2 = f1;
      x1 = b - g * (b - a);
      f1 = f(x1);
    } else {
      a = x1;
      x1 = x2;
      f1 = f2;
      x2 = a + g * (b - a);
      f2 = f(x2);
    }
  }
  return { a, b, x1, f1, x2, f2 };
}
