// The units Plinthwise shows and accepts, built on safe-units so that every derived unit
// is composed from its exact definition (NIST SP 811, 2008 edition, appendix B) instead of
// a rounded constant, and so that a unit can only stand in for another of its dimension.
import {
  Dimensionless,
  Measure,
  hertz,
  kilo,
  kilograms,
  mega,
  meters,
  micro,
  milli,
  newtons,
  pascals,
  radians,
  seconds,
  type GenericMeasure,
  type SIUnitSystem,
  type Unit,
} from "safe-units";

/** A unit of measure of dimension U in the SI basis, with the symbol shown beside values. */
export type UnitOf<U extends Unit<SIUnitSystem>> = GenericMeasure<number, SIUnitSystem, U> & { readonly symbol: string };

function named<U extends Unit<SIUnitSystem>>(measure: GenericMeasure<number, SIUnitSystem, U>, symbol: string): UnitOf<U> {
  return measure.withSymbol(symbol) as UnitOf<U>;
}

// Standard acceleration of gravity, exact by definition (NIST SP 811 B.8 note).
const standardGravity = Measure.of(9.80665, meters.per(seconds.squared()));

// ---- length: 1 in = 0.0254 m exactly, 1 ft = 12 in = 0.3048 m, 1 mil = 0.001 in ----
export const metre = named(meters, "m");
export const millimetre = named(milli(meters), "mm");
export const micrometre = named(micro(meters), "µm");
export const inch = named(Measure.of(0.0254, meters), "in");
// Both exact by definition; written as literals so 1 ft is 0.3048 m to the last bit.
export const foot = named(Measure.of(0.3048, meters), "ft");
export const mil = named(Measure.of(0.001, inch), "mil");

export const squareMetre = named(meters.squared(), "m²");
export const squareFoot = named(foot.squared(), "ft²");

// ---- volume: 1 yd = 3 ft = 0.9144 m exactly; US concrete is ordered by the cubic yard ----
export const cubicMetre = named(meters.cubed(), "m³");
export const cubicFoot = named(foot.cubed(), "ft³");
export const cubicYard = named(Measure.of(27, foot.cubed()), "yd³");

// ---- mass: 1 lb = 0.45359237 kg exactly; "kip" as a weight is 1000 lb ----
export const kilogram = named(kilograms, "kg");
export const tonne = named(Measure.of(1000, kilograms), "t");
export const pound = named(Measure.of(0.45359237, kilograms), "lb");
export const kipMass = named(Measure.of(1000, pound), "kip");

// ---- force: 1 lbf = 1 lb x g_n = 4.4482216152605 N; 1 kip = 1000 lbf ----
export const newton = named(newtons, "N");
export const kilonewton = named(kilo(newtons), "kN");
export const poundForce = named(pound.times(standardGravity), "lbf");
export const kip = named(Measure.of(1000, poundForce), "kip");

// ---- pressure and modulus ----
export const pascal = named(pascals, "Pa");
export const kilopascal = named(kilo(pascals), "kPa");
export const megapascal = named(mega(pascals), "MPa");
export const poundPerSquareFoot = named(poundForce.per(foot.squared()), "psf");
export const kipPerSquareFoot = named(kip.per(foot.squared()), "ksf");
export const poundPerSquareInch = named(poundForce.per(inch.squared()), "psi");

// ---- density ----
export const kilogramPerCubicMetre = named(kilograms.per(meters.cubed()), "kg/m³");
export const poundPerCubicFoot = named(pound.per(foot.cubed()), "pcf");

// ---- velocity ----
export const metrePerSecond = named(meters.per(seconds), "m/s");
export const millimetrePerSecond = named(milli(meters).per(seconds), "mm/s");
export const inchPerSecond = named(inch.per(seconds), "in/s");
export const footPerSecond = named(foot.per(seconds), "ft/s");

// ---- translational stiffness ----
export const newtonPerMetre = named(newtons.per(meters), "N/m");
export const meganewtonPerMetre = named(mega(newtons).per(meters), "MN/m");
export const kilonewtonPerMillimetre = named(kilo(newtons).per(milli(meters)), "kN/mm");
export const poundForcePerInch = named(poundForce.per(inch), "lbf/in");
export const kipPerInch = named(kip.per(inch), "kip/in");

// ---- rotational stiffness (rad is a base dimension in safe-units, so it stays apart from torque) ----
export const newtonMetrePerRadian = named(newtons.times(meters).per(radians), "N·m/rad");
export const meganewtonMetrePerRadian = named(mega(newtons).times(meters).per(radians), "MN·m/rad");
export const kipFootPerRadian = named(kip.times(foot).per(radians), "kip·ft/rad");
// sway-rocking coupling of a pile group (force per rotation, equal to moment per displacement)
export const newtonPerRadian = named(newtons.per(radians), "N/rad");
export const meganewtonPerRadian = named(mega(newtons).per(radians), "MN/rad");
export const kipPerRadian = named(kip.per(radians), "kip/rad");

// ---- time: the second in both systems; milliseconds accepted for short time steps ----
export const second = named(seconds, "s");
export const millisecond = named(milli(seconds), "ms");

// ---- viscous dashpots (force per velocity; moment per angular velocity) ----
export const newtonSecondPerMetre = named(newtons.times(seconds).per(meters), "N·s/m");
export const kilonewtonSecondPerMetre = named(kilo(newtons).times(seconds).per(meters), "kN·s/m");
export const meganewtonSecondPerMetre = named(mega(newtons).times(seconds).per(meters), "MN·s/m");
export const kipSecondPerInch = named(kip.times(seconds).per(inch), "kip·s/in");
export const poundForceSecondPerInch = named(poundForce.times(seconds).per(inch), "lbf·s/in");
export const newtonMetreSecondPerRadian = named(newtons.times(meters).times(seconds).per(radians), "N·m·s/rad");
export const kilonewtonMetreSecondPerRadian = named(kilo(newtons).times(meters).times(seconds).per(radians), "kN·m·s/rad");
export const meganewtonMetreSecondPerRadian = named(mega(newtons).times(meters).times(seconds).per(radians), "MN·m·s/rad");
export const kipFootSecondPerRadian = named(kip.times(foot).times(seconds).per(radians), "kip·ft·s/rad");

// ---- mass moment of inertia ----
export const kilogramSquareMetre = named(kilograms.times(meters.squared()), "kg·m²");
export const tonneSquareMetre = named(tonne.times(meters.squared()), "t·m²");
export const poundSquareFoot = named(pound.times(foot.squared()), "lb·ft²");

// ---- the same in both systems ----
export const hertzUnit = named(hertz, "Hz");
export const revolutionPerMinute = named(Measure.of(1 / 60, hertz), "rpm");
export const ratio = named(Dimensionless, "");
