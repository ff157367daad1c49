// Issue 13 on the desk: a layer over rock and borehole layers survive the form, the revision
// comparison names them, and the factor rows carry their sources.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, parseAnalysisInput, type AnalysisInputDocument } from "@/modules/calc";
import { draftFormSchema, formFromInput, toInputDocument } from "@/modules/desk/draft-form";
import { cutoffMarkers, dynamicCoefficientSource, soilFactorRows, stratumSummary } from "@/modules/desk/soil-factors";
import { diffDocuments } from "@/modules/revisions/diff";

const read = (name: string) => JSON.parse(readFileSync(path.join(process.cwd(), "examples", `${name}.json`), "utf8")) as AnalysisInputDocument;

function parsed(doc: unknown) {
  const p = parseAnalysisInput(doc);
  if (!p.ok) throw new Error(JSON.stringify(p.issues));
  return p.input;
}

describe("the design form keeps the ground below the base", () => {
  it("a stratum over rock and the simplified Gazetas option survive form -> document", () => {
    const base = read("gazetas-embedded");
    const doc = { ...base, soil: { ...base.soil, stratum: { thickness: 7.5, base: "rigid" as const } }, impedance: { method: "gazetas" as const, gazetasDynamic: "simplified" as const } };
    const input = parsed(doc);
    const form = formFromInput(input);
    expect(form.soil.profile).toBe("stratum");
    expect(form.impedance.gazetasDynamic).toBe("simplified");
    expect(parsed(toInputDocument(form))).toEqual(input);
  });

  it("the pais-kausel option survives form -> document, and the default charts stay implicit (no key written)", () => {
    const base = read("gazetas-embedded");
    const pk = parsed({ ...base, impedance: { method: "gazetas" as const, gazetasDynamic: "pais-kausel" as const } });
    const form = formFromInput(pk);
    expect(form.impedance.gazetasDynamic).toBe("pais-kausel");
    expect(parsed(toInputDocument(form))).toEqual(pk);
    const def = formFromInput(parsed({ ...base, impedance: { method: "gazetas" as const } }));
    expect(def.impedance.gazetasDynamic).toBe("published");
    expect((toInputDocument(def) as AnalysisInputDocument).impedance).toEqual({ method: "gazetas" });
  });

  it("the source of the dynamic coefficients is read from the result, also for results of older engines", () => {
    const base = read("gazetas-embedded");
    const imp = analyse(parsed(base)).impedance;
    expect(dynamicCoefficientSource(imp)?.option).toBe("published");
    expect(dynamicCoefficientSource(analyse(parsed({ ...base, impedance: { method: "gazetas", gazetasDynamic: "pais-kausel" } })).impedance)?.option).toBe("pais-kausel");
    // engines 1.1.0-1.4.0: publishedDynamicCoefficients = 1 without the chart flag meant the closed forms
    const { chartDynamicCoefficients: _drop, ...old } = imp.details!;
    expect(_drop).toBe(1);
    expect(dynamicCoefficientSource({ ...imp, details: old })?.option).toBe("pais-kausel");
    // engine 1.0.0: neither flag, k = 1 and c = 1
    const { publishedDynamicCoefficients: _p, ...oldest } = old;
    expect(_p).toBe(1);
    expect(dynamicCoefficientSource({ ...imp, details: oldest })?.option).toBe("simplified");
    expect(dynamicCoefficientSource(analyse(parsed({ ...base, impedance: { method: "equivalent-radius" } })).impedance)).toBeNull();
  });

  it("borehole layers (one given by G) survive form -> document; the top-level Vs is left out", () => {
    const base = read("gazetas-layer-over-rock");
    const layers = [...base.soil.layers!, { thickness: 1, shearModulus: 1.2e8, density: 2000 }];
    const input = parsed({ ...base, soil: { ...base.soil, layers } });
    const form = formFromInput(input);
    expect(form.soil.profile).toBe("layers");
    const doc = toInputDocument(form) as AnalysisInputDocument;
    expect(doc.soil.shearWaveVelocity).toBeUndefined();
    expect(doc.soil.layers?.[3]).toEqual({ thickness: 1, shearModulus: 1.2e8, density: 2000 });
    expect(parsed(doc)).toEqual(input);
  });

  it("the browser's check asks for the depth to rock when the layer is chosen", async () => {
    const form = formFromInput(parsed(read("gazetas-embedded")));
    const f = { ...form, soil: { ...form.soil, profile: "stratum" as const, stratumThickness: null } };
    await expect(draftFormSchema.validateAt("soil.stratumThickness", f)).rejects.toThrow(/depth to rock/);
    await expect(draftFormSchema.validateAt("soil.stratumThickness", { ...f, soil: { ...f.soil, stratumThickness: 6 } })).resolves.toBe(6);
  });
});

describe("the revision comparison and the factor rows", () => {
  it("the input diff names a changed depth to rock and a changed layer velocity", () => {
    const a = read("gazetas-layer-over-rock");
    const layers = a.soil.layers!.map((l, i) => (i === 1 ? { ...l, shearWaveVelocity: 170 } : l));
    const d = diffDocuments(a, { ...a, soil: { ...a.soil, layers } });
    expect(d.entries.some((e) => e.path === "soil.layers[1].shearWaveVelocity" && e.kind === "changed")).toBe(true);
    const s = read("gazetas-embedded");
    const d2 = diffDocuments({ ...s, soil: { ...s.soil, stratum: { thickness: 6, base: "rigid" } } }, { ...s, soil: { ...s.soil, stratum: { thickness: 9, base: "rigid" } } });
    expect(d2.entries.map((e) => e.path)).toContain("soil.stratum.thickness");
  });

  it("lists the embedment and stratum factors with their sources, and the two cutoffs for the plots", () => {
    const r = analyse(parsed(read("gazetas-layer-over-rock")));
    const rows = soilFactorRows(r.impedance);
    expect(rows.map((x) => x.label)).toEqual(["Embedment factor", "Stratum factor (layer over rock)"]);
    expect(rows[0]!.source).toMatch(/Gazetas \(1991\) Table 2/);
    expect(rows[1]!.source).toMatch(/Kausel \(1974\)/);
    expect(rows[1]!.values[2]).toBeCloseTo(r.impedance.details!.stratumFactorZ!, 12);
    const s = stratumSummary(r.impedance)!;
    expect(s.thickness).toBe(6);
    expect(s.profile!.shearWaveVelocity).toBeCloseTo(6 / (1.5 / 110 + 2.5 / 150 + 2 / 210), 8);
    expect(cutoffMarkers(r.impedance).map((m) => m.hz)).toEqual([s.cutoffShearHz, s.cutoffCompressionHz]);
    // a half-space input has neither
    const half = analyse(parsed(read("raw-water-pump-train")));
    expect(stratumSummary(half.impedance)).toBeNull();
    expect(cutoffMarkers(half.impedance)).toEqual([]);
  });
});
