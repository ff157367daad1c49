// The units the package shows. Every sheet follows the project's unit system (projects.units,
// SI or US customary) through the desk's own quantity table; the few quantities that table
// lacks (dashpots, second moments of area, unbalance) are defined here from the same sizes.
import { convertValue, quantityKinds, type QuantityKindKey, type UnitInfo, type UnitSystemKey } from "@/modules/units";

type ExtraKind = "dashpot" | "rotationalDashpot" | "momentOfArea" | "unbalance" | "angularFrequency" | "angularAcceleration" | "time" | "count";
export type PackageKind = QuantityKindKey | ExtraKind;

// Sizes taken from the quantity table, so that one foot or one pound-force is the same here.
const foot = quantityKinds.length.us.siValue;
const inch = foot / 12;
const poundForce = quantityKinds.force.us.siValue;
const pound = quantityKinds.mass.us.siValue;
const kip = quantityKinds.largeForce.us.siValue;

const extra: Record<ExtraKind, { base: UnitInfo; si: UnitInfo; us: UnitInfo; decimals: Record<UnitSystemKey, number> }> = {
  dashpot: { base: { symbol: "N·s/m", siValue: 1 }, si: { symbol: "kN·s/m", siValue: 1e3 }, us: { symbol: "lbf·s/in", siValue: poundForce / inch }, decimals: { si: 1, us: 1 } },
  rotationalDashpot: { base: { symbol: "N·m·s/rad", siValue: 1 }, si: { symbol: "kN·m·s/rad", siValue: 1e3 }, us: { symbol: "kip·ft·s/rad", siValue: kip * foot }, decimals: { si: 1, us: 2 } },
  momentOfArea: { base: { symbol: "m⁴", siValue: 1 }, si: { symbol: "m⁴", siValue: 1 }, us: { symbol: "ft⁴", siValue: foot ** 4 }, decimals: { si: 3, us: 1 } },
  unbalance: { base: { symbol: "kg·m", siValue: 1 }, si: { symbol: "g·mm", siValue: 1e-6 }, us: { symbol: "lb·in", siValue: pound * inch }, decimals: { si: 1, us: 4 } },
  angularFrequency: { base: { symbol: "rad/s", siValue: 1 }, si: { symbol: "rad/s", siValue: 1 }, us: { symbol: "rad/s", siValue: 1 }, decimals: { si: 3, us: 3 } },
  // Speed ramps (start-up and coast-down): time and the rate of change of the shaft speed.
  angularAcceleration: { base: { symbol: "rad/s²", siValue: 1 }, si: { symbol: "rad/s²", siValue: 1 }, us: { symbol: "rad/s²", siValue: 1 }, decimals: { si: 3, us: 3 } },
  time: { base: { symbol: "s", siValue: 1 }, si: { symbol: "s", siValue: 1 }, us: { symbol: "s", siValue: 1 }, decimals: { si: 3, us: 3 } },
  count: { base: { symbol: "", siValue: 1 }, si: { symbol: "", siValue: 1 }, us: { symbol: "", siValue: 1 }, decimals: { si: 0, us: 0 } },
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
