import type { DataChange } from "@/modules/vendor-data/diff";

function show(v: number | string | null, unit: string): string {
  if (v === null) return "—";
  return typeof v === "number" ? `${Number(v.toPrecision(6))}${unit ? ` ${unit}` : ""}` : v;
}

/** What changed from one version of machine data to the next, figure by figure. */
export function DataDiff({ changes, against }: { changes: DataChange[]; against: string }) {
  if (!changes.length) return <p className="text-sm text-basalt-500">No figure differs from {against}.</p>;
  return (
    <table data-testid="data-diff">
      <caption className="mb-1 text-left text-xs text-basalt-500">Compared with {against}</caption>
      <thead>
        <tr>
          <th>Figure</th>
          <th>Before</th>
          <th>After</th>
          <th>Change</th>
        </tr>
      </thead>
      <tbody>
        {changes.map((c) => (
          <tr key={c.where}>
            <td>{c.where}</td>
            <td className="font-mono">{show(c.before, c.unit)}</td>
            <td className="font-mono">{show(c.after, c.unit)}</td>
            <td className="font-mono">
              {c.kind !== "changed" ? c.kind : c.delta !== null ? `${c.delta > 0 ? "+" : ""}${Number(c.delta.toPrecision(4))}${c.percent !== null ? ` (${c.percent > 0 ? "+" : ""}${c.percent.toFixed(1)} %)` : ""}` : "changed"}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
