// Drawings are parsed, not just sniffed: a file that only begins with "%PDF" is refused.
import { describe, expect, it } from "vitest";
import { checkDrawingUpload } from "@/modules/vendor-data";
import { onePagePdf } from "../../support/pdf-fixture";

describe("drawing uploads", () => {
  it("accepts a readable one-page PDF", async () => {
    expect(await checkDrawingUpload(onePagePdf())).toEqual({ ok: true, contentType: "application/pdf" });
  });

  it("refuses a file that merely begins with %PDF", async () => {
    const r = await checkDrawingUpload(Buffer.from("%PDF-1.7\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n"));
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.reason).toBe("wrong_type");
      expect(r.message).toMatch(/not a readable PDF/);
    }
  });

  it("refuses a truncated PDF and a PDF header followed by other bytes", async () => {
    const whole = onePagePdf();
    for (const bytes of [whole.subarray(0, 60), Buffer.concat([Buffer.from("%PDF-1.5\n"), Buffer.alloc(2000, 0x41)])]) {
      const r = await checkDrawingUpload(bytes);
      expect(r.ok).toBe(false);
    }
  });

  it("still refuses what is not a PDF at all", async () => {
    const r = await checkDrawingUpload(Buffer.from("GIF89a......"));
    expect(r).toMatchObject({ ok: false, reason: "wrong_type" });
  });
});
