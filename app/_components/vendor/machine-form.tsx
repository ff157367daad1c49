"use client";

import { useActionState, useState } from "react";
import type { MachineInput } from "@/modules/calc/schema";
import { MACHINE_DATUM_TEXT } from "@/modules/vendor-data/datum";
import { MAX_BEARINGS, MAX_ROTORS, bearingLabel, machineFields, rampFields, rotorFields, type MachineFieldKey, type RotorFieldKey } from "@/modules/vendor-data/layout";
import { FormMessage, SubmitButton, type FormState } from "../form-kit";
import type { ServerAction } from "../../_lib/action";

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- each action has its own data type
type AnyAction = ServerAction<any>;

type Cells = Record<string, string>;

const s = (v: number | string | null | undefined) => (v === null || v === undefined ? "" : String(v));

/** What the form is prefilled with: positions in the machine datum, or left blank (`omitPositions`). */
export interface FormMachine {
  name: string;
  values: MachineInput | null;
  omitPositions?: boolean;
  rampTimes?: { rotor: string; startUpS?: number; coastDownS?: number }[];
}

function machineCells(entry: FormMachine): Cells {
  const m = entry.values && entry.omitPositions ? { ...entry.values, cg: [null, null, null], box: undefined, rotors: entry.values.rotors.map((r) => ({ ...r, bearings: [] })) } : entry.values;
  const name = entry.name;
  const c: Cells = { name: m?.name ?? name, mass: s(m?.mass), cgX: s(m?.cg[0]), cgY: s(m?.cg[1]), cgZ: s(m?.cg[2]) };
  c.boxXFrom = s(m?.box?.x[0]);
  c.boxXTo = s(m?.box?.x[1]);
  c.boxYFrom = s(m?.box?.y[0]);
  c.boxYTo = s(m?.box?.y[1]);
  c.boxZFrom = s(m?.box?.z[0]);
  c.boxZTo = s(m?.box?.z[1]);
  for (let k = 0; k < MAX_ROTORS; k++) {
    const r = m?.rotors[k];
    const put = (key: string, v: number | string | null | undefined) => (c[`r${k}.${key}`] = s(v));
    put("name", r?.name);
    put("mass", r?.mass);
    put("speedRpm", r?.speedRpm);
    put("speedMinRpm", r?.speedRangeRpm?.[0]);
    put("speedMaxRpm", r?.speedRangeRpm?.[1]);
    put("balanceGrade", r?.balanceGrade);
    put("unbalanceForce", r?.unbalanceForce);
    put("serviceFactor", r?.serviceFactor);
    put("axis", r?.axis);
    put("unbalanceMode", r?.unbalanceMode);
    for (let b = 0; b < MAX_BEARINGS; b++) for (let a = 0; a < 3; a++) put(`b${b}.${a}`, r?.bearings[b]?.[a]);
    const times = r ? entry.rampTimes?.find((t) => t.rotor === r.name) : undefined;
    put("startUpS", times?.startUpS);
    put("coastDownS", times?.coastDownS);
  }
  return c;
}

// Text as typed becomes a number only when it is one; anything else goes to the server as
// text so the contract names the field, exactly as for a workbook cell.
const val = (t: string | undefined): number | string | undefined => {
  const v = (t ?? "").trim();
  if (v === "") return undefined;
  return /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(v) ? Number(v) : v;
};

function toDocument(c: Cells): Record<string, unknown> {
  const doc: Record<string, unknown> = { name: c.name?.trim() ?? "", mass: val(c.mass), cg: [val(c.cgX), val(c.cgY), val(c.cgZ)] };
  const box = ["boxXFrom", "boxXTo", "boxYFrom", "boxYTo", "boxZFrom", "boxZTo"].map((k) => val(c[k]));
  if (box.some((b) => b !== undefined)) doc.box = { x: [box[0], box[1]], y: [box[2], box[3]], z: [box[4], box[5]] };
  const rotors: Record<string, unknown>[] = [];
  for (let k = 0; k < MAX_ROTORS; k++) {
    const g = (key: string) => val(c[`r${k}.${key}`]);
    const used = Object.entries(c).some(([key, v]) => key.startsWith(`r${k}.`) && v.trim() !== "");
    if (!used) continue;
    const r: Record<string, unknown> = { name: c[`r${k}.name`]?.trim(), mass: g("mass"), speedRpm: g("speedRpm"), axis: c[`r${k}.axis`] || undefined, bearings: [] };
    if (g("speedMinRpm") !== undefined || g("speedMaxRpm") !== undefined) r.speedRangeRpm = [g("speedMinRpm"), g("speedMaxRpm")];
    for (const key of ["balanceGrade", "unbalanceForce", "serviceFactor", "startUpS", "coastDownS"]) if (g(key) !== undefined) r[key] = g(key);
    if (c[`r${k}.unbalanceMode`]) r.unbalanceMode = c[`r${k}.unbalanceMode`];
    const bearings: unknown[] = [];
    for (let b = 0; b < MAX_BEARINGS; b++) {
      const xyz = [0, 1, 2].map((a) => g(`b${b}.${a}`));
      if (xyz.some((v) => v !== undefined)) bearings.push(xyz);
    }
    r.bearings = bearings;
    rotors.push(r);
  }
  doc.rotors = rotors;
  return doc;
}

const machinePath: Record<MachineFieldKey, string> = { name: "name", mass: "mass", cgX: "cg[0]", cgY: "cg[1]", cgZ: "cg[2]", boxXFrom: "box.x[0]", boxXTo: "box.x[1]", boxYFrom: "box.y[0]", boxYTo: "box.y[1]", boxZFrom: "box.z[0]", boxZTo: "box.z[1]" };
const rotorPath: Record<RotorFieldKey, string> = { name: "name", mass: "mass", speedRpm: "speedRpm", speedMinRpm: "speedRangeRpm", speedMaxRpm: "speedRangeRpm", balanceGrade: "balanceGrade", unbalanceForce: "unbalanceForce", serviceFactor: "serviceFactor", axis: "axis", unbalanceMode: "unbalanceMode" };

/** The same figures as the workbook, typed in the browser; checked by the same contract on the server. */
export function MachineForm({ projectId, requestId, machines, action }: { projectId: string; requestId: string; machines: FormMachine[]; action: AnyAction }) {
  const [state, formAction] = useActionState(action as (s: FormState, f: FormData) => Promise<FormState>, null);
  const [cells, setCells] = useState<Cells[]>(() => machines.map((m) => machineCells(m)));
  const errors = state && !state.ok ? (state.fieldErrors ?? {}) : {};
  const errorAt = (path: string) => Object.entries(errors).filter(([p]) => p === path || p.startsWith(`${path}[`) || p.startsWith(`${path}.`)).flatMap(([, m]) => m);
  const set = (i: number, key: string, v: string) => setCells((all) => all.map((c, j) => (j === i ? { ...c, [key]: v } : c)));
  const input = (i: number, key: string, path: string, label: string) => {
    const errs = errorAt(path);
    return (
      <td>
        <input className="field-input" aria-label={label} aria-invalid={errs.length > 0} value={cells[i]?.[key] ?? ""} onChange={(e) => set(i, key, e.target.value)} />
        {errs.map((e) => (
          <span key={e} className="field-error block">
            {e}
          </span>
        ))}
      </td>
    );
  };
  return (
    <form action={formAction} className="space-y-4" data-testid="machine-form">
      <input type="hidden" name="projectId" value={projectId} />
      <input type="hidden" name="requestId" value={requestId} />
      <input type="hidden" name="machines" value={JSON.stringify(cells.map(toDocument))} />
      <p className="text-xs text-basalt-700" data-testid="machine-datum-text">
        Positions in metres from the machine&apos;s own datum. {MACHINE_DATUM_TEXT}
      </p>
      {cells.map((_, i) => {
        const mp = `machines[${i}]`;
        return (
          <fieldset key={i} className="slab space-y-3 p-4">
            <legend className="px-1 font-semibold">Machine {i + 1}: {machines[i]?.name}</legend>
            <table>
              <tbody>
                {machineFields.map((f) => (
                  <tr key={f.key}>
                    <th className="w-1/2 normal-case">{f.label}{f.unit ? ` (${f.unit})` : ""}</th>
                    {input(i, f.key, `${mp}.${machinePath[f.key]}`, `${machines[i]?.name}: ${f.label}`)}
                  </tr>
                ))}
              </tbody>
            </table>
            <table>
              <thead>
                <tr>
                  <th>Rotor figure</th>
                  {Array.from({ length: MAX_ROTORS }, (_, k) => (
                    <th key={k}>Rotor {k + 1}</th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {rotorFields.map((f) => (
                  <tr key={f.key}>
                    <th className="normal-case">{f.label}{f.unit ? ` (${f.unit})` : ""}</th>
                    {Array.from({ length: MAX_ROTORS }, (_, k) => <Cell key={k}>{input(i, `r${k}.${f.key}`, `${mp}.rotors[${k}].${rotorPath[f.key]}`, `Rotor ${k + 1} ${f.label}`)}</Cell>)}
                  </tr>
                ))}
                {Array.from({ length: MAX_BEARINGS * 3 }, (_, n) => {
                  const b = Math.floor(n / 3);
                  const a = n % 3;
                  return (
                    <tr key={n}>
                      <th className="normal-case">{bearingLabel(b, a)} from the machine datum (m)</th>
                      {Array.from({ length: MAX_ROTORS }, (_, k) => <Cell key={k}>{input(i, `r${k}.b${b}.${a}`, `${mp}.rotors[${k}].bearings[${b}]`, `Rotor ${k + 1} ${bearingLabel(b, a)}`)}</Cell>)}
                    </tr>
                  );
                })}
                {rampFields.map((f) => (
                  <tr key={f.key}>
                    <th className="normal-case" title={f.hint}>
                      {f.label} ({f.unit})<span className="block text-2xs font-normal text-basalt-400">{f.hint}</span>
                    </th>
                    {Array.from({ length: MAX_ROTORS }, (_, k) => <Cell key={k}>{input(i, `r${k}.${f.key}`, `${mp}.rotors[${k}].${f.key}`, `Rotor ${k + 1} ${f.label}`)}</Cell>)}
                  </tr>
                ))}
              </tbody>
            </table>
          </fieldset>
        );
      })}
      <label className="block">
        <span className="field-label">Note to the designer (optional)</span>
        <input name="note" className="field-input" maxLength={2000} />
      </label>
      <SubmitButton>Submit as a new version</SubmitButton>
      <FormMessage state={state} />
    </form>
  );
}

function Cell({ children }: { children: React.ReactNode }) {
  return <>{children}</>;
}
