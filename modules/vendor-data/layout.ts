// The machine data workbook and CSV of Plinthwise, format version 1: one definition of
// every field (label, unit, kind, where it sits) that the workbook builder, the workbook
// and CSV readers, the web form and the error messages all read. Values are the
// contract's (calc-contract.md): SI units, coordinates in the foundation frame.
import { balanceGradeSeries } from "@/modules/desk/balance-grades";

export const FORMAT_ID = "plinthwise-machine-data";
export const FORMAT_VERSION = 1;

export const INSTRUCTIONS_SHEET = "Read me";
/** Hidden (veryHidden) sheet holding the format id, its version and the request id. */
export const MARKER_SHEET = "format";
export const CSV_SHEET = "CSV";

export const MAX_ROTORS = 4;
export const MAX_BEARINGS = 4;

/** Limits of an upload (the 5 MB for data and 25 MB for a drawing). */
export const MAX_DATA_BYTES = 5 * 1024 * 1024;
export const MAX_DRAWING_BYTES = 25 * 1024 * 1024;

export function machineSheetName(index: number): string {
  return `Machine ${index + 1}`;
}

export type FieldKind = "text" | "number" | "positive" | "grade" | "axis" | "mode";

export interface FieldSpec {
  key: string;
  label: string;
  unit: string;
  kind: FieldKind;
  required: boolean;
  /** Column name in the CSV layout. */
  csv: string;
  hint?: string;
}

export const machineFields = [
  { key: "name", label: "Machine name or tag", unit: "", kind: "text", required: true, csv: "machine" },
  { key: "mass", label: "Machine mass, rotors included", unit: "kg", kind: "positive", required: true, csv: "machine_mass_kg" },
  { key: "cgX", label: "Centre of gravity x", unit: "m", kind: "number", required: true, csv: "cg_x_m" },
  { key: "cgY", label: "Centre of gravity y", unit: "m", kind: "number", required: true, csv: "cg_y_m" },
  { key: "cgZ", label: "Centre of gravity z (up from the underside of the block)", unit: "m", kind: "number", required: true, csv: "cg_z_m" },
  { key: "boxXFrom", label: "Outline box x from (optional)", unit: "m", kind: "number", required: false, csv: "box_x_from_m", hint: "Fill all six outline cells or none" },
  { key: "boxXTo", label: "Outline box x to", unit: "m", kind: "number", required: false, csv: "box_x_to_m" },
  { key: "boxYFrom", label: "Outline box y from", unit: "m", kind: "number", required: false, csv: "box_y_from_m" },
  { key: "boxYTo", label: "Outline box y to", unit: "m", kind: "number", required: false, csv: "box_y_to_m" },
  { key: "boxZFrom", label: "Outline box z from", unit: "m", kind: "number", required: false, csv: "box_z_from_m" },
  { key: "boxZTo", label: "Outline box z to", unit: "m", kind: "number", required: false, csv: "box_z_to_m" },
] as const satisfies readonly FieldSpec[];

export const rotorFields = [
  { key: "name", label: "Rotor name", unit: "", kind: "text", required: true, csv: "rotor" },
  { key: "mass", label: "Rotor mass (rotating part)", unit: "kg", kind: "positive", required: true, csv: "rotor_mass_kg" },
  { key: "speedRpm", label: "Rated speed", unit: "rpm", kind: "positive", required: true, csv: "speed_rpm" },
  { key: "speedMinRpm", label: "Lowest operating speed (variable speed only)", unit: "rpm", kind: "positive", required: false, csv: "speed_min_rpm" },
  { key: "speedMaxRpm", label: "Highest operating speed (variable speed only)", unit: "rpm", kind: "positive", required: false, csv: "speed_max_rpm" },
  { key: "balanceGrade", label: "Balance grade G (ISO 1940-1)", unit: "mm/s", kind: "grade", required: false, csv: "balance_grade_mm_s", hint: "Give the grade or the unbalance force, not both" },
  { key: "unbalanceForce", label: "Unbalance force at rated speed", unit: "N", kind: "positive", required: false, csv: "unbalance_force_n" },
  { key: "serviceFactor", label: "Service factor on the unbalance force", unit: "", kind: "positive", required: false, csv: "service_factor", hint: "Blank means 1" },
  { key: "axis", label: "Shaft axis", unit: "", kind: "axis", required: true, csv: "shaft_axis" },
  { key: "unbalanceMode", label: "Unbalance: static, couple or both", unit: "", kind: "mode", required: false, csv: "unbalance_mode", hint: "Blank means static" },
] as const satisfies readonly FieldSpec[];

export type MachineFieldKey = (typeof machineFields)[number]["key"];
export type RotorFieldKey = (typeof rotorFields)[number]["key"];

export const axisChoices = ["x", "y", "z"] as const;
export const modeChoices = ["static", "couple", "both"] as const;
export const gradeChoices: readonly number[] = balanceGradeSeries;

// ---- where things sit on a machine sheet -------------------------------------------------

export const LABEL_COLUMN = "A";
export const UNIT_COLUMN = "B";
export const MACHINE_VALUE_COLUMN = "C";
/** Rotor k (0-based) is filled in column C, D, E or F. */
export const ROTOR_COLUMNS = ["C", "D", "E", "F"] as const;

export const MACHINE_HEADER_ROW = 4;
export const MACHINE_FIRST_ROW = 5;
export const ROTOR_HEADER_ROW = MACHINE_FIRST_ROW + machineFields.length + 1;
export const ROTOR_FIRST_ROW = ROTOR_HEADER_ROW + 1;
export const BEARING_FIRST_ROW = ROTOR_FIRST_ROW + rotorFields.length;
/** The last row that holds data; anything far below it is not ours. */
export const LAST_LAYOUT_ROW = BEARING_FIRST_ROW + 3 * MAX_BEARINGS - 1;
/** Rows a machine sheet may have before it is refused as not this layout. */
export const MAX_SHEET_ROWS = LAST_LAYOUT_ROW + 200;

export function machineFieldRow(key: MachineFieldKey): number {
  return MACHINE_FIRST_ROW + machineFields.findIndex((f) => f.key === key);
}

export function rotorFieldRow(key: RotorFieldKey): number {
  return ROTOR_FIRST_ROW + rotorFields.findIndex((f) => f.key === key);
}

/** Row of coordinate `axis` (0 x, 1 y, 2 z) of bearing `bearing` (0-based). */
export function bearingRow(bearing: number, axis: number): number {
  return BEARING_FIRST_ROW + 3 * bearing + axis;
}

export function rotorColumn(rotor: number): string {
  const col = ROTOR_COLUMNS[rotor];
  if (!col) throw new Error(`rotor ${rotor} is outside the layout`);
  return col;
}

const axisNames = ["x", "y", "z"] as const;

export function bearingLabel(bearing: number, axis: number): string {
  return `Bearing ${bearing + 1} ${axisNames[axis] ?? "?"}`;
}

/** CSV column names of bearing coordinates, bearing1_x_m … bearing4_z_m. */
export function bearingCsvColumn(bearing: number, axis: number): string {
  return `bearing${bearing + 1}_${axisNames[axis] ?? "?"}_m`;
}

export const csvColumns: string[] = [
  ...machineFields.map((f) => f.csv),
  ...rotorFields.map((f) => f.csv),
  ...Array.from({ length: MAX_BEARINGS }, (_, b) => [0, 1, 2].map((a) => bearingCsvColumn(b, a))).flat(),
];

/** Spreadsheet column letters for a 0-based index (0 → A, 26 → AA). */
export function columnLetter(index: number): string {
  let n = index + 1;
  let out = "";
  while (n > 0) {
    const rem = (n - 1) % 26;
    out = String.fromCharCode(65 + rem) + out;
    n = Math.floor((n - 1) / 26);
  }
  return out;
}
