// Page objects and helpers for the vendor data journey: the requests list, one request's
// page (download, drop a file, read the problems), and the designer's review.
import ExcelJS from "exceljs";
import { readFileSync } from "node:fs";
import type { Locator, Page } from "playwright-core";

const uuid = "[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}";
export const requestUrl = new RegExp(`^/projects/${uuid}/requests/(${uuid})$`);

export class RequestsPage {
  constructor(private readonly page: Page) {}
  async open(projectId: string): Promise<void> {
    await this.page.goto(`/projects/${projectId}/requests`);
  }
  /** Sends a request for the foundation's draft machines to the contact of `company`. */
  async send(foundationTag: string, company: string): Promise<string> {
    const form = this.page.getByTestId("send-request-form");
    await form.getByLabel("Foundation").selectOption({ label: foundationTag });
    const contact = form.getByLabel("Vendor contact");
    const label = await contact.locator("option", { hasText: `(${company})` }).first().textContent();
    await contact.selectOption({ label: label ?? "" });
    await form.getByLabel("Note to the vendor").fill("Browser journey: please confirm the certified figures.");
    await form.getByRole("button", { name: "Send data request" }).click();
    await this.page.waitForURL((u) => requestUrl.test(u.pathname), { timeout: 20_000 });
    return requestUrl.exec(new URL(this.page.url()).pathname)?.[1] ?? "";
  }
}

export class RequestPage {
  constructor(private readonly page: Page) {}
  async open(projectId: string, requestId: string): Promise<void> {
    await this.page.goto(`/projects/${projectId}/requests/${requestId}`);
  }
  /** Clicks the workbook download and returns its bytes. */
  async downloadWorkbook(): Promise<Buffer> {
    const [download] = await Promise.all([this.page.waitForEvent("download"), this.page.getByTestId("download-workbook").click()]);
    const file = await download.path();
    if (!file) throw new Error("the workbook download has no file");
    return readFileSync(file);
  }
  /** Gives the data drop zone a file, as dropping or choosing it would. */
  async uploadData(name: string, bytes: Buffer): Promise<void> {
    await this.page.getByLabel("Machine data file (.xlsx or .csv)").setInputFiles({ name, mimeType: "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet", buffer: bytes });
  }
  get problems(): Locator {
    return this.page.getByTestId("upload-problems");
  }
  get accepted(): Locator {
    return this.page.getByTestId("upload-accepted");
  }
  version(n: number): Locator {
    return this.page.getByTestId(`version-${n}`);
  }
}

/** Opens a workbook's bytes, lets `change` edit it, and returns the saved bytes. */
export async function editWorkbook(bytes: Buffer, change: (wb: ExcelJS.Workbook) => void): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ExcelJS.Buffer);
  change(wb);
  return Buffer.from(await wb.xlsx.writeBuffer());
}
