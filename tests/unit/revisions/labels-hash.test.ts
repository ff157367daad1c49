import { describe, expect, it } from "vitest";
import { canonicalInputHash, canonicalJson, isApprovalStale, letterLabel, nextRevisionLabel, revisionStatus } from "@/modules/revisions";

describe("revision labels", () => {
  it("counts letters A … Z, then AA, AB", () => {
    expect([0, 1, 25, 26, 27, 51, 52, 701, 702].map(letterLabel)).toEqual(["A", "B", "Z", "AA", "AB", "AZ", "BA", "ZZ", "AAA"]);
    expect(() => letterLabel(-1)).toThrow(RangeError);
  });

  it("gives each scheme its own count, so switching to numbers starts at 0", () => {
    expect(nextRevisionLabel("letters", [])).toBe("A");
    expect(nextRevisionLabel("letters", ["A", "B"])).toBe("C");
    expect(nextRevisionLabel("numbers", ["A", "B"])).toBe("0");
    expect(nextRevisionLabel("numbers", ["A", "B", "0", "1"])).toBe("2");
    expect(nextRevisionLabel("letters", ["A", "0"])).toBe("B");
  });
});

describe("canonical input hash", () => {
  it("does not depend on key order, at any depth", () => {
    const a = { soil: { density: 1900, poissonRatio: 0.3 }, block: { solids: [{ name: "mat", x: [0, 1] }] } };
    const b = { block: { solids: [{ x: [0, 1], name: "mat" }] }, soil: { poissonRatio: 0.3, density: 1900 } };
    expect(canonicalJson(b)).toBe('{"block":{"solids":[{"name":"mat","x":[0,1]}]},"soil":{"density":1900,"poissonRatio":0.3}}');
    expect(canonicalInputHash(a)).toBe(canonicalInputHash(b));
    expect(canonicalInputHash(a)).toMatch(/^[0-9a-f]{64}$/);
  });

  it("changes with any value and with array order", () => {
    const a = { x: [1, 2] };
    expect(canonicalInputHash(a)).not.toBe(canonicalInputHash({ x: [2, 1] }));
    expect(canonicalInputHash(a)).not.toBe(canonicalInputHash({ x: [1, 2.0000001] }));
    expect(canonicalInputHash({ a: 1, b: undefined })).toBe(canonicalInputHash({ a: 1 }));
  });
});

describe("revision status", () => {
  it("is derived from the decision and from a later revision", () => {
    expect(revisionStatus(null, false)).toBe("in-check");
    expect(revisionStatus("returned", false)).toBe("returned");
    expect(revisionStatus("approved", false)).toBe("approved");
    expect(revisionStatus("approved", true)).toBe("superseded");
    // Two-step sign-off: a check without a decision is "checked"; a decision or a later revision wins.
    expect(revisionStatus(null, false, { checked: true })).toBe("checked");
    expect(revisionStatus("approved", false, { checked: true })).toBe("approved");
    expect(revisionStatus("returned", false, { checked: true })).toBe("returned");
    expect(revisionStatus(null, true, { checked: true })).toBe("superseded");
  });

  it("keeps an approved revision approved while a later one is only in check or returned", () => {
    expect(revisionStatus("approved", true, { hasLaterApproval: false })).toBe("approved");
    expect(revisionStatus("approved", true, { hasLaterApproval: true })).toBe("superseded");
    expect(revisionStatus("returned", true, { hasLaterApproval: false })).toBe("superseded");
    expect(revisionStatus(null, true, { hasLaterApproval: false })).toBe("superseded");
  });

  it("flags an approval whose vendor submission has since been replaced in the draft", () => {
    expect(isApprovalStale({ status: "approved", vendorSubmissionId: "s1" }, "s2")).toBe(true);
    expect(isApprovalStale({ status: "approved", vendorSubmissionId: "s1" }, "s1")).toBe(false);
    expect(isApprovalStale({ status: "approved", vendorSubmissionId: null }, null)).toBe(false);
    expect(isApprovalStale({ status: "in-check", vendorSubmissionId: "s1" }, "s2")).toBe(false);
  });
});
