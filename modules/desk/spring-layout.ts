// The springs of method "springs" as the workspace drawing shows them (issue 16): the rows of
// the spring table whose plan position is complete, with their row number and whether they have
// a damper.
import type { DraftForm } from "./draft-form";

const ok = (n: unknown): n is number => typeof n === "number" && Number.isFinite(n);

export interface DrawnSpring {
  /** 1-based row of the spring table. */
  n: number;
  x: number;
  y: number;
  kz: number | null;
  kh: number | null;
  damper: boolean;
}

/** The springs of method "springs" whose plan position is complete (rows with a blank x or y are left out). */
export function springsOf(form: DraftForm): DrawnSpring[] | null {
  const rows = form.impedance.method === "springs" ? (form.impedance.springs ?? []) : [];
  const drawn = rows.flatMap((sp, i) =>
    ok(sp.x) && ok(sp.y) ? [{ n: i + 1, x: sp.x, y: sp.y, kz: ok(sp.kz) ? sp.kz : null, kh: ok(sp.kh) ? sp.kh : null, damper: ok(sp.cz) || ok(sp.ch) }] : [],
  );
  return drawn.length ? drawn : null;
}


/** The base block under the springs (two-stage isolation) when the springs rest on it and its six coordinates are complete. */
export function springsBaseOf(form: DraftForm): { x: [number, number]; y: [number, number]; z: [number, number] } | null {
  const b = form.impedance.method === "springs" ? form.impedance.springsBase : undefined;
  if (!b || b.restsOn !== "base") return null;
  const [x0, x1] = b.x;
  const [y0, y1] = b.y;
  const [z0, z1] = b.z;
  if (!(ok(x0) && ok(x1) && ok(y0) && ok(y1) && ok(z0) && ok(z1))) return null;
  return { x: [Math.min(x0, x1), Math.max(x0, x1)], y: [Math.min(y0, y1), Math.max(y0, y1)], z: [Math.min(z0, z1), Math.max(z0, z1)] };
}
