// Shared shapes of the vendor data readers: where a value came from and what was wrong.
import type { MachineFieldKey, PositionFrame, RampFieldKey, RotorFieldKey } from "./layout";

/** A cell of a sheet (A1 notation); `cell` null means the sheet (or file) as a whole. */
export interface CellRef {
  sheet: string;
  cell: string | null;
}

/** One problem of an upload, named by sheet and cell so the vendor can find it. */
export interface Problem {
  sheet: string | null;
  cell: string | null;
  message: string;
}

export type CellValue =
  | { kind: "empty" }
  | { kind: "number"; value: number }
  | { kind: "text"; value: string }
  | { kind: "bad"; message: string };

export interface RawCell {
  ref: CellRef;
  value: CellValue;
}

export interface RawRotor {
  /** Column header or CSV line, for messages about the rotor as a whole. */
  anchor: CellRef;
  fields: Partial<Record<RotorFieldKey, RawCell>>;
  /** bearings[b][axis], axis 0 x, 1 y, 2 z. */
  bearings: RawCell[][];
  /** Start-up and coast-down times (format version 2; absent in version 1). */
  ramp?: Partial<Record<RampFieldKey, RawCell>>;
}

export interface RawMachine {
  anchor: CellRef;
  fields: Partial<Record<MachineFieldKey, RawCell>>;
  rotors: RawRotor[];
}

/** How an upload states its positions, and the note the designer sees about it. */
export interface UploadTerms {
  formatVersion: number;
  frame: PositionFrame;
}

export function problemAt(ref: CellRef | null, message: string): Problem {
  return { sheet: ref?.sheet ?? null, cell: ref?.cell ?? null, message };
}

/** `'Machine 1'!C7`, `CSV!D3`, or the sheet alone. */
export function formatRef(p: { sheet: string | null; cell: string | null }): string {
  if (!p.sheet) return "(file)";
  const sheet = /^[A-Za-z0-9_]+$/.test(p.sheet) ? p.sheet : `'${p.sheet}'`;
  return p.cell ? `${sheet}!${p.cell}` : sheet;
}
