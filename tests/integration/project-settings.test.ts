// Project settings: units, default criteria, soil band and revision scheme, kept by managers.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { updateProjectSettingsAction } from "@/app/(desk)/actions";
import { closeDb } from "@/db/client";
import { getProjectForMember } from "@/db/queries/projects";
import { callAction, callRoute, getFixture, type Fixture } from "./support/fixture";

let fx: Fixture;
beforeAll(async () => {
  fx = await getFixture();
});
afterAll(async () => {
  // Leave the demo project as seeded for the suites after this one.
  await callRoute("v1/projects/[projectId]", "PATCH", { projectId: fx.projectId }, { cookie: fx.cookies.manager, body: { units: "si", revisionScheme: "letters", paperSize: "a4", criteriaDefaults: {}, soilBand: {} } });
  await closeDb();
});

describe("project settings", () => {
  it("a manager's form stores SI values (micrometres and mm/s converted)", async () => {
    const { state } = await callAction(
      updateProjectSettingsAction,
      { projectId: fx.projectId, units: "us", revisionScheme: "numbers", maxDisplacementPeakUm: "40", maxVelocityPeakMmS: "2.5", frequencySeparation: "0.25", soilBandLower: "0.5", soilBandUpper: "2" },
      fx.cookies.manager,
    );
    expect(state.ok).toBe(true);
    const p = await getProjectForMember({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId);
    expect(p?.units).toBe("us");
    expect(p?.revisionScheme).toBe("numbers");
    expect(p?.criteriaDefaults.maxDisplacementPeak).toBeCloseTo(40e-6, 12);
    expect(p?.criteriaDefaults.maxVelocityPeak).toBeCloseTo(2.5e-3, 12);
    expect(p?.criteriaDefaults.frequencySeparation).toBe(0.25);
    expect(p?.soilBand).toEqual({ lowerFactor: 0.5, upperFactor: 2 });
  });

  it("a bad value is refused with the field named, and nothing changes", async () => {
    const before = await getProjectForMember({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId);
    const { state } = await callAction(updateProjectSettingsAction, { projectId: fx.projectId, units: "si", revisionScheme: "letters", frequencySeparation: "1.5" }, fx.cookies.manager);
    expect(state.ok).toBe(false);
    if (!state.ok) expect(state.fieldErrors?.frequencySeparation?.[0]).toMatch(/\(0, 1\)/);
    const after = await getProjectForMember({ userId: fx.userIds.manager, isAdmin: false }, fx.projectId);
    expect(after?.criteriaDefaults).toEqual(before?.criteriaDefaults);
    expect(after?.units).toBe(before?.units);
  });

  it("PATCH keeps omitted parts and names bad fields by path", async () => {
    const ok = await callRoute("v1/projects/[projectId]", "PATCH", { projectId: fx.projectId }, { cookie: fx.cookies.manager, body: { units: "si" } });
    expect(ok.status).toBe(200);
    const body = (await ok.json()) as { project: { units: string; revisionScheme: string } };
    expect(body.project.units).toBe("si");
    expect(body.project.revisionScheme).toBe("numbers");
    const bad = await callRoute("v1/projects/[projectId]", "PATCH", { projectId: fx.projectId }, { cookie: fx.cookies.manager, body: { criteriaDefaults: { frequencySeparation: 3 } } });
    expect(bad.status).toBe(400);
    const err = (await bad.json()) as { error: { issues: { path: string }[] } };
    expect(err.error.issues.map((i) => i.path)).toContain("criteriaDefaults.frequencySeparation");
  });

  it("the package's paper: A4 by default, Letter through the form or PATCH, a bad size refused by field, kept when omitted", async () => {
    const me = { userId: fx.userIds.manager, isAdmin: false };
    expect((await getProjectForMember(me, fx.projectId))?.paperSize).toBe("a4");
    const { state } = await callAction(updateProjectSettingsAction, { projectId: fx.projectId, units: "si", revisionScheme: "letters", paperSize: "letter" }, fx.cookies.manager);
    expect(state.ok).toBe(true);
    expect((await getProjectForMember(me, fx.projectId))?.paperSize).toBe("letter");
    // A form without the field keeps it.
    expect((await callAction(updateProjectSettingsAction, { projectId: fx.projectId, units: "si", revisionScheme: "letters" }, fx.cookies.manager)).state.ok).toBe(true);
    expect((await getProjectForMember(me, fx.projectId))?.paperSize).toBe("letter");
    const badForm = await callAction(updateProjectSettingsAction, { projectId: fx.projectId, units: "si", revisionScheme: "letters", paperSize: "a3" }, fx.cookies.manager);
    expect(badForm.state.ok).toBe(false);
    if (!badForm.state.ok) expect(badForm.state.fieldErrors?.paperSize?.[0]).toBe("Pick A4 or Letter");
    const bad = await callRoute("v1/projects/[projectId]", "PATCH", { projectId: fx.projectId }, { cookie: fx.cookies.manager, body: { paperSize: "a3" } });
    expect(bad.status).toBe(400);
    expect(((await bad.json()) as { error: { issues: { path: string }[] } }).error.issues.map((i) => i.path)).toContain("paperSize");
    const ok = await callRoute("v1/projects/[projectId]", "PATCH", { projectId: fx.projectId }, { cookie: fx.cookies.manager, body: { paperSize: "a4" } });
    expect(((await ok.json()) as { project: { paperSize: string } }).project.paperSize).toBe("a4");
  });

  it("a designer may not change settings", async () => {
    const r = await callRoute("v1/projects/[projectId]", "PATCH", { projectId: fx.projectId }, { cookie: fx.cookies.designer, body: { units: "us" } });
    expect(r.status).toBe(403);
  });
});

describe("display units per person", () => {
  it("saving a preference is kept on the account, and other people are unaffected", async () => {
    const { setUnitsPreferenceAction } = await import("@/app/(desk)/actions");
    const { getPublicUser } = await import("@/db/queries/accounts");
    const checkerBefore = (await getPublicUser(fx.userIds.checker))?.unitsPreference;
    const r = await callAction(setUnitsPreferenceAction, { units: "us" }, fx.cookies.designer);
    expect(r.state.ok).toBe(true);
    expect((await getPublicUser(fx.userIds.designer))?.unitsPreference).toBe("us");
    expect((await getPublicUser(fx.userIds.checker))?.unitsPreference).toBe(checkerBefore);
    expect(checkerBefore).not.toBe("us");
    const bad = await callAction(setUnitsPreferenceAction, { units: "imperial" }, fx.cookies.designer);
    expect(bad.state.ok).toBe(false);
    if (!bad.state.ok) expect(bad.state.fieldErrors?.units?.[0]).toMatch(/SI or US/);
    await callAction(setUnitsPreferenceAction, { units: "si" }, fx.cookies.designer);
  });
});
