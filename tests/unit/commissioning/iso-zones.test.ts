// ISO 10816-3 zone boundaries (Tables A.1 and A.2, r.m.s. velocity; the values are recalled
// from memory, as the module says) and the zone a reading falls in.
import { describe, expect, it } from "vitest";
import { ISO_10816_3_ZONES, ISO_ZONE_SOURCE, supportClassOf, zoneBoundaries, zoneFails, zoneOf } from "@/modules/commissioning/iso-zones";

describe("ISO 10816-3 zones", () => {
  it("holds the boundaries of both groups and both supports (mm/s r.m.s.), ordered A/B < B/C < C/D", () => {
    const mm = (b: { ab: number; bc: number; cd: number }) => [b.ab, b.bc, b.cd].map((v) => Math.round(v * 1e4) / 10);
    expect(mm(ISO_10816_3_ZONES[1].rigid)).toEqual([2.3, 4.5, 7.1]);
    expect(mm(ISO_10816_3_ZONES[1].flexible)).toEqual([3.5, 7.1, 11]);
    expect(mm(ISO_10816_3_ZONES[2].rigid)).toEqual([1.4, 2.8, 4.5]);
    expect(mm(ISO_10816_3_ZONES[2].flexible)).toEqual([2.3, 4.5, 7.1]);
    for (const g of [1, 2] as const) {
      // a flexible support never has lower boundaries than a rigid one, group 2 never higher than group 1
      expect(ISO_10816_3_ZONES[g].flexible.ab).toBeGreaterThan(ISO_10816_3_ZONES[g].rigid.ab);
      expect(ISO_10816_3_ZONES[2].rigid.cd).toBeLessThan(ISO_10816_3_ZONES[1].rigid.cd);
    }
    expect(ISO_ZONE_SOURCE).toMatch(/recalled from memory/);
  });

  it("places a value on a boundary in the better zone and above it in the next", () => {
    const b = zoneBoundaries(2, "rigid");
    expect(zoneOf(1.4e-3, b)).toBe("A");
    expect(zoneOf(1.41e-3, b)).toBe("B");
    expect(zoneOf(2.81e-3, b)).toBe("C");
    expect(zoneOf(4.6e-3, b)).toBe("D");
    expect(zoneFails("B")).toBe(false);
    expect(zoneFails("C")).toBe(true);
  });

  it("calls a support rigid at 25 % above the running frequency, flexible below, rigid (lower limits) when unknown", () => {
    expect(supportClassOf(37.5, 30)).toBe("rigid");
    expect(supportClassOf(37.4, 30)).toBe("flexible");
    expect(supportClassOf(null, 30)).toBe("rigid");
  });
});
