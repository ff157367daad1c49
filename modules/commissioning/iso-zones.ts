// Evaluation zones of ISO 10816-3 (machines above 15 kW measured on non-rotating parts; its
// velocity zones are retained in ISO 20816-3): broad-band r.m.s. velocity at the bearings.
//   Zone A: newly commissioned machines normally fall here.
//   Zone B: acceptable for unrestricted long-term operation.
//   Zone C: not normally acceptable for long-term continuous operation.
//   Zone D: severe enough to cause damage.
// The boundary values below are RECALLED FROM MEMORY of ISO 10816-3:2009, Table A.1 (group 1)
// and Table A.2 (group 2); they have not been checked against the published text here.
// Group 1: large machines, rated power above 300 kW (or electrical machines with shaft height
// of 315 mm and above); group 2: medium machines, 15 kW to 300 kW. Support class: rigid when the
// lowest natural frequency of the machine and its support in the direction of measurement is
// at least 25 % above the main excitation (running) frequency, flexible otherwise (ISO 10816-3
// §5.3 / ISO 20816-1, recalled from memory).

export type MachineGroup = 1 | 2;
export type SupportClass = "rigid" | "flexible";
export type Zone = "A" | "B" | "C" | "D";

/** Zone boundaries A/B, B/C, C/D (m/s r.m.s.). */
export interface ZoneBoundaries {
  ab: number;
  bc: number;
  cd: number;
}

const mm = 1e-3;

/** ISO 10816-3 Tables A.1 and A.2, velocity r.m.s., recalled from memory (see the header). */
export const ISO_10816_3_ZONES: Record<MachineGroup, Record<SupportClass, ZoneBoundaries>> = {
  1: { rigid: { ab: 2.3 * mm, bc: 4.5 * mm, cd: 7.1 * mm }, flexible: { ab: 3.5 * mm, bc: 7.1 * mm, cd: 11.0 * mm } },
  2: { rigid: { ab: 1.4 * mm, bc: 2.8 * mm, cd: 4.5 * mm }, flexible: { ab: 2.3 * mm, bc: 4.5 * mm, cd: 7.1 * mm } },
};

export const ISO_ZONE_SOURCE =
  "ISO 10816-3 (velocity zones retained in ISO 20816-3), Tables A.1 (group 1) and A.2 (group 2), r.m.s. velocity; boundary values recalled from memory";

/** The support factor of ISO 10816-3: rigid when the lowest natural frequency in the direction is >= 1.25 x the running frequency. */
export const RIGID_SUPPORT_FACTOR = 1.25;

export function zoneBoundaries(group: MachineGroup, support: SupportClass): ZoneBoundaries {
  return ISO_10816_3_ZONES[group][support];
}

/** The zone of an r.m.s. velocity (m/s); a value on a boundary belongs to the better zone. */
export function zoneOf(velocityRms: number, b: ZoneBoundaries): Zone {
  if (velocityRms <= b.ab) return "A";
  if (velocityRms <= b.bc) return "B";
  if (velocityRms <= b.cd) return "C";
  return "D";
}

/**
 * Support class from the lowest natural frequency that moves the point in the direction of
 * measurement. Without such a frequency (none known) the support is taken as rigid: its
 * boundaries are the lower ones, the safe side.
 */
export function supportClassOf(lowestNaturalHzInDirection: number | null, runningHz: number): SupportClass {
  if (lowestNaturalHzInDirection === null) return "rigid";
  return lowestNaturalHzInDirection >= RIGID_SUPPORT_FACTOR * runningHz ? "rigid" : "flexible";
}

export const ZONE_WORDS: Record<Zone, string> = {
  A: "zone A (as newly commissioned)",
  B: "zone B (unrestricted long-term operation)",
  C: "zone C (not for long-term continuous operation)",
  D: "zone D (severe enough to cause damage)",
};

/** Zones C and D fail a commissioning record; A and B pass (ISO 10816-3 zone descriptions). */
export const zoneFails = (z: Zone): boolean => z === "C" || z === "D";
