// The machine data workbook and CSV of Plinthwise, format version 2: one definition of
// every field (label, unit, kind, where it sits) that the workbook builder, the workbook
// and CSV readers, the web form and the error messages all read. Values are the
// contract's (calc-contract.md) in SI units; positions are the vendor's, relative to the
// machine's own datum (datum.ts), and the desk places them on the block. Version 1 (positions
// in block coordinates, no start-up or coast-down times) is still read: its cells sit where
// version 2 has them, version 2 only adds rows below the bearings.
import { balanceGradeSeries } from "@/modules/desk/balance-grades";
import { RAMP_TIME_DEFAULTS, ROTOR_DEFAULTS } from "@/modules/desk/rotor-defaults";

export const FORMAT_ID = "plinthwise-machine-data";
export const FORMAT_VERSION = 2;
/** Versions the readers take; version 1 positions are block coordinates (note shown to the designer). */
export const READABLE_FORMAT_VERSIONS = [1, 2] as const;
export type FormatVersion = (typeof READABLE_FORMAT_VERSIONS)[number];
/** Which frame the positions of an upload are in: the machine's datum (version 2) or the block's (version 1). */
export type PositionFrame = "machine-datum" | "block";
export const frameOfVersion = (v: FormatVersion): PositionFrame => (v === 1 ? "block" : "machine-datum");

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
  /** A position's column name in the version 1 CSV (block coordinates). */
  csvBlock?: string;
  hint?: string;
}

export const machineFields = [
  { key: "name", label: "Machine name or tag", unit: "", kind: "text", required: true, csv: "machine" },
  { key: "mass", label: "Machine mass, rotors included", unit: "kg", kind: "positive", required: true, csv: "machine_mass_kg" },
  { key: "cgX", label: "Centre of gravity x from the machine datum (along the shaft)", unit: "m", kind: "number", required: true, csv: "cg_x_datum_m", csvBlock: "cg_x_m" },
  { key: "cgY", label: "Centre of gravity y from the machine datum", unit: "m", kind: "number", required: true, csv: "cg_y_datum_m", csvBlock: "cg_y_m" },
  { key: "cgZ", label: "Centre of gravity z from the machine datum (up; below the shaft is negative)", unit: "m", kind: "number", required: true, csv: "cg_z_datum_m", csvBlock: "cg_z_m" },
  { key: "boxXFrom", label: "Outline box x from, from the machine datum (optional)", unit: "m", kind: "number", required: false, csv: "box_x_from_datum_m", csvBlock: "box_x_from_m", hint: "Fill all six outline cells or none" },
  { key: "boxXTo", label: "Outline box x to", unit: "m", kind: "number", required: false, csv: "box_x_to_datum_m", csvBlock: "box_x_to_m" },
  { key: "boxYFrom", label: "Outline box y from", unit: "m", kind: "number", required: false, csv: "box_y_from_datum_m", csvBlock: "box_y_from_m" },
  { key: "boxYTo", label: "Outline box y to", unit: "m", kind: "number", required: false, csv: "box_y_to_datum_m", csvBlock: "box_y_to_m" },
  { key: "boxZFrom", label: "Outline box z from", unit: "m", kind: "number", required: false, csv: "box_z_from_datum_m", csvBlock: "box_z_from_m" },
  { key: "boxZTo", label: "Outline box z to", unit: "m", kind: "number", required: false, csv: "box_z_to_datum_m", csvBlock: "box_z_to_m" },
] as const satisfies readonly FieldSpec[];

export const rotorFields = [
  { key: "name", label: "Rotor name", unit: "", kind: "text", required: true, csv: "rotor" },
  { key: "mass", label: "Rotor mass (rotating part)", unit: "kg", kind: "positive", required: true, csv: "rotor_mass_kg" },
  { key: "speedRpm", label: "Rated speed", unit: "rpm", kind: "positive", required: true, csv: "speed_rpm" },
  { key: "speedMinRpm", label: "Lowest operating speed (variable speed only)", unit: "rpm", kind: "positive", required: false, csv: "speed_min_rpm" },
  { key: "speedMaxRpm", label: "Highest operating speed (variable speed only)", unit: "rpm", kind: "positive", required: false, csv: "speed_max_rpm" },
  { key: "balanceGrade", label: "Balance grade G (ISO 1940-1)", unit: "mm/s", kind: "grade", required: false, csv: "balance_grade_mm_s", hint: `Give the grade or the unbalance force, not both; the desk's default for a new rotor is G ${ROTOR_DEFAULTS.balanceGrade.value} (${ROTOR_DEFAULTS.balanceGrade.source})` },
  { key: "unbalanceForce", label: "Unbalance force at rated speed", unit: "N", kind: "positive", required: false, csv: "unbalance_force_n" },
  { key: "serviceFactor", label: "Service factor on the unbalance force", unit: "", kind: "positive", required: false, csv: "service_factor", hint: `Blank means ${ROTOR_DEFAULTS.serviceFactor.value} (${ROTOR_DEFAULTS.serviceFactor.source})` },
  { key: "axis", label: "Shaft axis in the machine datum: x (horizontal shaft) or z (vertical shaft)", unit: "", kind: "axis", required: true, csv: "shaft_axis" },
  { key: "unbalanceMode", label: "Unbalance: static, couple or both", unit: "", kind: "mode", required: false, csv: "unbalance_mode", hint: `Blank means ${ROTOR_DEFAULTS.unbalanceMode.value} (${ROTOR_DEFAULTS.unbalanceMode.source})` },
] as const satisfies readonly FieldSpec[];

/**
 * Start-up and coast-down times of a rotor (version 2), below the bearings on the sheet so that
 * the cells of version 1 keep their places. They set the duration of the speed-ramp runs.
 */
export const rampFields = [
  {
    key: "startUpS",
    label: "Start-up time, standstill to rated speed (optional)",
    unit: "s",
    kind: "positive",
    required: false,
    csv: "start_up_s",
    hint: `Blank: the desk assumes ${RAMP_TIME_DEFAULTS.startUpS.value} s (${RAMP_TIME_DEFAULTS.startUpS.source})`,
  },
  {
    key: "coastDownS",
    label: "Coast-down time, rated speed to standstill (optional)",
    unit: "s",
    kind: "positive",
    required: false,
    csv: "coast_down_s",
    hint: `Blank: the desk assumes ${RAMP_TIME_DEFAULTS.coastDownS.value} s (${RAMP_TIME_DEFAULTS.coastDownS.source})`,
  },
] as const satisfies readonly FieldSpec[];

export type MachineFieldKey = (typeof machineFields)[number]["key"];
export type RotorFieldKey = (typeof rotorFields)[number]["key"];
export type RampFieldKey = (typeof rampFields)[number]["key"];

/** The vendor's start-up and coast-down times of one rotor (s), as uploaded; absent when blank. */
export interface RotorRampTimes {
  machine: string;
  rotor: string;
  startUpS?: number;
  coastDownS?: number;
}

export const axisChoices = ["x", "y", "z"] as const;
/** Shaft axes in the machine datum (version 2): the datum's x runs along a horizontal shaft. */
export const datumAxisChoices = ["x", "z"] as const;
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
/** Rows of the start-up and coast-down times (version 2), after the bearings. */
export const RAMP_FIRST_ROW = BEARING_FIRST_ROW + 3 * MAX_BEARINGS;
/** The last row that holds data; anything far below it is not ours. */
export const LAST_LAYOUT_ROW = RAMP_FIRST_ROW + rampFields.length - 1;
/** Rows a machine sheet may have before it is refused as not this layout. */
export const MAX_SHEET_ROWS = LAST_LAYOUT_ROW + 200;

export function machineFieldRow(key: MachineFieldKey): number {
  return MACHINE_FIRST_ROW + machineFields.findIndex((f) => f.key === key);
}

export function rotorFieldRow(key: RotorFieldKey): number {
  return ROTOR_FIRST_ROW + rotorFields.findIndex((f) => f.key === key);
}

export function rampFieldRow(key: RampFieldKey): number {
  return RAMP_FIRST_ROW + rampFields.findIndex((f) => f.key === key);
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

/** CSV column names of bearing coordinates: bearing1_x_datum_m … (version 2), bearing1_x_m … (version 1). */
export function bearingCsvColumn(bearing: number, axis: number, frame: PositionFrame = "machine-datum"): string {
  return `bearing${bearing + 1}_${axisNames[axis] ?? "?"}_${frame === "block" ? "" : "datum_"}m`;
}

/** CSV columns of a version: version 1 has block-coordinate position names and no times. */
export function csvColumnsOf(frame: PositionFrame): string[] {
  const block = frame === "block";
  return [
    ...machineFields.map((f) => (block ? ((f as FieldSpec).csvBlock ?? f.csv) : f.csv)),
    ...rotorFields.map((f) => f.csv),
    ...Array.from({ length: MAX_BEARINGS }, (_, b) => [0, 1, 2].map((a) => bearingCsvColumn(b, a, frame))).flat(),
    ...(block ? [] : rampFields.map((f) => f.csv)),
  ];
}

export const csvColumns: string[] = csvColumnsOf("machine-datum");

/** Shown to the designer beside an upload of version 1 (block coordinates). */
export const BLOCK_FRAME_NOTE =
  "Uploaded on the version 1 template: its positions are block coordinates (not relative to the machine datum) and are taken in as they are; it has no start-up or coast-down times.";

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
