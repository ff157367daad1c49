// The package's figures: pure SVG generators and their rasterisation for the workbook and the PDF.
import type { RevisionPackageData } from "../types";
import { blockDrawingSvg } from "./block-drawing";
import { frequencyResponseSvg } from "./frequency-response";
import { svgToPng } from "./render";

export { blockDrawingSvg } from "./block-drawing";
export { frequencyResponseSvg, rotorEnvelopes, type ResponseQuantity } from "./frequency-response";
export { svgToPng } from "./render";
export { woffToSfnt, appFont, FONT_FAMILY } from "./fonts";

export interface PackageFigure {
  title: string;
  svg: string;
  png: Buffer;
  /** Size of the SVG; the PNG is rendered at 1.5 times it (about 140 dpi across a printed page). */
  width: number;
  height: number;
}

function sizeOf(svg: string): { width: number; height: number } {
  const m = /width="(\d+)" height="(\d+)"/.exec(svg);
  return { width: Number(m?.[1] ?? 900), height: Number(m?.[2] ?? 400) };
}

/** The figures of one revision, in the order the package prints them. */
export function packageFigures(d: RevisionPackageData): PackageFigure[] {
  const sys = d.project.units;
  const list: { title: string; svg: string }[] = [
    { title: "Frequency response: displacement, with operating ranges and avoidance bands", svg: frequencyResponseSvg(d.result, "displacement", sys) },
    { title: "Frequency response: velocity, with operating ranges and avoidance bands", svg: frequencyResponseSvg(d.result, "velocity", sys) },
    { title: "Plan and elevation of the block", svg: blockDrawingSvg(d.input, d.result.massProperties, sys) },
  ];
  return list.map((f) => {
    const size = sizeOf(f.svg);
    return { ...f, png: svgToPng(f.svg, Math.round(size.width * 1.5)), width: size.width, height: size.height };
  });
}
