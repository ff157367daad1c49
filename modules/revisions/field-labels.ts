// Words for a field path of a revision (`soil.poissonRatio` -> "Soil · Poisson's ratio").
// Review comments keep the path (it is what the server checks against the revision), but
// people read and choose fields by these labels; nobody types a path.

type Segment = { kind: "name"; name: string } | { kind: "key"; key: string } | { kind: "index"; index: number };

/** Splits `machines["Motor"].rotors["rotor"].bearings[0][1]` into its names, keys and indexes. */
export function parseFieldPath(path: string): Segment[] | null {
  const out: Segment[] = [];
  const re = /\.?([A-Za-z_$][A-Za-z0-9_$]*)|\[(\d+)\]|\[("(?:[^"\\]|\\.)*")\]/gy;
  let at = 0;
  while (at < path.length) {
    re.lastIndex = at;
    const m = re.exec(path);
    if (!m) return null;
    if (m[1] !== undefined) out.push({ kind: "name", name: m[1] });
    else if (m[2] !== undefined) out.push({ kind: "index", index: Number(m[2]) });
    else if (m[3] !== undefined) {
      try {
        out.push({ kind: "key", key: String(JSON.parse(m[3])) });
      } catch {
        return null;
      }
    }
    at = re.lastIndex;
  }
  return out;
}

const sections: Record<string, string> = {
  schemaVersion: "Schema version",
  block: "Block",
  soil: "Soil",
  impedance: "Soil springs",
  machines: "Machine",
  checkPoints: "Check point",
  sweep: "Frequency sweep",
  transient: "Speed ramp",
  acceptances: "Accepted check",
  criteria: "Criteria",
  checks: "Check",
  modes: "Mode",
  rotors: "Response",
  massProperties: "Mass and block",
  crossCheck: "Hand-calculation cross-check",
  bounds: "Soil band",
  engineVersion: "Engine version",
  springs: "Springs",
};

// method "piles" (issue 16): the pile group's inputs under `impedance` read in the trade's words
const pileWords: Record<string, string> = {
  youngsModulus: "Young's modulus of the pile",
  pileDensity: "pile density",
  diameter: "pile diameter",
  length: "pile length",
  tip: "pile tip",
  soilProfile: "soil along the shaft",
  interaction: "pile-to-pile interaction",
  piles: "pile",
};

// springs on a base block (engine 1.8.0): the base's inputs under `impedance` and its results under `springs.base`
const baseWords: Record<string, string> = {
  base: "base block under the springs",
  support: "soil under the base",
};

const words: Record<string, string> = {
  groundForce: "force into the ground",
  baseDisplacementPeak: "base displacement",
  staticBearingPressure: "static bearing pressure",
  springHeight: "spring height",
  twoMassVerticalHz: "two-mass vertical frequency",
  rigidFloorHighestHz: "highest mode on a rigid floor",
  isolatorModesHighestHz: "highest mode of the block on its springs",
  soilStiffness: "soil stiffness",
  soilStaticStiffness: "soil static stiffness",
  soilDashpot: "soil dashpot",
  springForces: "spring force",
  staticLoads: "static load",
  upperShare: "block's share",
  baseShape: "base shape",
  poissonRatio: "Poisson's ratio",
  shearWaveVelocity: "shear-wave velocity",
  shearModulus: "shear modulus",
  materialDamping: "material damping",
  allowableBearingPressure: "allowable bearing pressure",
  embedmentDepth: "embedment depth",
  sidewallContactHeight: "sidewall contact height",
  concreteDensity: "concrete density",
  solids: "solid",
  cg: "centre of gravity",
  speedRpm: "speed",
  speedRangeRpm: "speed range",
  balanceGrade: "balance grade",
  serviceFactor: "service factor",
  axis: "shaft axis",
  unbalanceMode: "unbalance mode",
  bearings: "bearing",
  rotors: "rotor",
  fromHz: "from",
  toHz: "to",
  frequencyHz: "frequency",
  displacementPeak: "peak displacement",
  velocityPeak: "peak velocity",
  overSpeedRange: "over the speed range",
  maxOverSpeedRange: "largest over the speed range",
  transmittedForce: "transmitted force",
  frequencyRatios: "frequency ratio",
  inertiaAtCg: "inertia at the centre of gravity",
  massMatrix: "mass matrix",
  layers: "layer",
  stratum: "stratum",
  justification: "justification",
  checkKey: "check",
  startUpSeconds: "start-up time",
  coastDownSeconds: "coast-down time",
};

const singular: Record<string, string> = { cases: "case", points: "point", frequencyRatios: "frequency ratios" };

const checkWords: Record<string, string> = {
  "frequency-separation": "frequency separation",
  displacement: "displacement",
  velocity: "velocity",
  "mass-ratio": "mass ratio",
  eccentricity: "eccentricity",
  "bearing-pressure": "bearing pressure",
  "isolator-frequency-ratio": "isolator frequency ratio",
  "spring-compression": "spring in compression (no lift-off)",
  "spring-compression-combined": "spring in compression (no lift-off), rotors together",
};

const soilCaseWords: Record<string, string> = { "soil-lower": "at the lower soil bound", "soil-upper": "at the upper soil bound" };

/** camelCase -> "camel case", for names the table above does not know. */
function spaced(name: string): string {
  return name.replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase();
}

const nameWords = (name: string) => words[name] ?? spaced(name);

/** Words for a check key (`frequency-separation@soil-upper/Motor RWM-101/rotor/mode-1`). */
export function checkKeyLabel(key: string): string {
  const [head = "", ...rest] = key.split("/");
  const [id = "", soilCase] = head.split("@");
  const what = [checkWords[id] ?? id.replace(/-/g, " "), soilCase ? (soilCaseWords[soilCase] ?? soilCase) : ""].filter(Boolean).join(" ");
  if (!rest.length) return what;
  const parts = rest.map((r) => (/^mode-\d+$/.test(r) ? r.replace("-", " ") : r));
  // Rotor checks name machine and rotor together ("Motor RWM-101 rotor"), then the mode or case.
  const rotorCheck = id === "frequency-separation" || id === "displacement" || id === "velocity";
  if (rotorCheck && parts.length >= 2) {
    const [machine, rotor, ...more] = parts;
    if (id !== "frequency-separation" && more.length === 3) {
      const [loadCase, mode, point] = more;
      return `${what}, ${machine} ${rotor}, ${loadCase} ${mode} unbalance, at ${point}`;
    }
    return [what, `${machine} ${rotor}`, ...more].join(", ");
  }
  return [what, ...parts].join(", ");
}

/** Coordinates of a point-like value, by index. */
const xyz = ["x", "y", "z"];
const vectors = new Set(["cg", "position", "displacementPeak", "velocityPeak", "transmittedForce", "groundForce", "baseDisplacementPeak"]);

/**
 * The human label of a field path of a revision's input or result, e.g.
 * `soil.poissonRatio` -> "Soil · Poisson's ratio",
 * `checks["frequency-separation@soil-upper/Motor RWM-101/rotor/mode-1"].value` ->
 * "Check · frequency separation at the upper soil bound, Motor RWM-101 rotor, mode 1".
 * A path it cannot read is returned as it is (never an error: the label is for reading).
 */
export function fieldLabel(path: string): string {
  const segs = parseFieldPath(path);
  const first = segs?.[0];
  if (!segs || !first || first.kind !== "name") return path;
  const parts: string[] = [sections[first.name] ?? spaced(first.name)];
  const add = (text: string) => {
    parts[parts.length - 1] = `${parts[parts.length - 1]} ${text}`;
  };
  for (let i = 1; i < segs.length; i++) {
    const s = segs[i]!;
    const before = segs[i - 1]!;
    const beforeName = before.kind === "name" ? before.name : undefined;
    if (s.kind === "key") {
      if (beforeName === "checks") parts[parts.length - 1] = `${parts[parts.length - 1]} · ${checkKeyLabel(s.key)}`;
      else add(s.key);
    } else if (s.kind === "index") {
      const twoBack = segs[i - 2];
      if (beforeName === "x" || beforeName === "y" || beforeName === "z") add(s.index === 0 ? "from" : "to");
      else if ((beforeName && vectors.has(beforeName)) || (before.kind === "index" && twoBack?.kind === "name" && twoBack.name === "bearings")) add(xyz[s.index] ?? String(s.index + 1));
      else add(String(s.index + 1));
    } else {
      // A check row's value is the check itself; its other fields are named after it.
      const isCheckValue = before.kind === "key" && segs[i - 2]?.kind === "name" && (segs[i - 2] as { name: string }).name === "checks" && s.name === "value";
      // A list keyed by name reads in the singular ("point coupling"); `sweep.points` is a count.
      const keyed = segs[i + 1]?.kind === "key";
      const pileWord = first.name === "impedance" ? (pileWords[s.name] ?? baseWords[s.name]) : first.name === "springs" && s.name === "base" ? "base block" : undefined;
      if (!isCheckValue) parts.push(pileWord ?? (keyed ? (singular[s.name] ?? nameWords(s.name)) : nameWords(s.name)));
    }
  }
  return parts.join(" · ");
}
