// The units the package shows. Every sheet follows the project's unit system (projects.units,
// SI or US customary) through the desk's own quantity table (time and dashpots included); the
// few quantities that table lacks (second moments of area, unbalance) are defined here from
// the same sizes. Figures are written by the one formatter (format-number.ts), so no kind
// carries decimals here.
import { convertValue, quantityKinds, type QuantityKindKey, type UnitInfo, type UnitSystemKey } from "@/modules/units";

type ExtraKind = "momentOfArea" | "unbalance" | "angularFrequency" | "angularAcceleration" | "count" | "couplingDashpot";
export type PackageKind = QuantityKindKey | ExtraKind;

// Sizes taken from the quantity table, so that one foot or one pound-force is the same here.
const foot = quantityKinds.length.us.siValue;
const inch = foot / 12;
const pound = quantityKinds.mass.us.siValue;
const poundForce = quantityKinds.force.us.siValue;

const extra: Record<ExtraKind, { base: UnitInfo; si: UnitInfo; us: UnitInfo }> = {
  momentOfArea: { base: { symbol: "m⁴", siValue: 1 }, si: { symbol: "m⁴", siValue: 1 }, us: { symbol: "ft⁴", siValue: foot ** 4 } },
  unbalance: { base: { symbol: "kg·m", siValue: 1 }, si: { symbol: "g·mm", siValue: 1e-6 }, us: { symbol: "lb·in", siValue: pound * inch } },
  angularFrequency: { base: { symbol: "rad/s", siValue: 1 }, si: { symbol: "rad/s", siValue: 1 }, us: { symbol: "rad/s", siValue: 1 } },
  // Speed ramps (start-up and coast-down): the rate of change of the shaft speed.
  angularAcceleration: { base: { symbol: "rad/s²", siValue: 1 }, si: { symbol: "rad/s²", siValue: 1 }, us: { symbol: "rad/s²", siValue: 1 } },
  count: { base: { symbol: "", siValue: 1 }, si: { symbol: "", siValue: 1 }, us: { symbol: "", siValue: 1 } },
  // Sway-rocking coupling dashpot of a pile group (the stiffness is in the desk's table, couplingStiffness).
  couplingDashpot: { base: { symbol: "N·s/rad", siValue: 1 }, si: { symbol: "kN·s/rad", siValue: 1e3 }, us: { symbol: "kip·s/rad", siValue: 1000 * poundForce } },
};

function kindOf(kind: PackageKind) {
  return kind in extra ? extra[kind as ExtraKind] : quantityKinds[kind as QuantityKindKey];
}

/** The unit a system shows for a kind. */
export function packageUnit(kind: PackageKind, system: UnitSystemKey): UnitInfo {
  return kindOf(kind)[system];
}

/** A stored (SI) value in the unit the system shows. */
export function toPackageUnit(kind: PackageKind, stored: number, system: UnitSystemKey): number {
  const k = kindOf(kind);
  return convertValue(stored, k.base, k[system]);
}

/** How many stored (SI) units one shown unit is: the factor the live sheet multiplies by. */
export function factorToStored(kind: PackageKind, system: UnitSystemKey): number {
  const k = kindOf(kind);
  return k[system].siValue / k.base.siValue;
}

/** "[µm]" for a header, "[-]" for a ratio. */
export function unitTag(kind: PackageKind, system: UnitSystemKey): string {
  if (kind === "count") return "";
  return `[${packageUnit(kind, system).symbol || "-"}]`;
}
