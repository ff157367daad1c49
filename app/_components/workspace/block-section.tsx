"use client";

import { FieldArray, useFormikContext } from "formik";
import type { DraftForm } from "@/modules/desk/draft-form";
import { NumberField } from "./number-field";

export function BlockSection({ readOnly }: { readOnly: boolean }) {
  const { values, handleChange } = useFormikContext<DraftForm>();
  return (
    <div className="space-y-3">
      <div className="max-w-xs">
        <NumberField name="block.concreteDensity" label="Concrete density" kind="density" readOnly={readOnly} />
      </div>
      <FieldArray name="block.solids">
        {(arr) => (
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Solids of the block, scrollable">
            <table className="min-w-[760px]" data-testid="solids-table">
              <thead>
                <tr>
                  <th>Box</th>
                  <th>x from</th>
                  <th>x to</th>
                  <th>y from</th>
                  <th>y to</th>
                  <th>z from</th>
                  <th>z to</th>
                  <th>Void</th>
                  {readOnly ? null : <th className="w-40" />}
                </tr>
              </thead>
              <tbody>
                {values.block.solids.map((s, i) => (
                  <tr key={i}>
                    <td>
                      <input
                        name={`block.solids[${i}].name`}
                        value={s.name}
                        onChange={handleChange}
                        readOnly={readOnly}
                        aria-label={`Box ${i + 1} name`}
                        className="field-input px-1.5 py-1 text-xs"
                      />
                    </td>
                    {(["x", "y", "z"] as const).flatMap((axis) =>
                      [0, 1].map((j) => (
                        <td key={`${axis}${j}`}>
                          <NumberField compact name={`block.solids[${i}].${axis}[${j}]`} label={`Box ${i + 1} ${axis} ${j === 0 ? "from" : "to"}`} kind="length" readOnly={readOnly} />
                        </td>
                      )),
                    )}
                    <td className="text-center">
                      <input type="checkbox" name={`block.solids[${i}].void`} checked={s.void} onChange={handleChange} disabled={readOnly} aria-label={`Box ${i + 1} is a void`} />
                    </td>
                    {readOnly ? null : (
                      <td className="whitespace-nowrap">
                        <button type="button" className="btn-quiet px-1.5 py-0.5 text-2xs" onClick={() => arr.insert(i + 1, { ...structuredClone(s), name: `${s.name} copy` })} aria-label={`Copy box ${i + 1}`}>
                          Copy
                        </button>{" "}
                        <button type="button" className="btn-quiet px-1.5 py-0.5 text-2xs" disabled={i === 0} onClick={() => arr.swap(i, i - 1)} aria-label={`Move box ${i + 1} up`}>
                          ↑
                        </button>{" "}
                        <button type="button" className="btn-quiet px-1.5 py-0.5 text-2xs" disabled={i === values.block.solids.length - 1} onClick={() => arr.swap(i, i + 1)} aria-label={`Move box ${i + 1} down`}>
                          ↓
                        </button>{" "}
                        <button type="button" className="btn-danger px-1.5 py-0.5 text-2xs" disabled={values.block.solids.length <= 1} onClick={() => arr.remove(i)} aria-label={`Delete box ${i + 1}`}>
                          ✕
                        </button>
                      </td>
                    )}
                  </tr>
                ))}
              </tbody>
            </table>
            {readOnly ? null : (
              <div className="mt-2 flex gap-2">
                <button type="button" className="btn-quiet text-xs" onClick={() => arr.push({ name: `Box ${values.block.solids.length + 1}`, x: [-1, 1], y: [-1, 1], z: [0, 1], void: false })}>
                  Add box
                </button>
                <button type="button" className="btn-quiet text-xs" onClick={() => arr.push({ name: `Void ${values.block.solids.length + 1}`, x: [-0.25, 0.25], y: [-0.25, 0.25], z: [0.5, 1], void: true })}>
                  Add void
                </button>
              </div>
            )}
          </div>
        )}
      </FieldArray>
      <p className="text-2xs text-basalt-400">Coordinates from O, the centroid of the base contact area on the underside (z = 0, z up). Voids are subtracted from the concrete.</p>
    </div>
  );
}
