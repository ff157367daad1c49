// The desk's defaults for what a vendor or designer leaves blank on a rotor, each with where it
// comes from. One source: the design form (new rotor, hints), the vendor template (its printed
// defaults) and the vendor upload (a blank service factor) all read these.

export interface DeskDefault<T> {
  value: T;
  /** Where the value comes from: a standard's clause, or "common practice", as it is shown to users. */
  source: string;
}

export const ROTOR_DEFAULTS = {
  serviceFactor: {
    value: 2,
    source: "ACI 351.3R: a service factor of 2 on the unbalance force for its growth in service (recalled from memory)",
  },
  balanceGrade: {
    value: 6.3,
    source: "ISO 1940-1 (ISO 21940-11): G 6.3, the grade commonly given for pumps, fans and general machinery (typical class, recalled from memory)",
  },
  unbalanceMode: {
    value: "static" as const,
    source: "the calculation contract's default (calc-contract.md): static unbalance, bearings in phase",
  },
} satisfies Record<string, DeskDefault<unknown>>;

/**
 * Durations of a start-up (standstill to rated speed) and a coast-down (rated speed to
 * standstill) when the vendor gives none (s): a direct-on-line start takes seconds, a free
 * coast-down of a pump or fan a minute or more. Common practice, orders of magnitude recalled
 * from memory, not from a source: the vendor's figures replace them.
 */
export const RAMP_TIME_DEFAULTS = {
  startUpS: { value: 10, source: "common practice: a direct-on-line start takes seconds (order of magnitude recalled from memory)" },
  coastDownS: { value: 60, source: "common practice: a free coast-down of a pump or fan takes a minute or more (order of magnitude recalled from memory)" },
} satisfies Record<string, DeskDefault<number>>;
