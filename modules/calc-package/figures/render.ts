// SVG to PNG on the server with resvg (@resvg/resvg-js, its prebuilt binary inside the npm
// package), with the app's own font and no system fonts, so a figure renders the same on
// every machine. This resvg-js takes fonts as files only, so the TrueType unpacked from the
// app's WOFF is written once to a private temporary folder.
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { Resvg } from "@resvg/resvg-js";
import { appFont, FONT_FAMILY } from "./fonts";

let fontFiles: string[] | undefined;

function fonts(): string[] {
  if (fontFiles) return fontFiles;
  const data = [appFont(400), appFont(600)];
  const dir = path.join(tmpdir(), `plinthwise-fonts-${createHash("sha256").update(Buffer.concat(data)).digest("hex").slice(0, 16)}`);
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  fontFiles = data.map((buf, i) => {
    const file = path.join(dir, `ibm-plex-sans-${i === 0 ? 400 : 600}.ttf`);
    if (!existsSync(file)) writeFileSync(file, buf);
    return file;
  });
  return fontFiles;
}

export function svgToPng(svg: string, widthPx: number): Buffer {
  const r = new Resvg(svg, {
    fitTo: { mode: "width", value: widthPx },
    background: "#ffffff",
    font: { fontFiles: fonts(), loadSystemFonts: false, defaultFontFamily: FONT_FAMILY, sansSerifFamily: FONT_FAMILY },
  });
  return Buffer.from(r.render().asPng());
}
