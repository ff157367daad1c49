"use client";

import { useId, useState, type ReactNode } from "react";
import { FieldPick } from "./field-pick";
import { CHECK_VERDICT_LABELS, checkVerdict, type AnalysisResult, type CheckResult } from "@/modules/calc";
import { sortChecksGoverningFirst } from "@/modules/desk/foundation-summary";
import { foldableSoilCases } from "@/modules/desk/check-soil-cases";
import { FACTOR_DOF_LABELS, dynamicCoefficientSource, soilFactorRows, stratumSummary } from "@/modules/desk/soil-factors";
import { DOF_KEYS } from "@/modules/calc";
import { formatSignificant as sig } from "@/modules/units";
import { Explain } from "./explain";
import { useUnits, type QuantityKey } from "./units-context";

const kindOfUnit = (unit: string | undefined): QuantityKey => (unit === "m" ? "displacement" : unit === "m/s" ? "velocity" : "ratio");

const verdictTag: Record<ReturnType<typeof checkVerdict>, string> = {
  pass: "bg-moss-100 text-moss-700",
  fail: "bg-brick-100 text-brick-700",
  accepted: "bg-ochre-100 text-ochre-700",
  "not-applicable": "bg-grout-100 text-basalt-600",
};

/**
 * Every check, governing first. Band checks (at the lower and upper soil bound) are rows like
 * the others; a failing one accepted with a justification reads "accepted with justification"
 * with the text under it. `acceptanceEditor` (the workspace) adds the place to write one.
 * `foldSoilCases` (the workspace): each check shows its governing soil case and the passing
 * rows of its other cases are folded (hidden, still in the table and printed) until "show all"
 * (modules/desk/check-soil-cases.ts); a revision's table shows every row.
 */
export function ChecksTable({ result, acceptanceEditor, foldSoilCases = false }: { result: AnalysisResult; acceptanceEditor?: (c: CheckResult) => ReactNode; foldSoilCases?: boolean }) {
  const units = useUnits();
  const tableId = useId();
  const [showAll, setShowAll] = useState(false);
  const sorted = sortChecksGoverningFirst(result.checks);
  const foldable = foldSoilCases && result.bounds ? foldableSoilCases(sorted) : null;
  const folded = foldable && !showAll ? foldable.filter(Boolean).length : 0;
  const failing = sorted.filter((c) => !c.pass).length;
  const accepted = sorted.filter((c) => checkVerdict(c) === "accepted").length;
  const notApplicable = sorted.filter((c) => c.notApplicable).length;
  const applicable = sorted.length - notApplicable;
  const naText = notApplicable ? `; ${notApplicable} not applicable to this support, shown for information` : "";
  return (
    <div>
      <p className="mb-2 text-sm" data-testid="checks-summary">
        {failing === 0 ? (
          <span className="tag bg-moss-100 text-moss-700">
            all {applicable} checks pass{naText}
          </span>
        ) : (
          <span className="tag bg-brick-100 text-brick-700">
            {failing} of {applicable} checks fail{accepted ? `, ${accepted} of them accepted with justification` : ""}
            {naText}
          </span>
        )}
      </p>
      {result.bounds ? (
        <p className="mb-2 text-2xs text-basalt-500">
          Frequency separation, displacement and velocity are also checked at the lower and upper soil bound.
          {foldable?.some(Boolean) ? (
            <>
              {" "}
              <span data-testid="checks-folded">
                {folded ? `Each shows its governing soil case; ${folded} passing rows at the other cases are folded.` : "Every soil case is shown."}
              </span>{" "}
              <button type="button" className="btn-quiet px-1.5 py-0.5 text-2xs print:hidden" aria-controls={tableId} aria-expanded={showAll} onClick={() => setShowAll((v) => !v)} data-testid="checks-show-all">
                {showAll ? "fold the other soil cases" : `show all ${sorted.length} rows`}
              </button>
            </>
          ) : null}
        </p>
      ) : null}
      <div className="max-h-[420px] overflow-auto rounded-plinth border border-grout-200" tabIndex={0} role="region" aria-label="Checks, scrollable">
        <table data-testid="checks-table" id={tableId}>
          <thead className="sticky top-0">
            <tr>
              <th>Check</th>
              <th className="text-right">Value</th>
              <th className="text-right">Limit</th>
              <th>Verdict</th>
              <th>Source</th>
            </tr>
          </thead>
          <tbody>
            {sorted.map((c, i) => {
              const kind = kindOfUnit(c.unit);
              return (
                <tr
                  key={c.key ?? `${c.id}-${i}`}
                  className={`${c.pass ? "" : c.acceptance ? "bg-ochre-100/40" : "bg-brick-100/40"} ${folded && foldable?.[i] ? "hidden print:table-row" : ""}`}
                  data-verdict={checkVerdict(c)}
                  data-check-key={c.key}
                >
                  <td className="text-xs">{c.key ? <FieldPick path={`checks[${JSON.stringify(c.key)}].value`}>{c.label}</FieldPick> : c.label}</td>
                  <td className="whitespace-nowrap text-right font-mono text-xs">
                    {units.toResultText(kind, c.value)} {units.unitLabel(kind)}
                  </td>
                  <td className="whitespace-nowrap text-right font-mono text-xs">
                    {c.comparison === "min" ? "≥ " : "≤ "}
                    {units.toResultText(kind, c.limit)} {units.unitLabel(kind)}
                  </td>
                  <td className="align-top">
                    <span className={`tag whitespace-nowrap ${verdictTag[checkVerdict(c)]}`}>{CHECK_VERDICT_LABELS[checkVerdict(c)]}</span>
                    {c.acceptance ? (
                      <p className="mt-1 max-w-xs text-2xs text-ochre-700" data-testid="acceptance-text">
                        {c.acceptance.justification}
                      </p>
                    ) : null}
                    {c.notApplicable ? (
                      <p className="mt-1 max-w-xs text-2xs text-basalt-600" data-testid="not-applicable-reason">
                        {c.notApplicable.reason}
                      </p>
                    ) : null}
                    {acceptanceEditor ? acceptanceEditor(c) : null}
                  </td>
                  <td className="max-w-xs text-2xs text-basalt-500">{c.source}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
    </div>
  );
}

function Row({ k, v }: { k: string; v: string }) {
  return (
    <tr>
      <td className="text-xs text-basalt-600">{k}</td>
      <td className="text-right font-mono text-xs">{v}</td>
    </tr>
  );
}

export function MassTable({ result }: { result: AnalysisResult }) {
  const u = useUnits();
  const mp = result.massProperties;
  const f = (k: QuantityKey, v: number) => `${u.toResultText(k, v)} ${u.unitLabel(k)}`;
  return (
    <div>
      <table className="w-full">
        <tbody>
          <Row k="Concrete block mass" v={f("mass", mp.blockMass)} />
          <Row k="Machine mass" v={f("mass", mp.machineMass)} />
          <Row k="Total mass" v={f("mass", mp.totalMass)} />
          <Row k="Combined centre of gravity (x, y, z)" v={mp.cg.map((c) => u.toResultText("length", c)).join(", ") + ` ${u.unitLabel("length")}`} />
          <Row k="Base contact area" v={f("area", mp.baseArea)} />
          <Row k="Mass ratio (block / machines)" v={sig(mp.massRatio)} />
          <Row k="Eccentricity x, y (fraction of base)" v={mp.eccentricity.map((e) => sig(e * 100) + " %").join(", ")} />
          <Row k="Static bearing pressure" v={f("pressure", mp.staticBearingPressure)} />
          {mp.baseThickness !== undefined ? <Row k="Thinnest base solid" v={f("length", mp.baseThickness)} /> : null}
        </tbody>
      </table>
      <Explain
        method="Sum of the concrete boxes (voids subtracted) and the machines as point masses at their centres of gravity; inertia by the parallel-axis theorem."
        formula="m = Σ ρ V_i ± m_machines; x_cg = Σ m_i x_i / m; q = m g / A_base (g = 9.80665 m/s²)"
        source="Rigid-body statics; block rules of thumb (mass ratio ≥ 3, eccentricity ≤ 5 %, bearing ≤ 50 % of allowable) are common practice after ACI 351.3R and Arya, O'Neill & Pincus (1979)"
        inputs={[
          ["base area", f("area", mp.baseArea)],
          ["total weight", f("force", mp.totalMass * 9.80665)],
        ]}
      />
    </div>
  );
}

function SoilFactorsTable({ imp }: { imp: AnalysisResult["impedance"] }) {
  const u = useUnits();
  const f = (k: QuantityKey, v: number) => `${u.toResultText(k, v)} ${u.unitLabel(k)}`;
  const rows = soilFactorRows(imp);
  const strat = stratumSummary(imp);
  if (!rows.length && !strat) return null;
  return (
    <div className="mt-3 space-y-2" data-testid="soil-factors">
      {rows.length ? (
        <table>
          <thead>
            <tr>
              <th>Factor on the static stiffness</th>
              {FACTOR_DOF_LABELS.map((l) => (
                <th key={l} className="text-right">
                  {l}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.label}>
                <td className="text-xs">
                  {r.label}
                  <span className="block text-2xs text-basalt-400">{r.source}</span>
                </td>
                {r.values.map((v, i) => (
                  <td key={i} className="text-right font-mono text-xs">
                    {sig(v)}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {strat ? (
        <p className="text-xs" data-testid="stratum-cutoffs">
          Layer over rock, H = {f("length", strat.thickness)}
          {strat.profile ? ` (equivalent of the borehole layers: Vs = ${f("waveSpeed", strat.profile.shearWaveVelocity)}, ρ = ${f("density", strat.profile.density)}, ν = ${sig(strat.profile.poissonRatio)})` : ""}. Cutoff frequencies: vertical and rocking{" "}
          {sig(strat.cutoffCompressionHz)} Hz, sliding and torsion {sig(strat.cutoffShearHz)} Hz; below them only material damping remains.
          <span className="block text-2xs text-basalt-400">{strat.source}</span>
        </p>
      ) : null}
    </div>
  );
}

const dofLabel: Record<string, string> = { x: "sliding x", y: "sliding y", z: "vertical", rx: "rocking about x", ry: "rocking about y", rz: "torsion" };

export function ImpedanceTable({ result }: { result: AnalysisResult }) {
  const u = useUnits();
  const imp = result.impedance;
  const kindFor = (d: string): QuantityKey => (d.startsWith("r") ? "rotationalStiffness" : "stiffness");
  const dynamic = dynamicCoefficientSource(imp);
  const methodText =
    imp.method === "equivalent-radius"
      ? "Equivalent-radius circular footing on an elastic half-space with Lysmer's analog damping"
      : imp.method === "gazetas"
        ? `Gazetas (1991) rectangular-base static stiffness × dynamic multipliers k(a0), radiation dashpots; dynamic coefficients: ${dynamic?.label ?? ""}`
        : imp.method === "springs"
          ? result.springs?.base
            ? "Steel springs at their positions (K_z = Σkz, K_rx = Σkz y², K_ry = Σkz x², K_rz = Σkh r²) standing on a base block on the soil; the table gives the support the block sees, Z = S_s − S_s T (Tᵀ S_s T + D_b)⁻¹ Tᵀ S_s (springs in series with the base on the soil), real part and Im Z / ω"
            : "Steel springs at their positions, assembled at O (K_z = Σkz, K_rx = Σkz y², K_ry = Σkz x², K_rz = Σkh r²)"
          : imp.method === "piles"
            ? "Rigid cap on vertical flexible piles: single-pile head stiffness and damping (Gazetas 1991; vertical: a compressible rod whose static limit is Randolph & Wroth 1978), group at O by superposition with the dynamic interaction factors of Dobry & Gazetas (1988); a full 6 × 6 with the sway-rocking coupling; the cap's own soil contact ignored"
            : "Springs and damping ratios given by the user";
  return (
    <div>
      <table>
        <thead>
          <tr>
            <th>DOF</th>
            <th className="text-right">Static stiffness</th>
            <th className="text-right">At rated speed</th>
            <th className="text-right">Damping ratio</th>
          </tr>
        </thead>
        <tbody>
          {DOF_KEYS.map((d) => (
            <tr key={d}>
              <td className="text-xs">{dofLabel[d]}</td>
              <td className="text-right font-mono text-xs">
                {u.toResultText(kindFor(d), imp.staticStiffness[d])} {u.unitLabel(kindFor(d))}
              </td>
              <td className="text-right font-mono text-xs">
                {u.toResultText(kindFor(d), imp.stiffness[d])} {u.unitLabel(kindFor(d))}
              </td>
              <td className="text-right font-mono text-xs">{sig(imp.dampingRatio[d] * 100)} %</td>
            </tr>
          ))}
        </tbody>
      </table>
      <SoilFactorsTable imp={imp} />
      {result.springs ? <SpringsTable springs={result.springs} /> : null}
      {imp.method === "piles" ? <PilesTable imp={imp} /> : null}
      <Explain
        method={methodText}
        formula={
          imp.method === "equivalent-radius"
            ? "k_z = 4 G r0/(1−ν); k_x = 32(1−ν) G r0/(7−8ν); k_ψ = 8 G r0³/(3(1−ν)); k_θ = 16 G r0³/3; D_z = 0.425/√B_z …; c = 2 D √(k M_ii)"
            : imp.method === "gazetas"
              ? dynamic?.option === "simplified"
                ? "K_z = 2GL/(1−ν)(0.73 + 1.54 χ^0.75) …; simplified k_z = k_y = 1, C = ρ V A with c = 1; material damping K(1 + 2iβ)"
                : dynamic?.option === "published"
                  ? "K_z = 2GL/(1−ν)(0.73 + 1.54 χ^0.75) …; K(ω) = K k(a0), C = ρ V A c(a0) with k_z, k_y, c_z, c_y, c_rx, c_ry, c_t read from Gazetas' charts (linear in a0 and L/B, held beyond a0 = 2); k_rx = 1 − 0.20 a0 …; material damping K(1 + 2iβ)"
                  : "K_z = 2GL/(1−ν)(0.73 + 1.54 χ^0.75) …; k_z = 1 − (0.4 + 0.2/(L/B)) a0²/(10/(1 + 3(L/B − 1)) + a0²); C_rx = ρ V_La I_bx a0²/(2.2 − 0.4/(L/B)³ + a0²) …; material damping K(1 + 2iβ)"
              : imp.method === "springs"
                ? "dashpots: the dampers' Σcz, Σch assembled like the springs, or c = 2 D √(k M_ii); TR = √(1 + (2ζr)²) / √((1 − r²)² + (2ζr)²)"
                : imp.method === "piles"
                  ? "K_HH = d Es (Ep/Es)^0.21, K_MM = 0.15 d³ Es (Ep/Es)^0.75, K_HM = −0.22 d² Es (Ep/Es)^0.50 (uniform; linear: 0.6/0.35, 0.14/0.80, 0.17/0.60); ξ_HH = 0.8β + 1.10 (f d/Vs)(Ep/Es)^0.17 …; α(S) = (S/r0)^−½ e^(−βωS/V) e^(−iωS/V); K_group = Σ Z Tᵀ A⁻¹ T; radiation dashpots kept ≥ 0"
                  : "c = 2 D √(k M_ii)"
        }
        source={
          imp.method === "equivalent-radius"
            ? "Richart, Hall & Woods (1970), Vibrations of Soils and Foundations, ch. 7 and 10; Lysmer (1965); Hall (1967)"
            : imp.method === "gazetas"
              ? `Gazetas (1991), J. Geotech. Eng. ASCE 117(9), Tables 1 and 2; dynamic coefficients: ${dynamic?.source ?? ""}`
              : imp.method === "springs"
                ? "Catalogue spring stiffness typed by the designer; rigid-body kinematics; Chopra, Dynamics of Structures, §3.6 (transmissibility)"
                : imp.method === "piles"
                  ? "Gazetas (1991), Foundation Engineering Handbook ch. 15; Randolph & Wroth (1978), J. Geotech. Eng. Div. ASCE 104(GT12); Dobry & Gazetas (1988), Géotechnique 38(4) (forms recalled, see the method notes)"
                  : "User-entered values"
        }
        inputs={[
          ...(imp.shearModulus !== undefined ? ([["G", `${u.toResultText("modulus", imp.shearModulus)} ${u.unitLabel("modulus")}`]] as [string, string][]) : []),
          ...(imp.shearWaveVelocity !== undefined ? ([["Vs", `${u.toResultText("waveSpeed", imp.shearWaveVelocity)} ${u.unitLabel("waveSpeed")}`]] as [string, string][]) : []),
          ...(imp.materialDamping !== undefined ? ([["β", String(imp.materialDamping)]] as [string, string][]) : []),
          ...Object.entries(imp.details ?? {}).map(([k, v]) => [k, sig(v, { digits: 4 })] as [string, string]),
        ]}
      />
    </div>
  );
}

const couplingLabel = (a: string, b: string) => `${dofLabel[a] ?? a} – ${dofLabel[b] ?? b}`;

/** Method "piles": the single pile's head values, the group efficiencies and the coupling terms at O. */
function PilesTable({ imp }: { imp: AnalysisResult["impedance"] }) {
  const u = useUnits();
  const d = imp.details ?? {};
  const row = (label: string, value: number | undefined, kind: QuantityKey | null) =>
    value === undefined ? null : (
      <tr key={label}>
        <td className="text-xs">{label}</td>
        <td className="text-right font-mono text-xs">{kind ? `${u.toResultText(kind, value)} ${u.unitLabel(kind)}` : sig(value, { digits: 4 })}</td>
      </tr>
    );
  const coupled = (imp.coupling ?? []).filter((c) => Math.abs(c.stiffness) > 0 && (c.dofs.join() === "x,ry" || c.dofs.join() === "y,rx" || c.dofs.join() === "rx,ry"));
  return (
    <div className="mt-3 space-y-2" data-testid="piles-table">
      <table>
        <caption className="text-left text-xs font-semibold">Single pile and group</caption>
        <tbody>
          {row("Number of piles", d.pileCount, null)}
          {row("Stiffness ratio Ep/Es", d.stiffnessRatio, null)}
          {row("Active length La (Gazetas 1991)", d.activeLength, "length")}
          {row("Pile vertical stiffness, static (Randolph & Wroth 1978 load transfer)", d.pileVerticalStiffness, "stiffness")}
          {row("Pile lateral stiffness K_HH", d.pileLateralStiffness, "stiffness")}
          {row("Pile rocking stiffness K_MM", d.pileRockingStiffness, "rotationalStiffness")}
          {row("Pile cross stiffness K_x,ry", d.pileCrossStiffness, "couplingStiffness")}
          {row("Static group efficiency, vertical (group / n × single)", d.groupEfficiencyVertical, null)}
          {row("Static group efficiency, lateral", d.groupEfficiencyLateral, null)}
          {coupled.map((c) => row(`Coupling ${couplingLabel(c.dofs[0], c.dofs[1])} at rated speed`, c.stiffness, c.dofs[1]?.startsWith("r") && c.dofs[0]?.startsWith("r") ? "rotationalStiffness" : "couplingStiffness"))}
        </tbody>
      </table>
      <p className="text-2xs text-basalt-400">
        The table above gives the diagonal at O; a pile group also couples sliding and rocking (K_x,ry, K_y,rx), which the modes and responses include.
      </p>
    </div>
  );
}

/** Block on steel springs: static deflection, isolation per operating speed, force per spring. */
function SpringsTable({ springs }: { springs: NonNullable<AnalysisResult["springs"]> }) {
  const u = useUnits();
  return (
    <div className="mt-3 space-y-2">
      <p className="text-xs">
        Static deflection W / Σkz: {u.toResultText("length", springs.staticDeflection)} {u.unitLabel("length")} · vertical isolator frequency {u.toResultText("frequency", springs.verticalFrequencyHz)}{" "}
        {u.unitLabel("frequency")} (ζ {sig(springs.verticalDampingRatio * 100)} %) · highest natural frequency {u.toResultText("frequency", springs.highestNaturalFrequencyHz)} {u.unitLabel("frequency")}
      </p>
      {springs.staticLoads?.length ? (
        <p className="text-xs" data-testid="spring-static-loads">
          Static load per spring (rigid block on the springs, statics):{" "}
          {springs.staticLoads.map((f, i) => `${i + 1}: ${u.toResultText("force", f)} ${u.unitLabel("force")}`).join(" · ")}
        </p>
      ) : null}
      <table>
        <thead>
          <tr>
            <th>Rotor</th>
            <th className="text-right">Speed</th>
            <th className="text-right">r = f / f_z</th>
            <th className="text-right">TR</th>
            <th className="text-right">Isolation 1 − TR</th>
          </tr>
        </thead>
        <tbody>
          {springs.rotors.flatMap((r) =>
            r.isolation.map((row) => (
              <tr key={`${r.machine}/${r.rotor}/${row.speedRpm}`}>
                <td className="text-xs">
                  {r.machine} {r.rotor}
                </td>
                <td className="text-right font-mono text-xs">
                  {u.toResultText("speed", row.speedRpm)} {u.unitLabel("speed")}
                </td>
                <td className="text-right font-mono text-xs">{sig(row.frequencyRatio)}</td>
                <td className="text-right font-mono text-xs">{sig(row.transmissibility)}</td>
                <td className="text-right font-mono text-xs">{sig(row.isolationEfficiency * 100)} %</td>
              </tr>
            )),
          )}
        </tbody>
      </table>
      <table>
        <thead>
          <tr>
            <th>Rotor, case (rated speed)</th>
            <th>Spring</th>
            <th className="text-right">Force x</th>
            <th className="text-right">Force y</th>
            <th className="text-right">Force z</th>
          </tr>
        </thead>
        <tbody>
          {springs.rotors.flatMap((r) =>
            r.springForces.flatMap((c) =>
              c.forces.map((f, i) => (
                <tr key={`${r.machine}/${r.rotor}/${c.case}/${c.unbalanceMode}/${i}`}>
                  <td className="text-xs">
                    {r.machine} {r.rotor}, {c.case} ({c.unbalanceMode})
                  </td>
                  <td className="text-xs">{i + 1}</td>
                  {f.map((v, axis) => (
                    <td key={axis} className="text-right font-mono text-xs">
                      {u.toResultText("force", v)} {u.unitLabel("force")}
                    </td>
                  ))}
                </tr>
              )),
            ),
          )}
        </tbody>
      </table>
      <p className="text-2xs text-basalt-400">{springs.transmissibilitySource}</p>
      {springs.base ? <SpringsBaseTable base={springs.base} /> : null}
    </div>
  );
}

/** Springs on a base block: the base, the soil under it, the force into the ground and the base's motion. */
function SpringsBaseTable({ base }: { base: NonNullable<NonNullable<AnalysisResult["springs"]>["base"]> }) {
  const u = useUnits();
  const len = (v: number) => `${u.toResultText("length", v)} ${u.unitLabel("length")}`;
  const hz = (v: number) => `${u.toResultText("frequency", v)} ${u.unitLabel("frequency")}`;
  return (
    <div className="space-y-2" data-testid="springs-base-results">
      <p className="text-xs font-semibold text-basalt-700">Base block under the springs</p>
      <p className="text-xs">
        {len(base.dimensions[0])} × {len(base.dimensions[1])} × {len(base.dimensions[2])} · mass {u.toResultText("largeMass", base.mass)} {u.unitLabel("largeMass")} · spring height{" "}
        {len(base.springHeight)} · static bearing pressure under the base {u.toResultText("pressure", base.staticBearingPressure)} {u.unitLabel("pressure")} (block, machines and base)
      </p>
      <p className="text-xs">
        Two-mass vertical frequencies {hz(base.twoMassVerticalHz[0])} and {hz(base.twoMassVerticalHz[1])} · highest mode of the block on its springs {hz(base.isolatorModesHighestHz)} · same
        springs on a rigid floor {hz(base.rigidFloorHighestHz)} · soil under the base ({base.supportMethod}) K_z {u.toResultText("stiffness", base.soilStiffness.z)} {u.unitLabel("stiffness")} at{" "}
        {hz(base.evaluatedAtHz)}
      </p>
      <table>
        <thead>
          <tr>
            <th>Rotor, case (rated speed)</th>
            <th className="text-right">Force into the ground x, y, z ({u.unitLabel("force")})</th>
            <th className="text-right">Base displacement x, y, z ({u.unitLabel("displacement")})</th>
          </tr>
        </thead>
        <tbody>
          {base.rotors.flatMap((r) =>
            r.cases.map((c) => (
              <tr key={`${r.machine}/${r.rotor}/${c.case}/${c.unbalanceMode}`}>
                <td className="text-xs">
                  {r.machine} {r.rotor}, {c.case} ({c.unbalanceMode})
                </td>
                <td className="text-right font-mono text-xs">{c.groundForce.map((v) => u.toResultText("force", v)).join(", ")}</td>
                <td className="text-right font-mono text-xs">{c.baseDisplacementPeak.map((v) => u.toResultText("displacement", v)).join(", ")}</td>
              </tr>
            )),
          )}
        </tbody>
      </table>
      <p className="text-2xs text-basalt-400">
        Twelve degrees of freedom: the base is condensed out exactly at each frequency; the spring forces come from the relative motion of the block and the base, the force into the
        ground from the soil under the base. The isolation above is measured at the ground. The block&apos;s own amplitudes are in the response table.
      </p>
    </div>
  );
}

export function ModesTable({ result }: { result: AnalysisResult }) {
  const lower = result.bounds?.lower.frequenciesHz;
  const upper = result.bounds?.upper.frequenciesHz;
  const twoStage = result.modes.some((m) => m.block !== undefined);
  return (
    <div>
      <div className="overflow-x-auto" tabIndex={0} role="region" aria-label="Natural frequencies and modes, scrollable">
        <table data-testid="modes-table">
          <thead>
            <tr>
              <th>Mode</th>
              <th className="text-right">f (Hz)</th>
              <th>Dominant</th>
              {twoStage ? <th>Block</th> : null}
              <th className="text-right">Soil band (Hz)</th>
              {result.rotors.map((r) => (
                <th key={`${r.machine}-${r.rotor}`} className="text-right">
                  r: {r.machine} {r.rotor}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {result.modes.map((m, i) => (
              <tr key={i}>
                <td className="font-mono text-xs">{i + 1}</td>
                <td className="text-right font-mono text-xs">{sig(m.frequencyHz)}</td>
                <td className="text-xs">
                  {dofLabel[m.dominant]} ({(m.participation[m.dominant] * 100).toFixed(0)} %)
                </td>
                {twoStage ? <td className="text-xs">{m.block === "base" ? "base block" : "block on springs"} ({((m.upperShare ?? 1) * 100).toFixed(0)} % block)</td> : null}
                <td className="text-right font-mono text-xs">{lower && upper ? `${sig(lower[i] ?? Number.NaN)} – ${sig(upper[i] ?? Number.NaN)}` : "—"}</td>
                {result.rotors.map((r) => {
                  const ratio = r.frequencyRatios[i] ?? 0;
                  const near = Math.abs(ratio - 1) < 0.2;
                  return (
                    <td key={`${r.machine}-${r.rotor}`} className={`text-right font-mono text-xs ${near ? "font-semibold text-brick-700" : ""}`}>
                      {sig(ratio)}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <Explain
        method={
          twoStage
            ? "Undamped generalised eigenproblem K φ = ω² M φ of the block on its springs and the base block on the soil, twelve degrees of freedom (soil under the base at the first rotor's rated speed); frequency ratio r = rated speed / natural frequency."
            : "Undamped generalised eigenproblem K φ = ω² M φ of the rigid block with six degrees of freedom at O (mass matrix about O, springs at O); frequency ratio r = rated speed / natural frequency."
        }
        formula="det(K − ω² M) = 0; f = ω / 2π; participation = M_ii φ_i² / Σ M_jj φ_j²"
        source="Standard structural dynamics (e.g. Chopra, Dynamics of Structures); soil band: G / 1.5 and 1.5 G, common practice (ASCE 4, recalled from memory)"
        inputs={result.rotors.map((r) => [`${r.machine} ${r.rotor} rated`, `${r.speedRpm} rpm = ${sig(r.speedRpm / 60)} Hz`] as [string, string])}
      />
    </div>
  );
}

export function ResponseTable({ result }: { result: AnalysisResult }) {
  const u = useUnits();
  return (
    <div className="space-y-3">
      {result.springs?.base ? (
        <p className="text-2xs text-basalt-400" data-testid="response-base-note">
          Springs on a base block: the transmitted force and the transmissibility below are the force into the ground under the base; the force in each spring and the base&apos;s
          own motion are in the soil-springs panel.
        </p>
      ) : null}
      {result.rotors.map((r) => (
        <div key={`${r.machine}-${r.rotor}`}>
          <p className="text-xs font-semibold text-basalt-700">
            {r.machine} · {r.rotor} · {r.speedRpm} rpm · force amplitude {u.toResultText("force", r.forceAmplitude)} {u.unitLabel("force")}
          </p>
          <div className="overflow-x-auto" tabIndex={0} role="region" aria-label={`Response of ${r.machine} ${r.rotor}, scrollable`}>
            <table>
              <thead>
                <tr>
                  <th>Case</th>
                  <th>Point</th>
                  <th className="text-right">Displacement x, y, z ({u.unitLabel("displacement")})</th>
                  <th className="text-right">Velocity x, y, z ({u.unitLabel("velocity")})</th>
                  <th className="text-right">Transmissibility</th>
                  <th className="text-right">Max over range</th>
                </tr>
              </thead>
              <tbody>
                {r.cases.flatMap((c) =>
                  c.points.map((p, pi) => (
                    <tr key={`${c.case}-${c.unbalanceMode}-${pi}`}>
                      <td className="text-xs">{pi === 0 ? `${c.case} (${c.unbalanceMode})` : ""}</td>
                      <td className="text-xs">{p.name}</td>
                      <td className="text-right font-mono text-xs">{p.displacementPeak.map((d) => u.toResultText("displacement", d)).join(", ")}</td>
                      <td className="text-right font-mono text-xs">{p.velocityPeak.map((d) => u.toResultText("velocity", d)).join(", ")}</td>
                      <td className="text-right font-mono text-xs">{pi === 0 ? sig(c.transmissibility) : ""}</td>
                      <td className="text-right font-mono text-xs">
                        {pi === 0 ? `${u.toResultText("displacement", c.maxOverSpeedRange.displacementPeak)} at ${Math.round(c.maxOverSpeedRange.atRpm)} rpm` : ""}
                      </td>
                    </tr>
                  )),
                )}
              </tbody>
            </table>
          </div>
        </div>
      ))}
      <Explain
        method="Damped harmonic steady state (K(ω)(1 + 2iβ) + iωC − ω²M) u = F, one complex factorisation per frequency; peaks are the moduli of the complex amplitudes; velocity = ω |u|."
        formula="F = m_r e ω² with e = G / ω_rated (or the vendor force × (ω/ω_rated)²) × service factor; TR = |F_soil| / F"
        source="ISO 1940-1 balance grades; harmonic response as in Chopra, Dynamics of Structures"
      />
    </div>
  );
}

/**
 * Rotors responding together (result `combined`): same speed at the worst relative phase (sum of
 * the amplitudes) beside the in-phase case; different speeds by the absolute sum of the peaks.
 * Largest component per point; the single-rotor tables above are unchanged.
 */
export function CombinedResponseTable({ result }: { result: AnalysisResult }) {
  const u = useUnits();
  const combined = result.combined ?? [];
  if (!combined.length) return null;
  const d = (v: number) => u.toResultText("displacement", v);
  const v = (x: number) => u.toResultText("velocity", x);
  return (
    <div className="mt-4 space-y-3" data-testid="combined-response">
      <p className="text-xs font-semibold text-basalt-700">Rotors responding together</p>
      {combined.map((g) => (
        <div key={g.id} data-combination={g.id}>
          <p className="text-xs text-basalt-700">
            {g.group.join(" + ")} · {g.speedRpm === undefined ? "different speeds" : `${g.speedRpm} rpm`}
          </p>
          <p className="text-2xs text-basalt-500">{g.ruleText}</p>
          <div className="overflow-x-auto">
            <table>
              <thead>
                <tr>
                  <th>Case</th>
                  <th>Point</th>
                  <th className="text-right">Displacement, rated ({u.unitLabel("displacement")})</th>
                  <th className="text-right">Velocity, rated ({u.unitLabel("velocity")})</th>
                  <th className="text-right">Displacement over range ({u.unitLabel("displacement")})</th>
                  <th className="text-right">Velocity over range ({u.unitLabel("velocity")})</th>
                  <th className="text-right">In phase: displacement over range ({u.unitLabel("displacement")})</th>
                </tr>
              </thead>
              <tbody>
                {g.cases.flatMap((c) =>
                  c.points.map((p, pi) => (
                    <tr key={`${c.case}-${c.unbalanceMode}-${pi}`}>
                      <td className="text-xs">{pi === 0 ? `${c.case} (${c.unbalanceMode})` : ""}</td>
                      <td className="text-xs">{p.name}</td>
                      <td className="text-right font-mono text-xs">{d(Math.max(...p.displacementPeak))}</td>
                      <td className="text-right font-mono text-xs">{v(Math.max(...p.velocityPeak))}</td>
                      <td className="text-right font-mono text-xs">{d(p.overSpeedRange.displacementPeak)}</td>
                      <td className="text-right font-mono text-xs">{v(p.overSpeedRange.velocityPeak)}</td>
                      <td className="text-right font-mono text-xs">{d(p.inPhase.overSpeedRange.displacementPeak)}</td>
                    </tr>
                  )),
                )}
              </tbody>
            </table>
          </div>
        </div>
      ))}
      <Explain
        method="Same speed: the rotors' harmonic responses superposed per point and axis, each at its worst relative unbalance phase (the sum of the amplitudes), and with every force in phase. Different speeds: the absolute sum of the speed groups' peak amplitudes (upper bound)."
        formula="same speed: max over phases |Σ e^{iφ_r} U_r| = Σ |U_r| per component; in phase |Σ U_r|; different speeds: Σ peaks"
        source="Triangle inequality for the worst phase; sum of peaks for multi-frequency excitation is common practice"
      />
    </div>
  );
}

export function CrossCheckTable({ result }: { result: AnalysisResult }) {
  const cc = result.crossCheck;
  if (!cc) return <p className="text-sm text-basalt-400">No cross-check for this input.</p>;
  const rows: [string, { closedFormHz: number; nearestModeHz: number; nearestMode: number }][] = [
    ["Vertical (single DOF)", cc.vertical],
    ["Torsion (single DOF)", cc.torsion],
    ["Rocking–sliding x–ry, low", cc.rockingSlidingXZ.low],
    ["Rocking–sliding x–ry, high", cc.rockingSlidingXZ.high],
    ["Rocking–sliding y–rx, low", cc.rockingSlidingYZ.low],
    ["Rocking–sliding y–rx, high", cc.rockingSlidingYZ.high],
  ];
  return (
    <div>
      <table data-testid="crosscheck-table">
        <thead>
          <tr>
            <th>Closed form</th>
            <th className="text-right">Closed form (Hz)</th>
            <th className="text-right">Six-DOF (Hz)</th>
            <th className="text-right">Difference</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(([k, v]) => (
            <tr key={k}>
              <td className="text-xs">{k}</td>
              <td className="text-right font-mono text-xs">{sig(v.closedFormHz)}</td>
              <td className="text-right font-mono text-xs">
                {sig(v.nearestModeHz)} (mode {v.nearestMode})
              </td>
              <td className="text-right font-mono text-xs">{sig(((v.nearestModeHz - v.closedFormHz) / v.closedFormHz) * 100)} %</td>
            </tr>
          ))}
        </tbody>
      </table>
      <Explain
        method="Single-degree-of-freedom frequencies and the coupled rocking–sliding pair, beside the nearest six-DOF mode; they agree when the coupling the closed forms leave out is small."
        formula="f_z = √(k_z/m)/2π; ω⁴ − ω²(ω_x² + ω_ψ²)/γ + ω_x² ω_ψ²/γ = 0, γ = I_0/I_b"
        source={cc.source}
      />
    </div>
  );
}
