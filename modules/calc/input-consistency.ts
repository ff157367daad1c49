// Physical consistency rules that a field-by-field schema cannot express. Each problem is
// reported with the JSON path of the field to fix.
import type { AnalysisInput, SpringBaseInput, TransientRequest } from "./schema";
import { resolveTransientSpeeds } from "./transient-settings";
import { loadCasesFor } from "./unbalance";
import { resolveSweep } from "./sweep-grid";
import { springCouplingIssues } from "./impedance-springs";
import { LEVEL_TOLERANCE_M, boxVolume, contactArea, intersectionVolume, type Box } from "./geometry";
import { PILE_MIN_SPACING_DIAMETERS, pilesStiffnessSign } from "./impedance-piles";
import { SOIL_BAND_DEFAULTS } from "./criteria-defaults";
import { soilProperties } from "./soil";
import { activeLength } from "./pile-single";

export type PathPart = string | number;
export type AddIssue = (path: PathPart[], message: string) => void;

/** Relative volume tolerance for overlaps and containment. */
const VOLUME_TOLERANCE = 1e-9;

function checkBlock(input: AnalysisInput, add: AddIssue): void {
  const solids = input.block.solids.map((s, index) => ({ box: s as Box, index, isVoid: s.void }));
  const full = solids.filter((s) => !s.isVoid);
  const voids = solids.filter((s) => s.isVoid);
  const scale = Math.max(...solids.map((s) => boxVolume(s.box)));
  const tol = VOLUME_TOLERANCE * scale;
  if (full.length === 0) {
    add(["block", "solids"], "the block needs at least one solid that is not a void");
    return;
  }
  for (const group of [full, voids]) {
    for (let i = 0; i < group.length; i++) {
      for (let j = i + 1; j < group.length; j++) {
        const a = group[i];
        const b = group[j];
        if (a && b && intersectionVolume(a.box, b.box) > tol) {
          add(
            ["block", "solids", b.index],
            a.isVoid
              ? `void overlaps void solids[${a.index}]: its volume would be subtracted twice`
              : `solid overlaps solids[${a.index}]: its concrete would be counted twice`,
          );
        }
      }
    }
  }
  for (const v of voids) {
    const inside = full.reduce((sum, s) => sum + intersectionVolume(v.box, s.box), 0);
    if (inside < boxVolume(v.box) - tol) {
      add(["block", "solids", v.index], "void cuts outside the solids of the block");
    }
  }
  const net =
    full.reduce((sum, s) => sum + boxVolume(s.box), 0) - voids.reduce((sum, s) => sum + boxVolume(s.box), 0);
  if (!(net > tol)) {
    add(["block", "solids"], "the voids leave no (or negative) concrete mass");
    return;
  }
  const base = contactArea(
    full.map((s) => s.box),
    voids.map((s) => s.box),
  );
  if (base === null) add(["block", "solids"], "the base has no contact area with the soil");
}

/**
 * Limits of the piles method (issue 16): vertical piles only (no rake in the input); the heads
 * under the cap; centre-to-centre spacing at least 2 d; a flexible pile (L at least the active
 * length of Gazetas 1991), else the closed forms do not apply (a short rigid pile is refused);
 * the soil along the shaft is uniform or linear, so a stratum or borehole layers are refused.
 */
function checkPiles(input: AnalysisInput, add: AddIssue): void {
  const imp = input.impedance;
  if (imp.method !== "piles") return;
  const soil = input.soil;
  if (soil.stratum !== undefined) add(["soil", "stratum"], 'the "piles" method takes the soil along the shaft as uniform or linearly increasing: leave soil.stratum out');
  if (soil.layers !== undefined) add(["soil", "layers"], 'the "piles" method takes the soil along the shaft as uniform or linearly increasing: leave soil.layers out');
  const base = contactArea(
    input.block.solids.filter((s) => !s.void),
    input.block.solids.filter((s) => s.void),
  );
  const d = imp.diameter;
  imp.piles.forEach((p, i) => {
    if (base) {
      const { x, y } = base.bounds;
      if (p.x < x[0] - 1e-9 || p.x > x[1] + 1e-9 || p.y < y[0] - 1e-9 || p.y > y[1] + 1e-9) {
        add(["impedance", "piles", i], `the pile head (${p.x}, ${p.y}) lies outside the underside of the cap (x ${x[0]} to ${x[1]} m, y ${y[0]} to ${y[1]} m)`);
      }
    }
    for (let j = 0; j < i; j++) {
      const q = imp.piles[j];
      if (!q) continue;
      const s = Math.hypot(p.x - q.x, p.y - q.y);
      if (s < PILE_MIN_SPACING_DIAMETERS * d) {
        add(["impedance", "piles", i], `pile ${i + 1} is ${s.toFixed(3)} m from pile ${j + 1}, closer than ${PILE_MIN_SPACING_DIAMETERS} diameters (${(PILE_MIN_SPACING_DIAMETERS * d).toFixed(3)} m): the interaction factors do not apply`);
      }
    }
  });
  const G = soil.shearModulus ?? soil.density * (soil.shearWaveVelocity ?? 0) ** 2;
  if (G > 0) {
    const es = 2 * G * (1 + soil.poissonRatio);
    const la = activeLength(d, imp.youngsModulus / es, imp.soilProfile ?? "uniform");
    if (imp.length < la) {
      add(
        ["impedance", "length"],
        `the pile (${imp.length} m) is shorter than its active length La = ${la.toFixed(2)} m (Gazetas 1991): a short rigid pile is outside the flexible-pile closed forms this method uses`,
      );
      return;
    }
  }
  // The modes use K at the first rotor's rated speed, at nominal G and at the soil band's
  // factors: a negative direction of the group's dynamic stiffness there (superposition near a
  // group resonance of the interaction waves) has no natural frequency, and a mode at 0 Hz would
  // pass the separation check; refused.
  const rotor = input.machines.flatMap((m) => m.rotors)[0];
  if (!base || !rotor || !(G > 0) || soil.stratum !== undefined || soil.layers !== undefined) return;
  const omega = (rotor.speedRpm * 2 * Math.PI) / 60;
  const factors = [1, input.soilBand?.lowerFactor ?? SOIL_BAND_DEFAULTS.lowerFactor, input.soilBand?.upperFactor ?? SOIL_BAND_DEFAULTS.upperFactor];
  for (const factor of factors) {
    if (!(factor > 0)) continue;
    const props = soilProperties(soil, factor);
    if (pilesStiffnessSign(imp, props, base.centroid, omega) < -1e-9) {
      add(
        ["impedance", "piles"],
        `at the rated speed of rotor "${rotor.name}" (${rotor.speedRpm} rpm)${factor === 1 ? "" : ` and ${factor.toPrecision(3)} G (soil band)`} the group's dynamic stiffness from the interaction factors has a negative direction (the piles' waves arrive out of phase): its modes there are not natural frequencies and this method does not analyse it; change the spacing or the number of piles`,
      );
      return;
    }
  }
}

function checkSoil(input: AnalysisInput, add: AddIssue): void {
  const soil = input.soil;
  const hasG = soil.shearModulus !== undefined;
  const hasVs = soil.shearWaveVelocity !== undefined;
  if (soil.layers !== undefined) {
    // A layered profile gives the stiffness itself (soil-stratum.ts).
    if (hasG) add(["soil", "shearModulus"], "leave out shearModulus when soil.layers give the profile");
    if (hasVs) add(["soil", "shearWaveVelocity"], "leave out shearWaveVelocity when soil.layers give the profile");
    soil.layers.forEach((layer, i) => {
      if ((layer.shearModulus === undefined) === (layer.shearWaveVelocity === undefined)) {
        add(["soil", "layers", i], "give exactly one of shearModulus and shearWaveVelocity");
      }
    });
    const total = soil.layers.reduce((sum, l) => sum + l.thickness, 0);
    if (soil.stratum !== undefined && Math.abs(soil.stratum.thickness - total) > 1e-3) {
      add(["soil", "stratum", "thickness"], `must equal the sum of the layer thicknesses (${total} m), or be left out`);
    }
  } else if (hasG === hasVs) {
    add(["soil"], "give exactly one of shearModulus and shearWaveVelocity");
  }
  const depthToRock = soil.stratum?.thickness ?? soil.layers?.reduce((sum, l) => sum + l.thickness, 0);
  if (depthToRock !== undefined && soil.embedmentDepth >= depthToRock) {
    add(["soil", "embedmentDepth"], "the base must lie above the rigid base of the stratum");
  }
  if (input.impedance.method === "springs") {
    // The engine's impedance is diagonal at O: refuse a layout whose coupling terms do not vanish.
    const base = contactArea(
      input.block.solids.filter((s) => !s.void),
      input.block.solids.filter((s) => s.void),
    );
    if (base) {
      for (const issue of springCouplingIssues(input.impedance.springs, [base.centroid[0], base.centroid[1]])) {
        add(
          ["impedance", "springs"],
          `the springs must be laid out symmetrically about the centroid of the base (O): ${issue}; a layout whose stiffness centre is off O couples the modes, which this method does not model`,
        );
      }
    }
  }
  if (input.impedance.method === "springs" && input.impedance.base) checkSpringBase(input, input.impedance.base, add);
  if (input.impedance.method === "piles") checkPiles(input, add);
  if (input.impedance.method === "user" && soil.materialDamping === 0) {
    for (const [key, ratio] of Object.entries(input.impedance.dampingRatio)) {
      if (ratio === 0) {
        add(
          ["impedance", "dampingRatio", key],
          "must be greater than 0 when soil.materialDamping is 0: an undamped degree of freedom has an infinite resonant response",
        );
      }
    }
  }
  if (soil.sidewallContactHeight > soil.embedmentDepth) {
    add(["soil", "sidewallContactHeight"], "sidewall contact height cannot exceed the embedment depth");
  }
}

/**
 * Springs on a base block (two-stage.ts): the springs stand between the block's underside and
 * the base's top face, each spring on the base, and the soil touches only the base.
 */
function checkSpringBase(input: AnalysisInput, base: SpringBaseInput, add: AddIssue): void {
  if (input.impedance.method !== "springs") return;
  const solids = input.block.solids.filter((s) => !s.void);
  const underside = Math.min(...solids.map((s) => s.z[0]));
  if (base.z[1] > underside + LEVEL_TOLERANCE_M) {
    add(["impedance", "base", "z"], `the base's top (${base.z[1]} m) must be at or below the block's underside (${underside} m): the springs stand between them`);
  }
  input.impedance.springs.forEach((s, i) => {
    if (s.x < base.x[0] || s.x > base.x[1] || s.y < base.y[0] || s.y > base.y[1]) {
      add(["impedance", "springs", i], `spring ${i + 1} at (${s.x}, ${s.y}) does not stand on the base block (x ${base.x[0]} to ${base.x[1]}, y ${base.y[0]} to ${base.y[1]})`);
    }
  });
  const thickness = base.z[1] - base.z[0];
  if (input.soil.embedmentDepth > thickness + LEVEL_TOLERANCE_M) {
    add(["soil", "embedmentDepth"], `under springs on a base block the embedment is the base's: at most its thickness (${Number(thickness.toPrecision(6))} m); the soil may not touch the springs or the block`);
  }
}

function checkMachines(input: AnalysisInput, add: AddIssue): void {
  const names = new Set<string>();
  input.machines.forEach((machine, mi) => {
    if (names.has(machine.name)) add(["machines", mi, "name"], `machine name "${machine.name}" is used twice`);
    names.add(machine.name);
    const rotorNames = new Set<string>();
    let rotorMass = 0;
    machine.rotors.forEach((rotor, ri) => {
      const path = ["machines", mi, "rotors", ri];
      if (rotorNames.has(rotor.name)) add([...path, "name"], `rotor name "${rotor.name}" is used twice on this machine`);
      rotorNames.add(rotor.name);
      rotorMass += rotor.mass;
      const hasG = rotor.balanceGrade !== undefined;
      const hasF = rotor.unbalanceForce !== undefined;
      if (hasG === hasF) add(path, "give exactly one of balanceGrade and unbalanceForce");
      const range = rotor.speedRangeRpm;
      if (range && (rotor.speedRpm < range[0] || rotor.speedRpm > range[1])) {
        add([...path, "speedRangeRpm"], "the rated speed speedRpm must lie inside speedRangeRpm");
      }
      if (rotor.unbalanceMode !== "static") {
        const axisIndex = rotor.axis === "x" ? 0 : rotor.axis === "y" ? 1 : 2;
        const along = rotor.bearings.map((b) => b[axisIndex]);
        if (rotor.bearings.length < 2 || Math.max(...along) - Math.min(...along) <= 1e-6) {
          add(
            [...path, "bearings"],
            "couple unbalance needs two bearings at different positions along the shaft axis",
          );
        }
      }
    });
    if (rotorMass > machine.mass) {
      add(["machines", mi, "rotors"], "the rotor masses exceed the machine mass (a rotor is part of its machine)");
    }
  });
}

function checkSweep(input: AnalysisInput, add: AddIssue): void {
  if (!input.sweep) return;
  const { fromHz, toHz } = resolveSweep(input);
  if (!(toHz > fromHz)) {
    add(["sweep", input.sweep.toHz === undefined ? "fromHz" : "toHz"], `toHz (${toHz} Hz) must be greater than fromHz (${fromHz} Hz)`);
  }
}

/**
 * A start-up or coast-down request against the input: the machine and rotor must exist, the
 * speeds must run in the direction of `kind`, and an unbalance mode must be one the rotor has.
 * `path` is the request's own path (e.g. ["transient", 0]).
 */
export function checkTransientRequest(input: AnalysisInput, request: TransientRequest, path: PathPart[], add: AddIssue): void {
  const machine = input.machines.find((m) => m.name === request.machine);
  if (!machine) {
    add([...path, "machine"], `no machine is named "${request.machine}"`);
    return;
  }
  const rotor = machine.rotors.find((r) => r.name === request.rotor);
  if (!rotor) {
    add([...path, "rotor"], `machine "${machine.name}" has no rotor named "${request.rotor}"`);
    return;
  }
  const { fromRpm, toRpm } = resolveTransientSpeeds(request, rotor.speedRpm);
  const at = [...path, request.toRpm !== undefined ? "toRpm" : "fromRpm"];
  if (request.kind === "run-up" && !(toRpm > fromRpm)) {
    add(at, `a run-up needs toRpm (${toRpm} rpm) greater than fromRpm (${fromRpm} rpm)`);
  }
  if (request.kind === "coast-down" && !(fromRpm > toRpm)) {
    add(at, `a coast-down needs fromRpm (${fromRpm} rpm) greater than toRpm (${toRpm} rpm)`);
  }
  const cases = loadCasesFor(rotor.axis);
  if (!cases.includes(request.case)) {
    add([...path, "case"], `a ${rotor.axis === "z" ? "vertical" : "horizontal"} shaft has the load cases ${cases.map((c) => `"${c}"`).join(", ")}`);
  }
  if (request.unbalanceMode !== undefined && rotor.unbalanceMode !== "both" && request.unbalanceMode !== rotor.unbalanceMode) {
    add(
      [...path, "unbalanceMode"],
      `the rotor's unbalanceMode is "${rotor.unbalanceMode}"; a run can use only that one (or either when the rotor has "both")`,
    );
  }
}

function checkTransient(input: AnalysisInput, add: AddIssue): void {
  input.transient?.forEach((request, i) => checkTransientRequest(input, request, ["transient", i], add));
}

export function checkInputConsistency(input: AnalysisInput, add: AddIssue): void {
  checkBlock(input, add);
  checkSoil(input, add);
  checkMachines(input, add);
  checkSweep(input, add);
  checkTransient(input, add);
}
