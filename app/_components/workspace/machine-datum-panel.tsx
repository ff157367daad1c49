"use client";

import { useFormikContext } from "formik";
import { newDatumForm, type DraftForm, type MachineForm, type Vec3Form } from "@/modules/desk/draft-form";
import { DATUM_ROTATIONS, MACHINE_DATUM_TEXT, machineToBlock, type DatumRotation, type MachineDatum } from "@/modules/vendor-data/datum";
import { rampDurationFor } from "@/modules/desk/machine-placements";
import { NumberField } from "./number-field";
import { useUnits } from "./units-context";

const complete = (v: Vec3Form): v is [number, number, number] => v.every((c) => typeof c === "number" && Number.isFinite(c));

/**
 * Where the machine's own datum sits on the block (issue 18, item 6): the vendor gives positions
 * from it, and taking vendor data into the draft places them through it. Below it, the vendor's
 * own figures on record and the start-up and coast-down times that feed the speed-ramp runs.
 */
export function MachineDatumPanel({ mi, machine, readOnly }: { mi: number; machine: MachineForm; readOnly: boolean }) {
  const { setFieldValue, values } = useFormikContext<DraftForm>();
  const units = useUnits();
  const base = `machines[${mi}].datum`;
  const datum = machine.datum;
  const placedDatum: MachineDatum | null = datum?.placed && complete(datum.origin) ? { origin: datum.origin, rotationDeg: datum.rotationDeg } : null;
  const trail = machine.vendor;
  const len = (v: number) => units.toResultText("length", v);
  const point = (p: readonly number[]) => `(${p.map(len).join(", ")}) ${units.unitLabel("length")}`;

  // Places the vendor's positions again through the datum as it stands now (after moving the datum).
  const replace = () => {
    if (!placedDatum || !trail || trail.frame !== "machine-datum") return;
    const block = machineToBlock(placedDatum, trail.machine);
    void setFieldValue(`machines[${mi}].cg`, [...block.cg]);
    if (block.box) void setFieldValue(`machines[${mi}].box`, { enabled: machine.box.enabled, x: [...block.box.x], y: [...block.box.y], z: [...block.box.z] });
    machine.rotors.forEach((r, ri) => {
      const v = block.rotors.find((b) => b.name === r.name);
      if (!v) return;
      void setFieldValue(`machines[${mi}].rotors[${ri}].axis`, v.axis);
      void setFieldValue(`machines[${mi}].rotors[${ri}].bearings`, v.bearings.map((b) => [...b]));
    });
  };

  const placements = values.machines.flatMap((m) => (m.name === machine.name && m.vendor ? [{ machine: m.name, datum: null, vendor: m.vendor }] : []));
  return (
    <div className="mt-2 rounded-plinth border border-dashed border-grout-300 p-2 text-xs" data-testid={`machine-datum-${mi}`}>
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex items-center gap-1.5 pb-2">
          <input
            type="checkbox"
            checked={Boolean(datum?.placed)}
            disabled={readOnly}
            onChange={(e) => void setFieldValue(base, e.target.checked ? (datum ? { ...datum, placed: true } : newDatumForm()) : { ...(datum ?? newDatumForm()), placed: false })}
          />{" "}
          Machine datum placed on the block
        </label>
        {datum?.placed ? (
          <>
            {(["x", "y", "z"] as const).map((axis, j) => (
              <div key={axis} className="w-28">
                <NumberField name={`${base}.origin[${j}]`} label={`Datum origin ${axis}`} kind="length" readOnly={readOnly} />
              </div>
            ))}
            <label>
              <span className="field-label">Machine x turned about z</span>
              <select
                className="field-input"
                value={datum.rotationDeg}
                disabled={readOnly}
                aria-label="Machine datum rotation about z"
                onChange={(e) => void setFieldValue(`${base}.rotationDeg`, Number(e.target.value) as DatumRotation)}
              >
                {DATUM_ROTATIONS.map((r) => (
                  <option key={r} value={r}>
                    {r}° {r === 0 ? "(along block x)" : r === 90 ? "(along block y)" : r === 180 ? "(along block −x)" : "(along block −y)"}
                  </option>
                ))}
              </select>
            </label>
          </>
        ) : null}
      </div>
      <p className="mt-1 text-2xs text-basalt-400">
        {MACHINE_DATUM_TEXT} Place it once: the origin in block coordinates and the turn of the machine&apos;s x from the block&apos;s x, counter-clockwise seen from above. Without a datum the
        machine&apos;s positions are block coordinates.
      </p>
      {trail ? (
        <div className="mt-2 space-y-1" data-testid={`machine-vendor-trail-${mi}`}>
          <p className="font-semibold text-basalt-700">
            Vendor&apos;s figures (machine data version {trail.version}, {trail.frame === "machine-datum" ? "positions from the machine datum" : "version 1 template: block coordinates"})
          </p>
          <p>
            Centre of gravity: vendor {point(trail.machine.cg)}
            {trail.frame === "machine-datum" && placedDatum ? ` → on the block ${point(machineToBlock(placedDatum, trail.machine).cg)}` : ""}
          </p>
          {trail.machine.rotors.map((r) => (
            <p key={r.name}>
              {r.name}: bearings {r.bearings.map(point).join("; ")}
            </p>
          ))}
          {trail.frame === "machine-datum" && placedDatum && !readOnly ? (
            <button type="button" className="btn-quiet text-xs" onClick={replace}>
              Place the vendor&apos;s positions through this datum again
            </button>
          ) : null}
        </div>
      ) : null}
      {machine.rotors.length ? (
        <ul className="mt-2 space-y-0.5" data-testid={`machine-ramp-times-${mi}`}>
          {machine.rotors.map((r) => {
            const up = rampDurationFor(placements, machine.name, r.name, "run-up");
            const down = rampDurationFor(placements, machine.name, r.name, "coast-down");
            return (
              <li key={r.name}>
                {r.name}: start-up {units.toResultText("time", up.durationS)} {units.unitLabel("time")} ({up.source}); coast-down {units.toResultText("time", down.durationS)} {units.unitLabel("time")} ({down.source})
              </li>
            );
          })}
        </ul>
      ) : null}
    </div>
  );
}
