// Shapes of a site measurement as the desk reads it from the template (SI inside, the file's
// figures kept beside them so a record can always be shown as measured).
import type { Problem } from "@/modules/vendor-data/types";

export type { Problem };

/**
 * Direction of a reading. The trade's words (vertical, horizontal, axial) are read against the
 * shaft of the bearing's rotor; x, y, z name the block's own axes (always accepted).
 */
export type Direction = "vertical" | "horizontal" | "axial" | "x" | "y" | "z";
export const DIRECTIONS: readonly Direction[] = ["vertical", "horizontal", "axial", "x", "y", "z"];

/**
 * What was measured. "frequency" (a dominant frequency) and "speed" (the running speed read on
 * site) are recorded, not judged; "resonance" is a resonance found on site (bump test, an
 * analysed coast-down) that the calibration fits to the model's nearest natural frequency.
 */
export type Quantity = "velocity rms" | "velocity peak" | "displacement peak-to-peak" | "frequency" | "speed" | "resonance";
export const QUANTITIES: readonly Quantity[] = ["velocity rms", "velocity peak", "displacement peak-to-peak", "frequency", "speed", "resonance"];
export type AmplitudeQuantity = "velocity rms" | "velocity peak" | "displacement peak-to-peak";
export const AMPLITUDE_QUANTITIES: readonly AmplitudeQuantity[] = ["velocity rms", "velocity peak", "displacement peak-to-peak"];

/** Units accepted per quantity (the symbol as written in the file, its factor to SI). */
export const UNITS_OF: Record<Quantity, { symbol: string; toSi: number; aliases: string[] }[]> = {
  "velocity rms": [
    { symbol: "mm/s", toSi: 1e-3, aliases: ["mm/s"] },
    { symbol: "in/s", toSi: 0.0254, aliases: ["in/s", "ips"] },
  ],
  "velocity peak": [
    { symbol: "mm/s", toSi: 1e-3, aliases: ["mm/s"] },
    { symbol: "in/s", toSi: 0.0254, aliases: ["in/s", "ips"] },
  ],
  "displacement peak-to-peak": [
    { symbol: "µm", toSi: 1e-6, aliases: ["µm", "μm", "um", "micron", "microns"] },
    // 1 mil = 0.001 in = 25.4 µm (exact, by the definition of the inch).
    { symbol: "mils", toSi: 25.4e-6, aliases: ["mil", "mils"] },
  ],
  frequency: [
    { symbol: "Hz", toSi: 1, aliases: ["hz"] },
    { symbol: "rpm", toSi: 1 / 60, aliases: ["rpm", "r/min", "cpm"] },
  ],
  speed: [
    { symbol: "rpm", toSi: 1 / 60, aliases: ["rpm", "r/min"] },
    { symbol: "Hz", toSi: 1, aliases: ["hz"] },
  ],
  resonance: [
    { symbol: "rpm", toSi: 1 / 60, aliases: ["rpm", "r/min", "cpm"] },
    { symbol: "Hz", toSi: 1, aliases: ["hz"] },
  ],
};

/** Where a value came from in the file. */
export interface SourceRef {
  sheet: string;
  cell: string;
}

/** One reading at running speed: SI value (m/s, m, Hz) and the file's figure and unit. */
export interface Reading {
  bearing: string;
  direction: Direction;
  quantity: Quantity;
  /** SI: m/s for velocity, m for displacement, Hz for frequency, speed and resonance. */
  value: number;
  given: number;
  unit: string;
  ref: SourceRef;
}

/** A run-up (or coast-down) trace at one bearing and direction: amplitude against speed. */
export interface RunUpTrace {
  bearing: string;
  direction: Direction;
  quantity: AmplitudeQuantity;
  unit: string;
  /** Ascending speed; value SI (m/s or m) in the trace's quantity. */
  samples: { rpm: number; value: number }[];
}
