import { readFile } from "node:fs/promises";
import ExcelJS from "exceljs";
import type { Page } from "playwright-core";

// Page helpers for the calculation-package downloads: click a download link, wait for
// the browser's download event, and open the saved file with exceljs.
export interface Downloaded {
  fileName: string;
  workbook: ExcelJS.Workbook;
}

export async function downloadByTestId(page: Page, testId: string): Promise<Downloaded> {
  const link = page.getByTestId(testId);
  await link.waitFor({ state: "visible" });
  const [download] = await Promise.all([page.waitForEvent("download", { timeout: 30_000 }), link.click()]);
  const failure = await download.failure();
  if (failure) throw new Error(`download failed: ${failure}`);
  const filePath = await download.path();
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load((await readFile(filePath)) as unknown as ArrayBuffer);
  return { fileName: download.suggestedFilename(), workbook };
}
