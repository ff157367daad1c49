import { describe, expect, it } from "vitest";
import { sharedBrowser, asDemo } from "./support/fixtures";
import { projectIdOf } from "./support/desk";
import { foundationIdByTag } from "./support/revisions";
import { downloadByTestId } from "./support/package";

const browser = sharedBrowser();
let packageUrl = "";

describe("calculation package", () => {
  it("the manager downloads the register from the project page and a revision's package from its page", async () => {
    await asDemo(browser(), "manager", async ({ page }) => {
      const projectId = projectIdOf(page.url());
      const register = await downloadByTestId(page, "register-download");
      expect(register.fileName).toMatch(/^WRP-PH1_register_\d{4}-\d{2}-\d{2}\.xlsx$/);
      expect(register.workbook.worksheets.map((w) => w.name)).toContain("Register");
      expect(JSON.stringify(register.workbook.getWorksheet("Register")?.getSheetValues())).toContain("PH1-P101");

      const foundationId = await foundationIdByTag(page.request, projectId, "PH1-P101");
      const list = (await (await page.request.get(`/api/v1/projects/${projectId}/foundations/${foundationId}/revisions`)).json()) as { revisions: { id: string; label: string }[] };
      const latest = list.revisions.at(-1);
      if (!latest) throw new Error("PH1-P101 has no revision");
      packageUrl = `/api/v1/projects/${projectId}/foundations/${foundationId}/revisions/${latest.id}/package`;
      await page.goto(`/projects/${projectId}/foundations/${foundationId}/revisions/${latest.id}`);
      const pkg = await downloadByTestId(page, "package-download");
      expect(pkg.fileName).toBe(`WRP-PH1_PH1-P101_rev-${latest.label}.xlsx`);
      expect(pkg.workbook.worksheets.map((w) => w.name)).toEqual(["Cover", "Inputs", "Mass", "Soil springs", "Modes", "Figures", "Response", "Soil band", "Checks", "Revision trail", "Hand check"]);
      expect(JSON.stringify(pkg.workbook.getWorksheet("Cover")?.getSheetValues())).toContain(`revision ${latest.label}`);
      // The PDF rendition beside it.
      const pdfHref = await page.getByTestId("package-pdf-download").getAttribute("href");
      expect(pdfHref).toBe(`${packageUrl}/pdf`);
      const pdf = await page.request.get(pdfHref ?? "");
      expect(pdf.status()).toBe(200);
      expect(pdf.headers()["content-type"]).toBe("application/pdf");
      expect((await pdf.body()).subarray(0, 5).toString("latin1")).toBe("%PDF-");
    });
  });

  it("the viewer has no register link and the register is refused; the vendor is refused the package", async () => {
    expect(packageUrl).not.toBe("");
    await asDemo(browser(), "viewer", async ({ page }) => {
      const projectId = projectIdOf(page.url());
      await page.getByRole("heading", { level: 1 }).waitFor({ state: "visible" });
      expect(await page.getByTestId("register-download").count()).toBe(0);
      expect((await page.request.get(`/api/v1/projects/${projectId}/register`)).status()).toBe(403);
      // The client downloads approved packages only (or one a manager shared): demo B is in
      // check unless an earlier journey approved it.
      const listUrl = packageUrl.replace(/\/[0-9a-f-]{36}\/package$/, "");
      const list = (await (await page.request.get(listUrl)).json()) as { revisions: { id: string; decision: { outcome: string } | null; sharedWithClient: unknown }[] };
      const latest = list.revisions.at(-1);
      const released = latest?.decision?.outcome === "approved" || Boolean(latest?.sharedWithClient);
      expect((await page.request.get(packageUrl)).status()).toBe(released ? 200 : 403);
    });
    await asDemo(browser(), "vendor", async ({ page }) => {
      expect((await page.request.get(packageUrl)).status()).toBe(403);
    });
  });
});
