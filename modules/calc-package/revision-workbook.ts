// The calculation package of one revision: an Excel workbook a checker or the client can
// audit, every number from the stored revision (input and engine result as issued), in
// the project's unit system with the unit in every header, and a hand-check sheet whose
// single-degree-of-freedom values are live formulas.
import ExcelJS from "exceljs";
import { CHECK_VERDICT_LABELS, checkVerdict, CRITERIA_DEFAULTS, DOF_KEYS, SOIL_BAND_DEFAULTS, soilCaseText, type CheckResult, type DofKey } from "@/modules/calc";
import { PILE_DENSITY_DEFAULT } from "@/modules/calc/impedance-piles";
import { CAUTIONS, CAUTIONS_TITLE } from "@/modules/platform/cautions";
import { checkUtilisation, governingCheck } from "@/modules/desk/foundation-summary";
import { FACTOR_DOF_LABELS, dynamicCoefficientSource, soilFactorRows, stratumSummary } from "@/modules/desk/soil-factors";
import { revisionPurposeLabels, revisionStatusLabels } from "@/modules/revisions";
import type { PackageKind } from "./package-units";
import { addHandCheckSheet } from "./hand-check-sheet";
import { packageFigures, type PackageFigure } from "./figures";
import { SheetWriter, type Cell, type Column, type Pair } from "./sheet-writer";
import { SPEED_RAMPS_SHEET, writeSpeedRampsSheet } from "./speed-ramps-sheet";
import { MEASUREMENTS_SHEET, writeMeasurementsSheet } from "./measurements-sheet";
import { applyPrintSetup, printLabels, revisionSignOffs } from "./print-setup";
import type { PackageSignOff, RevisionPackageData } from "./types";

export const PACKAGE_SHEETS = {
  cover: "Cover",
  inputs: "Inputs",
  mass: "Mass",
  springs: "Soil springs",
  modes: "Modes",
  figures: "Figures",
  response: "Response",
  band: "Soil band",
  checks: "Checks",
  history: "Revision trail",
  handCheck: "Hand check",
} as const;

export const DOF_NAMES: Record<DofKey, string> = {
  x: "x sliding",
  y: "y sliding",
  z: "z vertical",
  rx: "rx rocking about x",
  ry: "ry rocking about y",
  rz: "rz torsion",
};

export const METHOD_NAMES = {
  "equivalent-radius": "equivalent-radius half-space springs with Lysmer's analog damping (Richart, Hall & Woods 1970)",
  gazetas: "static and dynamic stiffness and radiation dashpots of a rectangular base (Gazetas 1991)",
  user: "springs and damping ratios entered by the user (geotechnical report or pile-group analysis)",
  springs: "steel springs at given positions (catalogue kz, kh typed by the designer) with dampers or a damping ratio, assembled at O; isolation by the SDOF transmissibility (Chopra, Dynamics of Structures, §3.6)",
  piles:
    "pile cap on vertical piles: single-pile head stiffness and damping of flexible piles (Gazetas 1991; vertical static stiffness Randolph & Wroth 1978), group at O with the dynamic interaction factors of Dobry & Gazetas (1988); full 6 x 6 impedance with the sway-rocking coupling; cap-soil contact ignored",
} as const;

const translational = (k: DofKey) => k === "x" || k === "y" || k === "z";
const UTC = " (UTC)";

export const UNIT_SYSTEM_NAMES = { si: "SI", us: "US customary" } as const;

/** The revision's checked-by and approved-by names, from the sign-off block. */
export function signatures(signOffs: PackageSignOff[]): { checked: string; approved: string } {
  return { checked: signOffs.find((s) => s.role === "Checked")?.name ?? "not yet", approved: signOffs.find((s) => s.role === "Approved")?.name ?? "not yet" };
}

/** The vendor submission named by request, version, file, SHA-256 and date (never by its internal id). */
export function vendorSubmissionText(d: Pick<RevisionPackageData, "vendorSubmission" | "revision">): string {
  const v = d.vendorSubmission;
  if (v) return `${v.request}, version ${v.version}, ${v.fileName ?? "entered in the form"}, SHA-256 ${v.sha256}, submitted ${v.submittedAt.toISOString().slice(0, 10)}`;
  return d.revision.vendorSubmissionId ? "a vendor submission (details not available)" : "none recorded";
}

function cover(w: SheetWriter, d: RevisionPackageData): void {
  const { project, foundation, revision } = d;
  const signOffs = d.signOffs ?? revisionSignOffs(revision);
  const labels = printLabels(d);
  const sign = signatures(signOffs);
  w.title(`Calculation package: ${project.code} ${foundation.tag}, revision ${revision.label}`);
  w.note("Concrete block foundation of rotating machines: masses, soil springs, natural frequencies, response and checks as issued.");
  w.blank();
  w.endTitleBlock();
  w.pairs("Document", [
    { label: "Document number", value: labels.documentNumber },
    { label: "Revision", value: revision.label },
    { label: "Purpose", value: revisionPurposeLabels[revision.purpose ?? "issued-for-check"] },
    { label: "Status", value: labels.statusText },
  ]);
  w.pairs("Project", [
    { label: "Project code", value: project.code },
    { label: "Project name", value: project.name },
    { label: "Client", value: project.client || "—" },
    { label: "Site", value: project.site || "—" },
    { label: "Units in this workbook", value: UNIT_SYSTEM_NAMES[project.units], note: "the project's unit system; the stored revision is SI (calculation contract v1)" },
  ]);
  w.pairs("Foundation", [
    { label: "Tag", value: foundation.tag },
    { label: "Machine train", value: foundation.machineTrain || "—" },
    { label: "Location", value: foundation.location || "—" },
  ]);
  w.table(
    "Revision block",
    [{ header: "Revision" }, { header: `Date${UTC}` }, { header: "By" }, { header: "Checked" }, { header: "Approved" }, { header: "Status" }],
    [[revision.label, revision.issuedAt, revision.issuedByName, sign.checked, sign.approved, revisionStatusLabels[revision.status]]],
  );
  w.table(
    "Sign-off",
    [{ header: "Role" }, { header: "Name" }, { header: `Date${UTC}` }],
    signOffs.map((s) => [s.role, s.name, s.date ?? "—"]),
  );
  w.pairs("Record", [
    { label: "Decision date" + UTC, value: revision.decision?.decidedAt ?? "—" },
    { label: "Decision note", value: revision.decision?.note || "—" },
    { label: "Open review comments", value: revision.openComments ?? "not in the client's copy", kind: "count" },
    { label: "Engine version", value: revision.engineVersion },
    { label: "Input fingerprint (SHA-256 of the canonical input)", value: revision.inputHash },
    { label: "Vendor submission used", value: vendorSubmissionText(d) },
    { label: "Workbook written" + UTC, value: d.generatedAt },
    { label: "Written for", value: d.generatedByName },
  ]);
  w.title(CAUTIONS_TITLE);
  for (const c of CAUTIONS) w.note(c, { bold: true });
  w.blank();
  w.table("Engine warnings", [{ header: "Warning" }], d.result.warnings.map((x) => [x]));
  w.table(
    "Sheets",
    [{ header: "Sheet" }, { header: "What it holds" }],
    [
      [PACKAGE_SHEETS.inputs, "block, soil, impedance method, machines, rotors, bearings, check points, criteria with their sources, soil band, sweep"],
      [PACKAGE_SHEETS.mass, "masses, centre of gravity, eccentricity, mass ratio, bearing pressure, inertia"],
      [PACKAGE_SHEETS.springs, "soil springs, damping ratios and dashpots per degree of freedom"],
      [PACKAGE_SHEETS.modes, "six natural frequencies, participation, mode shapes, frequency ratios, avoidance bands, closed-form cross-check"],
      [PACKAGE_SHEETS.figures, "frequency-response curves with operating ranges and avoidance bands; plan and elevation of the block to scale"],
      [PACKAGE_SHEETS.response, "amplitude and velocity at every bearing and check point for every load case"],
      ...(d.result.transient?.length
        ? [[SPEED_RAMPS_SHEET, "start-up and coast-down runs through resonance (time integration): settings, peaks beside the harmonic steady state, envelope series"]]
        : []),
      [PACKAGE_SHEETS.band, "the same analysis at the lower and the upper shear modulus"],
      [PACKAGE_SHEETS.checks, "every check with value, limit, verdict and source"],
      [PACKAGE_SHEETS.history, "every revision of this foundation and its review trail"],
      [PACKAGE_SHEETS.handCheck, "vertical single-degree-of-freedom check as live formulas: change a yellow cell and see the effect"],
      ...(d.measurements?.length ? [[MEASUREMENTS_SHEET, "site measurement records: readings beside the prediction with the ratio, verdicts, soil calibrated from the measured resonance"]] : []),
    ],
  );
}

function inputs(w: SheetWriter, d: RevisionPackageData): void {
  const { input, result } = d;
  const L: PackageKind = "length";
  w.title(`Inputs of revision ${d.revision.label} as issued`);
  w.blank();
  w.pairs("Block", [{ label: "Concrete density", value: input.block.concreteDensity, kind: "density" }]);
  w.table(
    "Solids and voids (boxes in the foundation's coordinates; z up, O at the centroid of the base)",
    [{ header: "Name" }, { header: "Kind" }, { header: "x from", kind: L }, { header: "x to", kind: L }, { header: "y from", kind: L }, { header: "y to", kind: L }, { header: "z from", kind: L }, { header: "z to", kind: L }],
    input.block.solids.map((s) => [s.name, s.void ? "void" : "solid", s.x[0], s.x[1], s.y[0], s.y[1], s.z[0], s.z[1]]),
  );
  const soil = input.soil;
  const soilPairs: Pair[] = [];
  if (soil.shearModulus !== undefined) soilPairs.push({ label: "Shear modulus G", value: soil.shearModulus, kind: "modulus", note: "from the geotechnical report" });
  if (soil.shearWaveVelocity !== undefined) soilPairs.push({ label: "Shear-wave velocity Vs", value: soil.shearWaveVelocity, kind: "waveSpeed", note: "G = rho Vs^2" });
  soilPairs.push(
    { label: "Poisson's ratio", value: soil.poissonRatio, kind: "ratio" },
    { label: "Soil density", value: soil.density, kind: "density" },
    { label: "Material damping beta", value: soil.materialDamping ?? 0, kind: "ratio", note: soil.materialDamping === undefined ? "not given: 0 used" : "hysteretic, multiplies the stiffness by (1 + 2 i beta)" },
    { label: "Allowable bearing pressure", value: soil.allowableBearingPressure, kind: "pressure" },
    { label: "Embedment depth", value: soil.embedmentDepth, kind: L },
    { label: "Sidewall contact height", value: soil.sidewallContactHeight, kind: L },
  );
  if (soil.stratum) soilPairs.push({ label: "Depth from grade to rock (rigid base)", value: soil.stratum.thickness, kind: L });
  w.pairs("Soil", soilPairs);
  if (soil.layers) {
    w.table(
      "Borehole layers over rock (top down)",
      [{ header: "Layer" }, { header: "Thickness", kind: L }, { header: "Vs", kind: "waveSpeed" }, { header: "G", kind: "modulus" }, { header: "Density", kind: "density" }, { header: "Poisson's ratio", kind: "ratio" }],
      soil.layers.map((l, i) => [`${i + 1}`, l.thickness, l.shearWaveVelocity ?? null, l.shearModulus ?? null, l.density, l.poissonRatio ?? null]),
    );
  }
  w.pairs("Impedance method", [
    { label: "Method", value: input.impedance.method, note: METHOD_NAMES[input.impedance.method] },
    ...(input.impedance.method === "gazetas"
      ? [
          {
            label: "Dynamic coefficients",
            value: input.impedance.gazetasDynamic ?? "published",
            note:
              input.impedance.gazetasDynamic === "simplified"
                ? "k_z = k_y = 1, c = 1 (warned)"
                : input.impedance.gazetasDynamic === "pais-kausel"
                  ? "Pais & Kausel (1988) closed forms"
                  : "Gazetas (1991) charts, digitised (default)",
          },
        ]
      : []),
  ]);
  if (input.impedance.method === "springs") {
    const imp = input.impedance;
    w.table(
      "Steel springs (catalogue values typed by the designer; tops on the underside of the block)",
      [{ header: "Spring", kind: "count" }, { header: "x", kind: L }, { header: "y", kind: L }, { header: "kz", kind: "stiffness" }, { header: "kh", kind: "stiffness" }, { header: "Damper cz", kind: "dashpot" }, { header: "Damper ch", kind: "dashpot" }],
      imp.springs.map((s, i) => [i + 1, s.x, s.y, s.kz, s.kh, s.cz ?? null, s.ch ?? null]),
    );
    if (imp.base) {
      const b = imp.base;
      const support = b.support ?? { method: "gazetas" as const };
      w.pairs("Base block under the springs (two-stage isolation; the soil above is the soil under the base)", [
        { label: "Base x from", value: b.x[0], kind: L },
        { label: "Base x to", value: b.x[1], kind: L },
        { label: "Base y from", value: b.y[0], kind: L },
        { label: "Base y to", value: b.y[1], kind: L },
        { label: "Base z from", value: b.z[0], kind: L },
        { label: "Base z to (top, the springs' bottoms)", value: b.z[1], kind: L },
        { label: "Base concrete density", value: b.concreteDensity ?? input.block.concreteDensity, kind: "density", note: b.concreteDensity === undefined ? "the block's" : "as given" },
        {
          label: "Soil under the base",
          value: support.method,
          note:
            support.method === "gazetas"
              ? `Gazetas (1991) for the base's footprint; dynamic coefficients ${support.gazetasDynamic ?? "published"}`
              : support.method === "equivalent-radius"
                ? "equivalent-radius half-space (Richart, Hall & Woods 1970)"
                : "springs and damping ratios typed by the designer",
        },
      ]);
      if (support.method === "user") {
        w.table(
          "Soil springs under the base (user) and damping ratios",
          [{ header: "Degree of freedom" }, { header: "Translational stiffness", kind: "stiffness" }, { header: "Rotational stiffness", kind: "rotationalStiffness" }, { header: "Damping ratio", kind: "ratio" }],
          DOF_KEYS.map((k) => [DOF_NAMES[k], translational(k) ? support.stiffness[k] : null, translational(k) ? null : support.stiffness[k], support.dampingRatio[k]]),
        );
      }
    }
  }
  if (input.impedance.method === "piles") {
    const imp = input.impedance;
    w.pairs("Piles (vertical, circular, solid; heads at the underside of the cap)", [
      { label: "Number of piles", value: imp.piles.length, kind: "count" },
      { label: "Diameter d", value: imp.diameter, kind: L },
      { label: "Length L", value: imp.length, kind: L },
      { label: "Young's modulus of the pile Ep", value: imp.youngsModulus, kind: "modulus" },
      { label: "Pile density", value: imp.pileDensity ?? PILE_DENSITY_DEFAULT, kind: "density", note: imp.pileDensity === undefined ? "default (reinforced concrete, common practice)" : "as given" },
      { label: "Tip", value: imp.tip, note: imp.tip === "end-bearing" ? "tip on a rigid stratum" : "tip in the same soil" },
      { label: "Soil along the shaft", value: imp.soilProfile ?? "uniform", note: (imp.soilProfile ?? "uniform") === "linear" ? "G(z) = G z / d, G as given at depth d" : "G as given" },
      { label: "Pile-to-pile interaction", value: imp.interaction ?? "dynamic-factors", note: (imp.interaction ?? "dynamic-factors") === "none" ? "each pile alone" : "Dobry & Gazetas (1988)" },
    ]);
    w.table(
      "Pile heads (input coordinates)",
      [{ header: "Pile", kind: "count" }, { header: "x", kind: L }, { header: "y", kind: L }],
      imp.piles.map((p, i) => [i + 1, p.x, p.y]),
    );
  }
  if (input.impedance.method === "user") {
    const imp = input.impedance;
    w.table(
      "User springs and damping ratios",
      [{ header: "Degree of freedom" }, { header: "Translational stiffness", kind: "stiffness" }, { header: "Rotational stiffness", kind: "rotationalStiffness" }, { header: "Damping ratio", kind: "ratio" }],
      DOF_KEYS.map((k) => [DOF_NAMES[k], translational(k) ? imp.stiffness[k] : null, translational(k) ? null : imp.stiffness[k], imp.dampingRatio[k]]),
    );
  }
  w.table(
    "Machines (point masses at their centre of gravity unless a box is given)",
    [{ header: "Machine" }, { header: "Mass", kind: "mass" }, { header: "cg x", kind: L }, { header: "cg y", kind: L }, { header: "cg z", kind: L }, { header: "Modelled as" }, { header: "Rotors", kind: "count" }],
    input.machines.map((m) => [m.name, m.mass, m.cg[0], m.cg[1], m.cg[2], m.box ? `box x ${m.box.x.join("..")}, y ${m.box.y.join("..")}, z ${m.box.z.join("..")} m` : "point mass", m.rotors.length]),
  );
  const rotors = input.machines.flatMap((m) => m.rotors.map((r) => ({ m, r })));
  w.table(
    "Rotors (unbalance from the ISO 1940-1 balance grade, e = G / w, or the vendor's force at rated speed)",
    [
      { header: "Machine" },
      { header: "Rotor" },
      { header: "Rotor mass", kind: "mass" },
      { header: "Rated speed", kind: "speed" },
      { header: "Speed range from", kind: "speed" },
      { header: "Speed range to", kind: "speed" },
      { header: "Balance grade G", kind: "balanceGrade" },
      { header: "Vendor force at rated speed", kind: "force" },
      { header: "Service factor", kind: "ratio" },
      { header: "Shaft axis" },
      { header: "Unbalance" },
      { header: "Bearings", kind: "count" },
    ],
    rotors.map(({ m, r }) => [m.name, r.name, r.mass, r.speedRpm, r.speedRangeRpm?.[0] ?? r.speedRpm, r.speedRangeRpm?.[1] ?? r.speedRpm, r.balanceGrade ?? null, r.unbalanceForce ?? null, r.serviceFactor, r.axis, r.unbalanceMode, r.bearings.length]),
  );
  w.table(
    "Bearings",
    [{ header: "Machine" }, { header: "Rotor" }, { header: "Bearing", kind: "count" }, { header: "x", kind: L }, { header: "y", kind: L }, { header: "z", kind: L }],
    rotors.flatMap(({ m, r }) => r.bearings.map((b, i) => [m.name, r.name, i + 1, b[0], b[1], b[2]] as Cell[])),
  );
  w.table(
    "Check points",
    [{ header: "Point" }, { header: "x", kind: L }, { header: "y", kind: L }, { header: "z", kind: L }],
    (input.checkPoints ?? []).map((p) => [p.name, p.position[0], p.position[1], p.position[2]]),
  );
  const criterionKinds: Record<keyof typeof CRITERIA_DEFAULTS, PackageKind> = {
    frequencySeparation: "ratio",
    maxDisplacementPeak: "displacement",
    maxVelocityPeak: "velocity",
    minMassRatio: "ratio",
    maxEccentricity: "ratio",
    maxBearingRatio: "ratio",
  };
  const criterionLabels: Record<keyof typeof CRITERIA_DEFAULTS, string> = {
    frequencySeparation: "Frequency separation |r - 1| at least",
    maxDisplacementPeak: "Peak displacement at most",
    maxVelocityPeak: "Peak velocity at most",
    minMassRatio: "Block mass over machine mass at least",
    maxEccentricity: "Eccentricity of the combined cg at most (fraction of base side)",
    maxBearingRatio: "Static bearing pressure over allowable at most",
  };
  w.pairs(
    "Acceptance criteria used",
    (Object.keys(CRITERIA_DEFAULTS) as (keyof typeof CRITERIA_DEFAULTS)[]).map((k) => {
      const used = result.criteria?.[k] ?? { value: input.criteria?.[k] ?? CRITERIA_DEFAULTS[k].value, source: CRITERIA_DEFAULTS[k].source };
      return { label: criterionLabels[k], value: used.value, kind: criterionKinds[k], note: used.source };
    }),
    "Source",
  );
  w.pairs(
    "Soil band",
    [
      { label: "Lower factor on G", value: result.bounds?.lower.factor ?? input.soilBand?.lowerFactor ?? SOIL_BAND_DEFAULTS.lowerFactor, kind: "ratio", note: result.bounds?.source ?? SOIL_BAND_DEFAULTS.source },
      { label: "Upper factor on G", value: result.bounds?.upper.factor ?? input.soilBand?.upperFactor ?? SOIL_BAND_DEFAULTS.upperFactor, kind: "ratio" },
    ],
    "Source",
  );
  const f = result.sweep.frequencyHz;
  w.pairs("Frequency sweep", [
    { label: "From", value: f[0] ?? input.sweep?.fromHz ?? null, kind: "frequency" },
    { label: "To", value: f.at(-1) ?? input.sweep?.toHz ?? null, kind: "frequency" },
    { label: "Points", value: f.length, kind: "count" },
  ]);
  w.pairs(
    "Methods",
    [
      { label: "Mass properties", value: "composite of boxes, voids and machines", note: "rigid block; mass matrix about O" },
      { label: "Soil impedance", value: input.impedance.method, note: METHOD_NAMES[input.impedance.method] },
      { label: "Dynamics", value: "six-degree-of-freedom rigid block", note: "undamped eigen-analysis; damped harmonic steady state (K - w^2 M + i w C) u = F" },
      { label: "Loads", value: "rotating unbalance", note: "ISO 1940-1 balance grade: F = m_r e w^2, e = G / w_rated; or the vendor's force scaled with (w / w_rated)^2" },
      { label: "Cross-check", value: "closed forms", note: result.crossCheck?.source ?? "single-degree-of-freedom oscillator (Chopra, Dynamics of Structures)" },
      ...(result.transient?.length
        ? [{ label: "Speed ramps", value: `${result.transient.length} start-up or coast-down run${result.transient.length === 1 ? "" : "s"}`, note: `Newmark time integration; see the ${SPEED_RAMPS_SHEET} sheet` }]
        : []),
    ],
    "Reference",
  );
}

function mass(w: SheetWriter, d: RevisionPackageData): void {
  const mp = d.result.massProperties;
  const L: PackageKind = "length";
  w.title("Mass properties (block of boxes and voids plus machines)");
  w.blank();
  const pairs: Pair[] = [
    { label: "Block mass", value: mp.blockMass, kind: "mass" },
    { label: "Machine mass", value: mp.machineMass, kind: "mass" },
    { label: "Total mass", value: mp.totalMass, kind: "mass" },
    { label: "Combined cg x", value: mp.cg[0], kind: L },
    { label: "Combined cg y", value: mp.cg[1], kind: L },
    { label: "Combined cg z", value: mp.cg[2], kind: L },
    { label: "Base contact area", value: mp.baseArea, kind: "area" },
    { label: "Eccentricity x (fraction of base length)", value: mp.eccentricity[0], kind: "ratio" },
    { label: "Eccentricity y (fraction of base width)", value: mp.eccentricity[1], kind: "ratio" },
    { label: "Mass ratio (block over machines)", value: mp.massRatio, kind: "ratio" },
    { label: "Static bearing pressure", value: mp.staticBearingPressure, kind: "pressure", note: "total weight over base area, g = 9.80665 m/s^2" },
  ];
  if (mp.origin) pairs.push({ label: "O x", value: mp.origin[0], kind: L }, { label: "O y", value: mp.origin[1], kind: L }, { label: "O z", value: mp.origin[2], kind: L });
  if (mp.baseDimensions) pairs.push({ label: "Base length in x", value: mp.baseDimensions[0], kind: L }, { label: "Base width in y", value: mp.baseDimensions[1], kind: L });
  if (mp.baseMomentOfArea) pairs.push({ label: "Second moment of base area about x", value: mp.baseMomentOfArea.aboutX, kind: "momentOfArea" }, { label: "Second moment of base area about y", value: mp.baseMomentOfArea.aboutY, kind: "momentOfArea" });
  if (mp.baseThickness !== undefined) pairs.push({ label: "Thinnest solid on the soil", value: mp.baseThickness, kind: L });
  w.pairs("Masses and centre of gravity", pairs);
  const axes = ["x", "y", "z"];
  w.table(
    "Inertia tensor about the combined centre of gravity",
    [{ header: "Row" }, { header: "about x", kind: "massInertia" }, { header: "about y", kind: "massInertia" }, { header: "about z", kind: "massInertia" }],
    mp.inertiaAtCg.map((row, i) => [`I ${axes[i] ?? i}`, row[0], row[1], row[2]]),
  );
  if (mp.massMatrix) {
    const diag = mp.massMatrix;
    w.table(
      "Mass matrix about O, diagonal (translations: total mass; rotations: inertia about the axes through O)",
      [{ header: "Degree of freedom" }, { header: "Mass", kind: "mass" }, { header: "Inertia", kind: "massInertia" }],
      DOF_KEYS.map((k, i) => [DOF_NAMES[k], translational(k) ? (diag[i]?.[i] ?? null) : null, translational(k) ? null : (diag[i]?.[i] ?? null)]),
    );
  }
}

function springs(w: SheetWriter, d: RevisionPackageData): void {
  const imp = d.result.impedance;
  w.title("Soil impedance: springs and dashpots at O");
  w.note(METHOD_NAMES[imp.method]);
  w.blank();
  const pairs: Pair[] = [{ label: "Method", value: imp.method }];
  if (imp.evaluatedAtHz !== undefined) pairs.push({ label: "Evaluated at (first rotor's rated speed)", value: imp.evaluatedAtHz, kind: "frequency" });
  if (imp.materialDamping !== undefined) pairs.push({ label: "Material damping beta", value: imp.materialDamping, kind: "ratio" });
  if (imp.shearModulus !== undefined) pairs.push({ label: "Shear modulus G", value: imp.shearModulus, kind: "modulus" });
  if (imp.shearWaveVelocity !== undefined) pairs.push({ label: "Shear-wave velocity Vs", value: imp.shearWaveVelocity, kind: "waveSpeed" });
  const dynamic = dynamicCoefficientSource(imp);
  if (dynamic) pairs.push({ label: "Dynamic coefficients k(a0), c(a0)", value: dynamic.label, note: dynamic.source });
  w.pairs("Basis", pairs);
  const table = (title: string, keys: DofKey[], k: PackageKind, c: PackageKind) =>
    w.table(
      title,
      [{ header: "Degree of freedom" }, { header: "Static stiffness", kind: k }, { header: "Stiffness used", kind: k }, { header: "Damping ratio", kind: "ratio" }, { header: "Dashpot", kind: c }],
      keys.map((key) => [DOF_NAMES[key], imp.staticStiffness[key], imp.stiffness[key], imp.dampingRatio[key], imp.dashpot?.[key] ?? null]),
    );
  table("Translations", ["x", "y", "z"], "stiffness", "dashpot");
  table("Rotations", ["rx", "ry", "rz"], "rotationalStiffness", "rotationalDashpot");
  if (imp.coupling?.length) {
    const kindOf = (a: DofKey, b: DofKey): [PackageKind, PackageKind] => {
      const ta = translational(a);
      const tb = translational(b);
      if (ta && tb) return ["stiffness", "dashpot"];
      if (!ta && !tb) return ["rotationalStiffness", "rotationalDashpot"];
      return ["couplingStiffness", "couplingDashpot"];
    };
    w.pairs(
      "Coupling terms of the 6 x 6 impedance at O (symmetric; each pair once)",
      imp.coupling.flatMap((t) => {
        const [k, c] = kindOf(t.dofs[0], t.dofs[1]);
        const name = `${DOF_NAMES[t.dofs[0]]} / ${DOF_NAMES[t.dofs[1]]}`;
        return [
          { label: `${name}: stiffness`, value: t.stiffness, kind: k },
          { label: `${name}: dashpot`, value: t.dashpot, kind: c },
        ];
      }),
    );
  }
  const pd = imp.method === "piles" ? imp.details : undefined;
  if (pd) {
    w.pairs("Single pile and group (sources: Gazetas 1991; Randolph & Wroth 1978; Dobry & Gazetas 1988)", [
      { label: "Ep / Es", value: pd.stiffnessRatio ?? null, kind: "ratio" },
      { label: "Active length La (Gazetas 1991, recalled)", value: pd.activeLength ?? null, kind: "length" },
      { label: "Pile vertical stiffness, static (Randolph & Wroth 1978 load transfer)", value: pd.pileVerticalStiffness ?? null, kind: "stiffness" },
      { label: "Pile lateral stiffness K_HH (Gazetas 1991)", value: pd.pileLateralStiffness ?? null, kind: "stiffness" },
      { label: "Pile rocking stiffness K_MM (Gazetas 1991)", value: pd.pileRockingStiffness ?? null, kind: "rotationalStiffness" },
      { label: "Pile cross stiffness K_x,ry (Gazetas 1991)", value: pd.pileCrossStiffness ?? null, kind: "couplingStiffness" },
      { label: "Static group efficiency, vertical", value: pd.groupEfficiencyVertical ?? null, kind: "ratio" },
      { label: "Static group efficiency, lateral", value: pd.groupEfficiencyLateral ?? null, kind: "ratio" },
    ]);
  }
  const factorRows = soilFactorRows(imp);
  if (factorRows.length) {
    w.table(
      "Factors on the static stiffness, with their sources",
      [{ header: "Factor" }, ...FACTOR_DOF_LABELS.map((l) => ({ header: l, kind: "ratio" as const })), { header: "Source" }],
      factorRows.map((r) => [r.label, ...r.values, r.source]),
    );
  }
  const strat = stratumSummary(imp);
  if (strat) {
    const sp: Pair[] = [
      { label: "Depth from grade to rock H", value: strat.thickness, kind: "length" },
      { label: "Cutoff, vertical and rocking (V_La / 4H)", value: strat.cutoffCompressionHz, kind: "frequency", note: "no radiation damping below" },
      { label: "Cutoff, sliding and torsion (Vs / 4H)", value: strat.cutoffShearHz, kind: "frequency", note: "no radiation damping below" },
    ];
    if (strat.profile) {
      sp.push(
        { label: "Equivalent Vs of the layers (travel-time average)", value: strat.profile.shearWaveVelocity, kind: "waveSpeed" },
        { label: "Equivalent density (thickness-weighted)", value: strat.profile.density, kind: "density" },
        { label: "Equivalent Poisson's ratio (thickness-weighted)", value: strat.profile.poissonRatio, kind: "ratio" },
      );
    }
    sp.push({ label: "Source", value: strat.source });
    w.pairs("Soil layer over rock", sp);
  }
  const sr = d.result.springs;
  if (sr) {
    w.pairs("Block on steel springs", [
      { label: "Static deflection W / sum kz", value: sr.staticDeflection, kind: "length" },
      { label: sr.base ? "Vertical isolator frequency (lower root of the two-mass system)" : "Vertical isolator frequency sqrt(sum kz / m) / 2 pi", value: sr.verticalFrequencyHz, kind: "frequency" },
      { label: "Vertical damping ratio", value: sr.verticalDampingRatio, kind: "ratio" },
      { label: "Highest natural frequency", value: sr.highestNaturalFrequencyHz, kind: "frequency" },
      { label: "Source", value: sr.transmissibilitySource },
    ]);
    w.table(
      sr.base ? "Isolation per operating speed (force into the ground, twelve-DOF steady state)" : "Isolation per operating speed (vertical mode as SDOF)",
      [{ header: "Machine" }, { header: "Rotor" }, { header: "Speed", kind: "speed" }, { header: "Frequency ratio r", kind: "ratio" }, { header: "Transmissibility TR", kind: "ratio" }, { header: "Isolation efficiency 1 - TR", kind: "ratio" }],
      sr.rotors.flatMap((r) => r.isolation.map((row) => [r.machine, r.rotor, row.speedRpm, row.frequencyRatio, row.transmissibility, row.isolationEfficiency])),
    );
    if (sr.staticLoads?.length) {
      w.table(
        "Static load in each spring (rigid block on the springs, statics)",
        [{ header: "Spring", kind: "count" }, { header: "Static load", kind: "force" }],
        sr.staticLoads.map((f, i) => [i + 1, f]),
      );
    }
    w.table(
      "Force amplitude in each spring at the rated speed",
      [{ header: "Machine" }, { header: "Rotor" }, { header: "Case" }, { header: "Unbalance" }, { header: "Spring", kind: "count" }, { header: "Force x", kind: "force" }, { header: "Force y", kind: "force" }, { header: "Force z", kind: "force" }],
      sr.rotors.flatMap((r) => r.springForces.flatMap((c) => c.forces.map((f, i) => [r.machine, r.rotor, c.case, c.unbalanceMode, i + 1, f[0], f[1], f[2]]))),
    );
    const base = sr.base;
    if (base) {
      w.pairs("Base block under the springs (twelve degrees of freedom, the base condensed out exactly at each frequency)", [
        { label: "Base length x", value: base.dimensions[0], kind: "length" },
        { label: "Base width y", value: base.dimensions[1], kind: "length" },
        { label: "Base thickness", value: base.dimensions[2], kind: "length" },
        { label: "Base mass", value: base.mass, kind: "largeMass" },
        { label: "Spring height (base top to the block's underside)", value: base.springHeight, kind: "length" },
        { label: "Static bearing pressure under the base (block, machines and base)", value: base.staticBearingPressure, kind: "pressure" },
        { label: "Soil under the base", value: base.supportMethod },
        { label: "Soil K_z under the base at the modes' frequency", value: base.soilStiffness.z, kind: "stiffness" },
        { label: "Evaluated at", value: base.evaluatedAtHz, kind: "frequency" },
        { label: "Two-mass vertical frequency, lower (Den Hartog; Chopra, two-DOF systems)", value: base.twoMassVerticalHz[0], kind: "frequency" },
        { label: "Two-mass vertical frequency, upper", value: base.twoMassVerticalHz[1], kind: "frequency" },
        { label: "Highest mode of the block on its springs", value: base.isolatorModesHighestHz, kind: "frequency" },
        { label: "Highest mode of the same springs on a rigid floor", value: base.rigidFloorHighestHz, kind: "frequency" },
      ]);
      w.table(
        "Soil springs and dashpots under the base, at B (centre of the base's underside)",
        [{ header: "Degree of freedom" }, { header: "Static stiffness", kind: "stiffness" }, { header: "Stiffness at the modes' frequency", kind: "stiffness" }, { header: "Dashpot", kind: "dashpot" }],
        DOF_KEYS.filter(translational).map((k) => [DOF_NAMES[k], base.soilStaticStiffness[k], base.soilStiffness[k], base.soilDashpot[k]]),
      );
      w.table(
        "Force into the ground and motion of the base at the rated speed",
        [
          { header: "Machine" },
          { header: "Rotor" },
          { header: "Case" },
          { header: "Unbalance" },
          { header: "Ground force x", kind: "force" },
          { header: "Ground force y", kind: "force" },
          { header: "Ground force z", kind: "force" },
          { header: "Base displacement x", kind: "displacement" },
          { header: "Base displacement y", kind: "displacement" },
          { header: "Base displacement z", kind: "displacement" },
        ],
        base.rotors.flatMap((r) => r.cases.map((c) => [r.machine, r.rotor, c.case, c.unbalanceMode, ...c.groundForce, ...c.baseDisplacementPeak])),
      );
    }
  }
  w.table(
    "Intermediate values of the method (SI, as the engine reports them)",
    [{ header: "Name" }, { header: "Value [SI]", digits: 4 }],
    Object.entries(imp.details ?? {}).map(([k, v]) => [k, v]),
  );
}

function modes(w: SheetWriter, d: RevisionPackageData): void {
  const r = d.result;
  w.title("Natural frequencies and mode shapes of the rigid block (undamped)");
  w.blank();
  const share = (k: DofKey): Column => ({ header: `share ${k}`, kind: "ratio" });
  const shape = (k: DofKey): Column => ({ header: `shape ${k} [mass-normalised, ${translational(k) ? "m" : "rad"}/√kg]` });
  w.table(
    "Modes",
    [{ header: "Mode", kind: "count" }, { header: "Frequency", kind: "frequency" }, { header: "Dominant" }, ...DOF_KEYS.map(share), ...DOF_KEYS.map(shape)],
    r.modes.map((m, i) => [i + 1, m.frequencyHz, m.dominant, ...DOF_KEYS.map((k) => m.participation[k]), ...m.shape]),
  );
  if (r.modes.some((m) => m.baseShape)) {
    // springs on a base block: twelve modes; which block carries each, and the base's part of the shape (about B)
    w.table(
      "Modes of the block on its springs and the base block on the soil (shares of kinetic energy; the base's shape about the centre of its underside)",
      [{ header: "Mode", kind: "count" }, { header: "Frequency", kind: "frequency" }, { header: "Block" }, { header: "Block's share", kind: "ratio" }, ...DOF_KEYS.map((k) => ({ header: `base shape ${k} [mass-normalised, ${translational(k) ? "m" : "rad"}/√kg]` }))],
      r.modes.map((m, i) => [i + 1, m.frequencyHz, m.block === "base" ? "base block" : "block on springs", m.upperShare ?? 1, ...(m.baseShape ?? [])]),
    );
  }
  w.table(
    "Frequency ratios r = rated speed / natural frequency",
    [{ header: "Machine" }, { header: "Rotor" }, { header: "Rated speed", kind: "speed" }, ...r.modes.map((_, i) => ({ header: `r mode ${i + 1}`, kind: "ratio" as const }))],
    r.rotors.map((x) => [x.machine, x.rotor, x.speedRpm, ...x.frequencyRatios]),
  );
  w.table(
    "Operating ranges",
    [{ header: "Machine" }, { header: "Rotor" }, { header: "From", kind: "frequency" }, { header: "To", kind: "frequency" }, { header: "Rated", kind: "frequency" }],
    (r.sweep.operatingRangesHz ?? []).map((o) => [o.machine, o.rotor, o.fromHz, o.toHz, o.ratedHz]),
  );
  w.table(
    "Avoidance bands (natural frequency times 1 - s and 1 + s, s the separation criterion)",
    [{ header: "Mode", kind: "count" }, { header: "From", kind: "frequency" }, { header: "To", kind: "frequency" }],
    (r.sweep.avoidanceBandsHz ?? []).map((b) => [b.mode, b.fromHz, b.toHz]),
  );
  const cc = r.crossCheck;
  if (cc) {
    w.table(
      "Closed-form cross-check",
      [{ header: "Closed form" }, { header: "Closed-form frequency", kind: "frequency" }, { header: "Nearest mode", kind: "count" }, { header: "Nearest mode frequency", kind: "frequency" }],
      [
        ["vertical sqrt(k_z / m) / (2 pi)", cc.vertical.closedFormHz, cc.vertical.nearestMode, cc.vertical.nearestModeHz],
        ["torsion sqrt(k_rz / I_z) / (2 pi)", cc.torsion.closedFormHz, cc.torsion.nearestMode, cc.torsion.nearestModeHz],
        ["rocking-sliding x with ry, lower", cc.rockingSlidingXZ.low.closedFormHz, cc.rockingSlidingXZ.low.nearestMode, cc.rockingSlidingXZ.low.nearestModeHz],
        ["rocking-sliding x with ry, upper", cc.rockingSlidingXZ.high.closedFormHz, cc.rockingSlidingXZ.high.nearestMode, cc.rockingSlidingXZ.high.nearestModeHz],
        ["rocking-sliding y with rx, lower", cc.rockingSlidingYZ.low.closedFormHz, cc.rockingSlidingYZ.low.nearestMode, cc.rockingSlidingYZ.low.nearestModeHz],
        ["rocking-sliding y with rx, upper", cc.rockingSlidingYZ.high.closedFormHz, cc.rockingSlidingYZ.high.nearestMode, cc.rockingSlidingYZ.high.nearestModeHz],
      ],
    );
    w.note(cc.source);
  }
}

/** Columns and their width on the figures sheet: together about the width of a printed page. */
const FIGURE_COLUMNS = 10;
const FIGURE_COLUMN_CHARS = 11;
const FIGURE_WIDTH_PX = 740;
const ROW_PX = 20;

function figuresSheet(figs: PackageFigure[]) {
  return (w: SheetWriter, d: RevisionPackageData): void => {
    w.title(`Figures of revision ${d.revision.label}`);
    w.note("Rendered on the server from the stored result and input, in this workbook's units. The curves envelope every point and load case of each rotor; shaded: each rotor's operating range (blue) and the avoidance band around every natural frequency (red).");
    w.blank();
    w.endTitleBlock();
    w.reserveColumns(FIGURE_COLUMNS, FIGURE_COLUMN_CHARS - 2);
    for (const f of figs) {
      w.title(f.title);
      const id = w.ws.workbook.addImage({ buffer: f.png as unknown as ExcelJS.Buffer, extension: "png" });
      const height = Math.round((FIGURE_WIDTH_PX * f.height) / f.width);
      w.ws.addImage(id, { tl: { col: 0, row: w.row - 1 }, ext: { width: FIGURE_WIDTH_PX, height } });
      w.row += Math.ceil(height / ROW_PX) + 1;
    }
  };
}

function response(w: SheetWriter, d: RevisionPackageData): void {
  const r = d.result;
  const L: PackageKind = "length";
  w.title("Response at rated speed: harmonic steady state of the six-degree-of-freedom block");
  w.note("Peak amplitudes per axis; velocity = w x amplitude. Each rotor is analysed on its own first; rotors responding together follow at the end of this sheet.");
  w.blank();
  w.table(
    "Rotors",
    [{ header: "Machine" }, { header: "Rotor" }, { header: "Rated speed", kind: "speed" }, { header: "Range from", kind: "speed" }, { header: "Range to", kind: "speed" }, { header: "Force amplitude at rated speed", kind: "force" }],
    r.rotors.map((x) => [x.machine, x.rotor, x.speedRpm, x.speedRangeRpm?.[0] ?? x.speedRpm, x.speedRangeRpm?.[1] ?? x.speedRpm, x.forceAmplitude]),
  );
  const cases = r.rotors.flatMap((x) => x.cases.map((c) => ({ x, c })));
  w.table(
    "Load cases",
    [
      { header: "Machine" },
      { header: "Rotor" },
      { header: "Case" },
      { header: "Unbalance" },
      { header: "Soil reaction x", kind: "force" },
      { header: "Soil reaction y", kind: "force" },
      { header: "Soil reaction z", kind: "force" },
      { header: "Transmissibility", kind: "ratio" },
      { header: "Largest displacement over speed range", kind: "displacement" },
      { header: "at", kind: "speed" },
      { header: "at point" },
      { header: "Largest velocity over speed range", kind: "velocity" },
      { header: "at", kind: "speed" },
    ],
    cases.map(({ x, c }) => [
      x.machine,
      x.rotor,
      c.case,
      c.unbalanceMode,
      c.transmittedForce[0],
      c.transmittedForce[1],
      c.transmittedForce[2],
      c.transmissibility,
      c.maxOverSpeedRange.displacementPeak,
      c.maxOverSpeedRange.atRpm,
      c.maxOverSpeedRange.point ?? null,
      c.maxOverSpeedRange.velocityPeak ?? null,
      c.maxOverSpeedRange.velocityAtRpm ?? null,
    ]),
  );
  w.table(
    "Points: every bearing, then every check point",
    [
      { header: "Machine" },
      { header: "Rotor" },
      { header: "Case" },
      { header: "Unbalance" },
      { header: "Point" },
      { header: "x", kind: L },
      { header: "y", kind: L },
      { header: "z", kind: L },
      { header: "Displacement x", kind: "displacement" },
      { header: "Displacement y", kind: "displacement" },
      { header: "Displacement z", kind: "displacement" },
      { header: "Velocity x", kind: "velocity" },
      { header: "Velocity y", kind: "velocity" },
      { header: "Velocity z", kind: "velocity" },
      { header: "Largest displacement over speed range", kind: "displacement" },
      { header: "Largest velocity over speed range", kind: "velocity" },
    ],
    cases.flatMap(({ x, c }) =>
      c.points.map((p) => [
        x.machine,
        x.rotor,
        c.case,
        c.unbalanceMode,
        p.name,
        ...p.position,
        ...p.displacementPeak,
        ...p.velocityPeak,
        p.overSpeedRange?.displacementPeak ?? null,
        p.overSpeedRange?.velocityPeak ?? null,
      ]),
    ),
  );
  const combined = r.combined ?? [];
  if (!combined.length) return;
  w.note("Rotors responding together. Same speed: the responses superposed per point and axis at the worst relative unbalance phase (the sum of the amplitudes) and, beside it, all forces in phase. Different speeds: the absolute sum of the speed groups' peaks (upper bound, common practice). Largest component per point.");
  w.table(
    "Combinations",
    [{ header: "Combination" }, { header: "Rotors" }, { header: "Speed", kind: "speed" }, { header: "Rule" }],
    combined.map((g) => [g.id, g.group.join(" + "), g.speedRpm ?? null, g.ruleText]),
  );
  w.table(
    "Combined response: largest component at each point",
    [
      { header: "Combination" },
      { header: "Case" },
      { header: "Unbalance" },
      { header: "Point" },
      { header: "Displacement at rated speed", kind: "displacement" },
      { header: "Velocity at rated speed", kind: "velocity" },
      { header: "Displacement over speed range", kind: "displacement" },
      { header: "Velocity over speed range", kind: "velocity" },
      { header: "In phase: displacement over speed range", kind: "displacement" },
      { header: "In phase: velocity over speed range", kind: "velocity" },
    ],
    combined.flatMap((g) =>
      g.cases.flatMap((c) =>
        c.points.map((p) => [
          g.id,
          c.case,
          c.unbalanceMode,
          p.name,
          Math.max(...p.displacementPeak),
          Math.max(...p.velocityPeak),
          p.overSpeedRange.displacementPeak,
          p.overSpeedRange.velocityPeak,
          p.inPhase.overSpeedRange.displacementPeak,
          p.inPhase.overSpeedRange.velocityPeak,
        ]),
      ),
    ),
  );
}

function band(w: SheetWriter, d: RevisionPackageData): void {
  const b = d.result.bounds;
  w.title("Soil band: the same analysis at a lower and an upper shear modulus");
  if (!b) {
    w.note("This revision's result holds no soil band.");
    return;
  }
  w.note(b.source);
  w.blank();
  const n = Math.max(b.lower.frequenciesHz.length, b.upper.frequenciesHz.length);
  const modesCols: Column[] = Array.from({ length: n }, (_, i) => ({ header: `f mode ${i + 1}`, kind: "frequency" }));
  const nominal = d.result.modes.map((m) => m.frequencyHz);
  w.table(
    "Natural frequencies",
    [{ header: "Soil" }, { header: "Factor on G", kind: "ratio" }, { header: "Shear modulus G", kind: "modulus" }, ...modesCols],
    [
      ["lower", b.lower.factor, b.lower.shearModulus ?? null, ...b.lower.frequenciesHz],
      ["best estimate", 1, d.result.impedance.shearModulus ?? null, ...nominal],
      ["upper", b.upper.factor, b.upper.shearModulus ?? null, ...b.upper.frequenciesHz],
    ],
  );
  w.table(
    "Governing amplitudes (largest component over all rotors, cases and points)",
    [
      { header: "Soil" },
      { header: "Displacement at rated speed", kind: "displacement" },
      { header: "Velocity at rated speed", kind: "velocity" },
      { header: "Displacement over speed range", kind: "displacement" },
      { header: "Velocity over speed range", kind: "velocity" },
    ],
    (["lower", "upper"] as const).map((k) => [k, b[k].governing.displacementPeak, b[k].governing.velocityPeak, b[k].governing.displacementPeakOverSpeedRange, b[k].governing.velocityPeakOverSpeedRange]),
  );
  w.table(
    "Frequency ratios r = rated speed / natural frequency",
    [{ header: "Soil" }, { header: "Machine" }, { header: "Rotor" }, ...Array.from({ length: n }, (_, i) => ({ header: `r mode ${i + 1}`, kind: "ratio" as const }))],
    (["lower", "upper"] as const).flatMap((k) => b[k].frequencyRatios.map((fr) => [k, fr.machine, fr.rotor, ...fr.ratios])),
  );
}

/**
 * The sources of a list of checks, keyed S1, S2, ... in order of first use: the check rows
 * carry the key and one table quotes each source once (with the soil-band checks a source
 * repeated on every row made the sheet several pages longer).
 */
export function sourceKeys(checks: CheckResult[]): Map<string, string> {
  const keys = new Map<string, string>();
  for (const c of checks) if (!keys.has(c.source)) keys.set(c.source, `S${keys.size + 1}`);
  return keys;
}

/** A check's label in the package: the soil bound goes to its own column, so it is not repeated in the text. */
export function packageCheckLabel(c: CheckResult): string {
  return c.soilCase ? c.label.replace(/^At the (?:lower|upper) soil bound[^:]*: /, "") : c.label;
}

/** The soil column: "nominal", or the bound with its factor ("upper, G x 1.5"). */
export function packageSoilText(c: CheckResult): string {
  return c.soilCase ? soilCaseText(c).replace(" soil bound", ",").replace(/[()]/g, "") : "nominal";
}

function checkRows(checks: CheckResult[], keys: Map<string, string>): Cell[][] {
  return checks.map((c) => [
    packageCheckLabel(c),
    packageSoilText(c),
    c.machine ?? null,
    c.rotor ?? null,
    c.case ?? null,
    c.unbalanceMode ?? null,
    c.point ?? null,
    c.mode ?? null,
    c.value,
    c.limit,
    c.comparison === "min" ? "at least" : "at most",
    checkUtilisation(c),
    packageVerdict(c),
    c.acceptance?.justification ?? c.notApplicable?.reason ?? null,
    keys.get(c.source) ?? c.source,
  ]);
}

/** The verdict with an accepted band failure's justification, for tables without a Justification column. */
export function verdictWithJustification(c: CheckResult): string {
  if (c.notApplicable) return `${packageVerdict(c)}: ${c.notApplicable.reason}`;
  return c.acceptance ? `${packageVerdict(c)}: ${c.acceptance.justification}` : packageVerdict(c);
}

/** The verdict cell: a band failure accepted with a justification still reads as a failure. */
export function packageVerdict(c: CheckResult): string {
  const v = checkVerdict(c);
  if (v === "not-applicable") return `${CHECK_VERDICT_LABELS["not-applicable"]} (for information)`;
  return v === "pass" ? "pass" : v === "accepted" ? `FAIL, ${CHECK_VERDICT_LABELS.accepted}` : "FAIL";
}

/** The quantity a check's value and limit carry, from the unit the engine gives it. */
export function checkKind(c: CheckResult): PackageKind {
  if (c.unit === "m") return "displacement";
  if (c.unit === "m/s") return "velocity";
  return "ratio";
}

/** A check of rotors responding together (`displacement-combined`, `velocity-combined`, at nominal or a bound). */
export function isCombinedCheck(c: CheckResult): boolean {
  return c.combination !== undefined;
}

/**
 * The combined checks the package lists: per combination, soil case and quantity the largest
 * value, then every failing one not already listed (the page budget of the package would not
 * hold every point of every combination at three soil cases).
 */
export function packageCombinedChecks(checks: CheckResult[]): CheckResult[] {
  const largest = new Map<string, CheckResult>();
  for (const c of checks) {
    if (!isCombinedCheck(c)) continue;
    const k = `${c.id}|${c.combination}`;
    const have = largest.get(k);
    if (!have || c.value > have.value) largest.set(k, c);
  }
  const listed = new Set(largest.values());
  return [...listed, ...checks.filter((c) => isCombinedCheck(c) && !c.pass && !listed.has(c))];
}

function checks(w: SheetWriter, d: RevisionPackageData): void {
  const all = d.result.checks;
  const gov = governingCheck(d.result);
  w.title("Checks: value, limit, verdict and source");
  w.blank();
  w.pairs("Summary", [
    { label: "Checks", value: all.filter((c) => !c.notApplicable).length, kind: "count" },
    { label: "Checks not applicable to this support (for information)", value: all.filter((c) => c.notApplicable).length, kind: "count" },
    { label: "Failing", value: all.filter((c) => !c.pass).length, kind: "count" },
    { label: "Failing, accepted with justification", value: all.filter((c) => checkVerdict(c) === "accepted").length, kind: "count" },
    { label: "Governing check", value: gov?.label ?? "—", note: gov ? `uses ${(gov.utilisation * 100).toFixed(0)} % of its limit` : undefined },
  ]);
  const groups: { title: string; kind: PackageKind }[] = [
    { title: "Frequency separation and block rules", kind: "ratio" },
    { title: "Displacement at bearings and check points (enveloped over the speed range)", kind: "displacement" },
    { title: "Velocity at bearings and check points (enveloped over the speed range)", kind: "velocity" },
  ];
  const keys = sourceKeys(all);
  for (const g of groups) {
    const mine = all.filter((c) => checkKind(c) === g.kind && !isCombinedCheck(c));
    if (!mine.length) continue;
    w.table(
      g.title,
      [
        { header: "Check" },
        { header: "Soil" },
        { header: "Machine" },
        { header: "Rotor" },
        { header: "Case" },
        { header: "Unbalance" },
        { header: "Point" },
        { header: "Mode", kind: "count" },
        { header: "Value", kind: g.kind },
        { header: "Limit", kind: g.kind },
        { header: "Limit is" },
        { header: "Use of limit", kind: "ratio" },
        { header: "Verdict" },
        { header: "Justification" },
        { header: "Source" },
      ],
      checkRows(mine, keys),
    );
  }
  const combined = packageCombinedChecks(all);
  if (combined.length) {
    w.note(
      `Rotors responding together: of the ${all.filter(isCombinedCheck).length} combined displacement and velocity checks (every point and load case of each combination, at nominal soil and both bounds; all kept in the stored result) the two tables below list, for each combination, soil case and quantity, the largest, and every failing one.`,
    );
    for (const kind of ["displacement", "velocity"] as const) {
      const mine = combined.filter((c) => checkKind(c) === kind);
      if (!mine.length) continue;
      w.table(
        `Combined ${kind} of rotors responding together (enveloped over the speed range)`,
        [
          { header: "Soil" },
          { header: "Combination" },
          { header: "Case" },
          { header: "Unbalance" },
          { header: "Point" },
          { header: "Value", kind },
          { header: "Limit", kind },
          { header: "Use of limit", kind: "ratio" },
          { header: "Verdict" },
          { header: "Justification" },
          { header: "Source" },
        ],
        mine.map((c) => [
          packageSoilText(c),
          c.combination ?? null,
          c.case ?? null,
          c.unbalanceMode ?? null,
          c.point ?? null,
          c.value,
          c.limit,
          checkUtilisation(c),
          packageVerdict(c),
          c.acceptance?.justification ?? null,
          keys.get(c.source) ?? c.source,
        ]),
      );
    }
  }
  w.table(
    "Sources of the limits",
    [{ header: "Key" }, { header: "Reference" }],
    [...keys].map(([source, key]) => [key, source]),
  );
}

function history(w: SheetWriter, d: RevisionPackageData): void {
  w.title(`Revision history of ${d.foundation.tag}`);
  w.blank();
  w.table(
    "Revisions",
    [
      { header: "Revision" },
      { header: "Sequence", kind: "count" },
      { header: `Issued${UTC}` },
      { header: "Issued by" },
      { header: "Status" },
      { header: "Purpose" },
      { header: "Checked by" },
      { header: `Checked${UTC}` },
      { header: "Decision" },
      { header: "Decided by" },
      { header: `Decided${UTC}` },
      { header: "Note" },
      { header: "Open comments", kind: "count" },
      { header: "Input SHA-256" },
      { header: "Engine" },
      { header: "Revision note" },
    ],
    d.history.map((h) => [
      h.label,
      h.sequence,
      h.issuedAt,
      h.issuedByName,
      revisionStatusLabels[h.status],
      revisionPurposeLabels[h.purpose ?? "issued-for-check"],
      h.check ? `${h.check.checkedByName} (${h.check.checkedByRole})` : null,
      h.check?.checkedAt ?? null,
      h.decision?.outcome ?? "none yet",
      h.decision ? `${h.decision.decidedByName}${h.decision.decidedByRole ? ` (${h.decision.decidedByRole})` : ""}` : null,
      h.decision?.decidedAt ?? null,
      h.decision?.note || null,
      h.openComments,
      h.inputHash,
      h.engineVersion,
      h.note || null,
    ]),
  );
  w.pairs("Vendor data", [{ label: `Vendor submission used by revision ${d.revision.label}`, value: vendorSubmissionText(d) }]);
  const byId = new Map((d.comments ?? []).map((c) => [c.id, c]));
  w.table(
    `Review comments on revision ${d.revision.label} (oldest first)`,
    [{ header: "Comment" }, { header: "On" }, { header: "By" }, { header: `Date${UTC}` }, { header: "Resolution" }],
    (d.comments ?? []).map((c) => {
      const parent = c.parentId ? byId.get(c.parentId) : undefined;
      const resolution = parent
        ? `answer to ${parent.authorName}'s comment of ${parent.createdAt.toISOString().slice(0, 10)}`
        : c.resolved
          ? `resolved${c.resolvedByName ? ` by ${c.resolvedByName}` : ""}${c.resolvedAt ? ` on ${c.resolvedAt.toISOString().slice(0, 10)}` : ""}`
          : "open";
      return [c.body, c.fieldPath ?? "the whole revision", c.authorName, c.createdAt, resolution];
    }),
  );
  w.table(
    "Review trail (newest first)",
    [{ header: `When${UTC}` }, { header: "Event" }, { header: "By" }, { header: "Revision" }],
    d.trail.map((t) => [t.createdAt, t.action.replace(/^revision\./, ""), t.actorName ?? "—", t.label ?? "—"]),
  );
}

/** The workbook of one revision. */
export function buildRevisionWorkbook(d: RevisionPackageData, figures: PackageFigure[] = packageFigures(d)): ExcelJS.Workbook {
  const wb = new ExcelJS.Workbook();
  wb.creator = "Plinthwise";
  wb.created = d.generatedAt;
  wb.title = `${d.project.code} ${d.foundation.tag} revision ${d.revision.label}`;
  const sys = d.project.units;
  const labels = printLabels(d);
  const sheet = (name: string, write: (w: SheetWriter, d: RevisionPackageData) => void, onePage = false) => {
    const w = new SheetWriter(wb.addWorksheet(name), sys);
    write(w, d);
    w.finish();
    applyPrintSetup(w.ws, labels, { lastColumn: w.columnCount, lastRow: w.lastRow, titleRows: w.titleRows || 1, onePage });
  };
  sheet(PACKAGE_SHEETS.cover, cover, true);
  sheet(PACKAGE_SHEETS.inputs, inputs);
  sheet(PACKAGE_SHEETS.mass, mass);
  sheet(PACKAGE_SHEETS.springs, springs);
  sheet(PACKAGE_SHEETS.modes, modes);
  sheet(PACKAGE_SHEETS.figures, figuresSheet(figures));
  sheet(PACKAGE_SHEETS.response, response);
  // Only a revision with start-up or coast-down runs has this sheet (after the harmonic response it compares with).
  if (d.result.transient?.length) sheet(SPEED_RAMPS_SHEET, writeSpeedRampsSheet);
  sheet(PACKAGE_SHEETS.band, band);
  sheet(PACKAGE_SHEETS.checks, checks);
  sheet(PACKAGE_SHEETS.history, history);
  // Only a revision with site measurement records (commissioning) has this sheet.
  if (d.measurements?.length) sheet(MEASUREMENTS_SHEET, writeMeasurementsSheet);
  const hc = wb.addWorksheet(PACKAGE_SHEETS.handCheck);
  const hcArea = addHandCheckSheet(hc, d);
  applyPrintSetup(hc, labels, hcArea);
  return wb;
}

/** The same as an .xlsx file. */
export async function revisionWorkbookBytes(d: RevisionPackageData): Promise<Buffer> {
  return Buffer.from(await buildRevisionWorkbook(d).xlsx.writeBuffer());
}
