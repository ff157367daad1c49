// The one table of the quantities the desk shows and takes: which SI unit the contract
// stores (`base`), which unit each display system shows, the other units a user may type
// after a number, a label and the decimals to show. Forms and result tables share it.
import type { SIUnitSystem, Unit } from "safe-units";
import * as u from "./unit-definitions";
import type { UnitOf } from "./unit-definitions";

export type UnitSystemKey = "si" | "us";

/** A unit reduced to what conversion needs: its symbol and its size in SI coherent units. */
export interface UnitInfo {
  symbol: string;
  /** How many SI coherent units (m, kg, N, Pa, ...) one of this unit is. */
  siValue: number;
}

export interface QuantityKind {
  label: string;
  /** The unit the contract and the database hold the value in. */
  base: UnitInfo;
  si: UnitInfo;
  us: UnitInfo;
  /** Further units of the same dimension that a user may type after a number. */
  accepts: UnitInfo[];
  decimals: Record<UnitSystemKey, number>;
}

const info = <U extends Unit<SIUnitSystem>>(unit: UnitOf<U>): UnitInfo => ({ symbol: unit.symbol, siValue: unit.value });

/**
 * A quantity kind from safe-units units. Generic over the dimension U, so a kind whose
 * units do not share one dimension (say psf for a stiffness) fails to compile.
 */
export function defineQuantityKind<U extends Unit<SIUnitSystem>>(def: {
  label: string;
  base: UnitOf<U>;
  si: UnitOf<U>;
  us: UnitOf<U>;
  accepts?: UnitOf<U>[];
  decimals: Record<UnitSystemKey, number>;
}): QuantityKind {
  return {
    label: def.label,
    base: info(def.base),
    si: info(def.si),
    us: info(def.us),
    accepts: [def.base, def.si, def.us, ...(def.accepts ?? [])].map(info),
    decimals: def.decimals,
  };
}

export const quantityKinds = {
  length: defineQuantityKind({ label: "Length", base: u.metre, si: u.metre, us: u.foot, accepts: [u.millimetre, u.inch], decimals: { si: 3, us: 3 } }),
  area: defineQuantityKind({ label: "Area", base: u.squareMetre, si: u.squareMetre, us: u.squareFoot, decimals: { si: 2, us: 1 } }),
  volume: defineQuantityKind({ label: "Volume", base: u.cubicMetre, si: u.cubicMetre, us: u.cubicYard, accepts: [u.cubicFoot], decimals: { si: 2, us: 2 } }),
  displacement: defineQuantityKind({ label: "Displacement", base: u.metre, si: u.micrometre, us: u.mil, accepts: [u.millimetre, u.inch], decimals: { si: 1, us: 2 } }),
  velocity: defineQuantityKind({ label: "Velocity", base: u.metrePerSecond, si: u.millimetrePerSecond, us: u.inchPerSecond, decimals: { si: 2, us: 3 } }),
  waveSpeed: defineQuantityKind({ label: "Wave speed", base: u.metrePerSecond, si: u.metrePerSecond, us: u.footPerSecond, decimals: { si: 0, us: 0 } }),
  // ISO 1940-1 states the balance grade G in mm/s whatever the drawing units.
  balanceGrade: defineQuantityKind({ label: "Balance grade", base: u.millimetrePerSecond, si: u.millimetrePerSecond, us: u.millimetrePerSecond, decimals: { si: 1, us: 1 } }),
  mass: defineQuantityKind({ label: "Mass", base: u.kilogram, si: u.kilogram, us: u.pound, accepts: [u.tonne, u.kipMass], decimals: { si: 0, us: 0 } }),
  largeMass: defineQuantityKind({ label: "Mass", base: u.kilogram, si: u.tonne, us: u.kipMass, accepts: [u.pound], decimals: { si: 2, us: 2 } }),
  massInertia: defineQuantityKind({ label: "Mass moment of inertia", base: u.kilogramSquareMetre, si: u.tonneSquareMetre, us: u.poundSquareFoot, accepts: [u.kilogramSquareMetre], decimals: { si: 1, us: 0 } }),
  density: defineQuantityKind({ label: "Density", base: u.kilogramPerCubicMetre, si: u.kilogramPerCubicMetre, us: u.poundPerCubicFoot, decimals: { si: 0, us: 1 } }),
  force: defineQuantityKind({ label: "Force", base: u.newton, si: u.newton, us: u.poundForce, accepts: [u.kilonewton, u.kip], decimals: { si: 0, us: 0 } }),
  largeForce: defineQuantityKind({ label: "Force", base: u.newton, si: u.kilonewton, us: u.kip, accepts: [u.poundForce], decimals: { si: 2, us: 2 } }),
  pressure: defineQuantityKind({ label: "Pressure", base: u.pascal, si: u.kilopascal, us: u.poundPerSquareFoot, accepts: [u.megapascal, u.kipPerSquareFoot, u.poundPerSquareInch], decimals: { si: 1, us: 0 } }),
  modulus: defineQuantityKind({ label: "Modulus", base: u.pascal, si: u.megapascal, us: u.kipPerSquareFoot, accepts: [u.kilopascal, u.poundPerSquareFoot, u.poundPerSquareInch], decimals: { si: 1, us: 0 } }),
  stiffness: defineQuantityKind({ label: "Stiffness", base: u.newtonPerMetre, si: u.meganewtonPerMetre, us: u.kipPerInch, accepts: [u.kilonewtonPerMillimetre, u.poundForcePerInch], decimals: { si: 1, us: 1 } }),
  rotationalStiffness: defineQuantityKind({ label: "Rotational stiffness", base: u.newtonMetrePerRadian, si: u.meganewtonMetrePerRadian, us: u.kipFootPerRadian, decimals: { si: 1, us: 0 } }),
  couplingStiffness: defineQuantityKind({ label: "Coupling stiffness", base: u.newtonPerRadian, si: u.meganewtonPerRadian, us: u.kipPerRadian, decimals: { si: 1, us: 1 } }),
  // viscous dashpots (radiation and material damping as coefficients): the package's units too
  dashpot: defineQuantityKind({ label: "Dashpot", base: u.newtonSecondPerMetre, si: u.kilonewtonSecondPerMetre, us: u.poundForceSecondPerInch, accepts: [u.meganewtonSecondPerMetre, u.kipSecondPerInch], decimals: { si: 1, us: 1 } }),
  rotationalDashpot: defineQuantityKind({ label: "Rotational dashpot", base: u.newtonMetreSecondPerRadian, si: u.kilonewtonMetreSecondPerRadian, us: u.kipFootSecondPerRadian, accepts: [u.meganewtonMetreSecondPerRadian], decimals: { si: 1, us: 2 } }),
  time: defineQuantityKind({ label: "Time", base: u.second, si: u.second, us: u.second, accepts: [u.millisecond], decimals: { si: 2, us: 2 } }),
  frequency: defineQuantityKind({ label: "Frequency", base: u.hertzUnit, si: u.hertzUnit, us: u.hertzUnit, decimals: { si: 2, us: 2 } }),
  speed: defineQuantityKind({ label: "Speed", base: u.revolutionPerMinute, si: u.revolutionPerMinute, us: u.revolutionPerMinute, decimals: { si: 0, us: 0 } }),
  ratio: defineQuantityKind({ label: "Ratio", base: u.ratio, si: u.ratio, us: u.ratio, decimals: { si: 3, us: 3 } }),
} as const satisfies Record<string, QuantityKind>;

export type QuantityKindKey = keyof typeof quantityKinds;

export const quantityKindKeys = Object.keys(quantityKinds) as QuantityKindKey[];

/** The unit a system shows for a kind. */
export function displayUnit(kind: QuantityKindKey, system: UnitSystemKey): UnitInfo {
  return quantityKinds[kind][system];
}
