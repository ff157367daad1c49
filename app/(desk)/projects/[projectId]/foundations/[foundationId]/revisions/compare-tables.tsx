// The comparison's tables (server components): checks with both verdicts, values and limits and
// what moved; quantities with both values in display units. Names carry the raw path on hover.
import { CHECK_VERDICT_LABELS } from "@/modules/calc";
import type { CheckMoved, QuantityRow, VerdictRow } from "@/modules/revisions";
import { formatSignificant } from "@/modules/units";

const movedText: Record<CheckMoved, string> = {
  limit: "limit moved (criterion changed)",
  value: "value moved",
  both: "limit and value moved",
  neither: "neither moved (justification changed)",
};

const verdictClass = (v: VerdictRow["newVerdict"]) => (v === "pass" ? "text-moss-700" : v === "accepted" ? "font-semibold text-ochre-700" : v === "fail" ? "font-semibold text-brick-700" : "");

const worseMark = (
  <span className="tag ml-1 whitespace-nowrap bg-ochre-100 text-ochre-700" data-testid="worse-mark" title="The value moved to the unsafe side although the verdict improved or stayed pass">
    worse, verdict not
  </span>
);

/** Checks: label (raw path on hover), both verdicts, both values and both limits, which moved. */
export function VerdictTable({ rows, olderLabel, newerLabel, testId }: { rows: VerdictRow[]; olderLabel: string; newerLabel: string; testId: string }) {
  return (
    <div className="slab overflow-x-auto" tabIndex={0} role="region" aria-label="Checks compared">
      <table className="text-xs" data-testid={testId}>
        <thead>
          <tr>
            <th>Check</th>
            <th>Verdict {olderLabel}</th>
            <th>Verdict {newerLabel}</th>
            <th className="text-right">Value {olderLabel}</th>
            <th className="text-right">Value {newerLabel}</th>
            <th className="text-right">Limit {olderLabel}</th>
            <th className="text-right">Limit {newerLabel}</th>
            <th>What moved</th>
            <th>Soil bound</th>
            <th>Source</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((f) => {
            const sign = f.comparison === "min" ? "≥ " : "≤ ";
            return (
              <tr key={f.key} data-testid="verdict-row" data-check-key={f.key} data-moved={f.moved}>
                <td title={f.path}>
                  {f.label}
                  {f.worseWhileBetter ? worseMark : null}
                </td>
                <td className={verdictClass(f.oldVerdict)} data-verdict={f.oldVerdict ?? "absent"}>
                  {f.oldVerdict ? CHECK_VERDICT_LABELS[f.oldVerdict] : "—"}
                </td>
                <td className={verdictClass(f.newVerdict)} data-verdict={f.newVerdict ?? "absent"}>
                  {f.newVerdict ? CHECK_VERDICT_LABELS[f.newVerdict] : "—"}
                  {f.justification ? <span className="block font-normal text-basalt-600">{f.justification}</span> : null}
                </td>
                <td className="whitespace-nowrap text-right font-mono">
                  {f.oldValueText} {f.unit}
                </td>
                <td className={`whitespace-nowrap text-right font-mono ${f.moved === "value" || f.moved === "both" ? "font-semibold" : ""}`}>
                  {f.newValueText} {f.unit}
                </td>
                <td className="whitespace-nowrap text-right font-mono">
                  {f.oldLimit === undefined ? "—" : `${sign}${f.oldLimitText} ${f.unit}`}
                </td>
                <td className={`whitespace-nowrap text-right font-mono ${f.moved === "limit" || f.moved === "both" ? "font-semibold" : ""}`}>
                  {f.newLimit === undefined ? "—" : `${sign}${f.newLimitText} ${f.unit}`}
                </td>
                <td data-testid="moved">{f.oldVerdict && f.newVerdict ? movedText[f.moved] : f.oldVerdict ? `only in ${olderLabel}` : `only in ${newerLabel}`}</td>
                <td>{f.soilCase ? `${f.soilCase} bound${f.soilFactor !== undefined ? ` (× ${f.soilFactor} on G)` : ""}` : "nominal"}</td>
                <td className="max-w-xs text-2xs text-basalt-500">{f.source}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

/** Quantities: the name (raw path on hover), both values in display units, the change. */
export function QuantityTable({ rows, olderLabel, newerLabel }: { rows: QuantityRow[]; olderLabel: string; newerLabel: string }) {
  return (
    <div className="slab overflow-x-auto" tabIndex={0} role="region" aria-label="Values compared">
      <table className="text-xs">
        <thead>
          <tr>
            <th>Quantity</th>
            <th className="text-right">{olderLabel}</th>
            <th className="text-right">{newerLabel}</th>
            <th>Unit</th>
            <th className="text-right">Change</th>
            <th className="text-right">Change, per cent</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={`${r.change}:${r.path}:${r.oldText}:${r.newText}`} data-testid="diff-row" data-path={r.path}>
              <td title={r.path}>
                {r.label}
                {r.change !== "changed" ? <span className="ml-1 text-basalt-500">({r.change})</span> : null}
                {r.worseWhileBetter ? worseMark : null}
              </td>
              <td className="whitespace-nowrap text-right font-mono">{r.oldText}</td>
              <td className="whitespace-nowrap text-right font-mono">{r.newText}</td>
              <td>{r.unit}</td>
              <td className="whitespace-nowrap text-right font-mono">{r.deltaText}</td>
              <td className="whitespace-nowrap text-right font-mono">{r.percentChange === undefined ? "" : `${r.percentChange >= 0 ? "+" : ""}${formatSignificant(r.percentChange)} %`}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function Group({ title, rows, olderLabel, newerLabel, testId, empty }: { title: string; rows: QuantityRow[]; olderLabel: string; newerLabel: string; testId: string; empty: string }) {
  return (
    <section className="space-y-2" data-testid={testId}>
      <h2>
        {title} <span className="text-sm font-normal text-basalt-500">({rows.length} changed)</span>
      </h2>
      {rows.length === 0 ? <p className="text-sm text-basalt-500">{empty}</p> : <QuantityTable rows={rows} olderLabel={olderLabel} newerLabel={newerLabel} />}
    </section>
  );
}

