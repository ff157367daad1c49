"use client";

import { createContext, useContext, useMemo, useState, type ReactNode } from "react";
import { setUnitsPreferenceAction } from "../../(desk)/actions";
import { formatSignificant, fromDisplay, quantityKinds, toDisplay, type QuantityKindKey, type UnitSystemKey } from "@/modules/units";

export type QuantityKey = QuantityKindKey;
export type UnitSystem = UnitSystemKey;

export interface UnitsApi {
  system: UnitSystem;
  setSystem: (s: UnitSystem) => void;
  unitLabel: (k: QuantityKey) => string;
  toDisplayNumber: (k: QuantityKey, si: number) => number;
  toDisplayText: (k: QuantityKey, si: number | null | undefined) => string;
  /** A result in display units with engineering significant figures (the package's formatter too). */
  toResultText: (k: QuantityKey, si: number | null | undefined) => string;
  /** Parses what the user typed in display units; blank is null, junk is NaN (the form reports it). */
  fromDisplayText: (k: QuantityKey, text: string) => number | null;
}

const Ctx = createContext<UnitsApi | null>(null);
function trimNumber(v: number, decimals: number): string {
  if (!Number.isFinite(v)) return "";
  const abs = Math.abs(v);
  if (abs !== 0 && (abs >= 1e7 || abs < 10 ** -decimals)) return v.toPrecision(4);
  return String(Number(v.toFixed(decimals)));
}

/** `initial` is the person's saved choice, else the project's default; a switch is saved on the account. */
export function UnitsProvider({ initial, children }: { initial: UnitSystem; children: ReactNode }) {
  const [system, setSystemState] = useState<UnitSystem>(initial);
  const api = useMemo<UnitsApi>(
    () => ({
      system,
      setSystem: (s) => {
        setSystemState(s);
        const fd = new FormData();
        fd.set("units", s);
        void setUnitsPreferenceAction(null, fd);
      },
      unitLabel: (k) => (k === "ratio" ? "" : quantityKinds[k][system].symbol),
      toDisplayNumber: (k, si) => toDisplay(k, si, system),
      toDisplayText: (k, si) => (si === null || si === undefined ? "" : trimNumber(toDisplay(k, si, system), quantityKinds[k].decimals[system])),
      toResultText: (k, si) => (si === null || si === undefined ? "—" : formatSignificant(toDisplay(k, si, system))),
      fromDisplayText: (k, text) => {
        const t = text.trim().replace(",", ".");
        if (t === "") return null;
        const n = Number(t);
        return Number.isFinite(n) ? fromDisplay(k, n, system) : Number.NaN;
      },
    }),
    [system],
  );
  return <Ctx.Provider value={api}>{children}</Ctx.Provider>;
}

export function useUnits(): UnitsApi {
  const v = useContext(Ctx);
  if (!v) throw new Error("useUnits outside UnitsProvider");
  return v;
}

export function UnitsSwitch() {
  const { system, setSystem } = useUnits();
  return (
    <div role="radiogroup" aria-label="Display units" className="inline-flex overflow-hidden rounded-plinth border border-grout-300 text-xs">
      {(["si", "us"] as const).map((s) => (
        <button
          key={s}
          type="button"
          role="radio"
          aria-checked={system === s}
          onClick={() => setSystem(s)}
          className={`px-2.5 py-1 ${system === s ? "bg-basalt-800 text-white" : "bg-white text-basalt-700 hover:bg-grout-100"}`}
        >
          {s === "si" ? "SI" : "US customary"}
        </button>
      ))}
    </div>
  );
}
