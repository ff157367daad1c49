import { formatSignificant, toDisplay, unitSymbol, type UnitSystemKey } from "@/modules/units";
import type { MachinePlacement } from "@/modules/desk/machine-placements";
import { MACHINE_DATUM_TEXT, machineToBlock } from "@/modules/vendor-data/datum";

/**
 * The machines' datums on the block and the vendor's own figures, as they stood when the
 * revision was issued (stored beside the input, issue 18 item 6): the reviewer sees where the
 * vendor's positions came from, not only the block coordinates of the input.
 */
export function MachinePlacementsTable({ placements, units }: { placements: MachinePlacement[]; units: UnitSystemKey }) {
  const shown = placements.filter((p) => p.datum || p.vendor);
  const len = (v: number) => formatSignificant(toDisplay("length", v, units));
  const m = unitSymbol("length", units);
  const s = unitSymbol("time", units);
  const point = (p: readonly number[]) => `(${p.map(len).join(", ")}) ${m}`;
  return (
    <section className="slab space-y-2 p-4" aria-labelledby="placements-heading" data-testid="revision-machine-placements">
      <h2 id="placements-heading">Machines on the block as issued</h2>
      {shown.length === 0 ? (
        <p className="text-sm text-basalt-500">No machine datum or vendor figures were recorded with this revision: the machines&apos; positions are block coordinates as typed.</p>
      ) : (
        <>
          <p className="text-xs text-basalt-500">{MACHINE_DATUM_TEXT}</p>
          <div className="overflow-auto" tabIndex={0} role="region" aria-label="Machine datums and vendor figures, scrollable">
            <table>
              <thead>
                <tr>
                  <th>Machine</th>
                  <th>Datum origin on the block</th>
                  <th>Machine x turned about z</th>
                  <th>Vendor data</th>
                  <th>Centre of gravity: vendor → block</th>
                  <th>Vendor&apos;s start-up / coast-down</th>
                </tr>
              </thead>
              <tbody>
                {shown.map((p) => {
                  const v = p.vendor;
                  const fromDatum = v?.frame === "machine-datum";
                  const onBlock = v && fromDatum && p.datum ? machineToBlock(p.datum, v.machine).cg : v && !fromDatum ? v.machine.cg : null;
                  return (
                    <tr key={p.machine}>
                      <td className="text-sm">{p.machine}</td>
                      <td className="font-mono text-xs">{p.datum ? point(p.datum.origin) : "not placed (block coordinates)"}</td>
                      <td className="font-mono text-xs">{p.datum ? `${p.datum.rotationDeg}°` : "—"}</td>
                      <td className="text-xs">{v ? `version ${v.version}, ${fromDatum ? "positions from the machine datum" : "version 1 template: block coordinates"}` : "none"}</td>
                      <td className="font-mono text-xs">{v ? `${point(v.machine.cg)}${onBlock ? ` → ${point(onBlock)}` : ""}` : "—"}</td>
                      <td className="text-xs">
                        {v && v.rampTimes.length
                          ? v.rampTimes
                              .map((r) => `${r.rotor}: ${r.startUpS !== undefined ? `${formatSignificant(r.startUpS)} ${s}` : "—"} / ${r.coastDownS !== undefined ? `${formatSignificant(r.coastDownS)} ${s}` : "—"}`)
                              .join("; ")
                          : "not given"}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        </>
      )}
    </section>
  );
}
