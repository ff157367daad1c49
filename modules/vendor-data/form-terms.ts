// The vendor's web form speaks the template's terms (version 2): positions from the machine
// datum, start-up and coast-down times per rotor, the desk's defaults for blank cells. This
// turns what the form sends into the contract's machine documents plus the times, and names
// what the contract cannot know is wrong (a shaft along the datum's y).
import { TRANSIENT_LIMITS } from "@/modules/calc/transient-settings";
import { ROTOR_DEFAULTS } from "@/modules/desk/rotor-defaults";
import { datumAxisChoices, type RotorRampTimes } from "./layout";

export interface FormTerms {
  machines: unknown[];
  rampTimes: RotorRampTimes[];
  issues: { path: string; message: string }[];
}

const record = (v: unknown): Record<string, unknown> | null => (v !== null && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : null);

export function readFormTerms(machines: unknown[]): FormTerms {
  const rampTimes: RotorRampTimes[] = [];
  const issues: FormTerms["issues"] = [];
  const out = machines.map((m, mi) => {
    const machine = record(m);
    if (!machine || !Array.isArray(machine.rotors)) return m;
    const rotors = machine.rotors.map((r, ri) => {
      const rotor = record(r);
      if (!rotor) return r;
      const { startUpS, coastDownS, ...rest } = rotor;
      const path = `machines[${mi}].rotors[${ri}]`;
      const times: RotorRampTimes = { machine: String(machine.name ?? ""), rotor: String(rotor.name ?? "") };
      for (const [key, v] of [["startUpS", startUpS], ["coastDownS", coastDownS]] as const) {
        if (v === undefined) continue;
        if (typeof v !== "number" || !(v > 0) || v > TRANSIENT_LIMITS.maxDurationS) issues.push({ path: `${path}.${key}`, message: `must be a number of seconds greater than 0 and at most ${TRANSIENT_LIMITS.maxDurationS}` });
        else times[key] = v;
      }
      if (times.startUpS !== undefined || times.coastDownS !== undefined) rampTimes.push(times);
      if (rest.axis !== undefined && !(datumAxisChoices as readonly unknown[]).includes(rest.axis)) {
        issues.push({ path: `${path}.axis`, message: "in the machine datum a horizontal shaft runs along x (give x), a vertical shaft along z" });
      }
      // A blank service factor is the desk's default, as on the template.
      return rest.serviceFactor === undefined ? { ...rest, serviceFactor: ROTOR_DEFAULTS.serviceFactor.value } : rest;
    });
    return { ...machine, rotors };
  });
  return { machines: out, rampTimes, issues };
}
