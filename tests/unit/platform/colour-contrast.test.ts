// WCAG 2.2 contrast (success criterion 1.4.3, level AA: 4.5:1 for text) of the text and
// background pairs the desk uses, computed from the theme's own colours. Relative luminance
// and contrast ratio as defined in WCAG 2.2, "relative luminance" and "contrast ratio".
import { describe, expect, it } from "vitest";
import path from "node:path";
import { pathToFileURL } from "node:url";

type Shade = Record<string, string>;
// the theme file is plain JavaScript without types: imported by URL and typed here
const configUrl = pathToFileURL(path.resolve(import.meta.dirname, "../../../tailwind.config.js")).href;
const config = ((await import(/* @vite-ignore */ configUrl)) as { default: { theme: { extend: { colors: Record<string, Shade> } } } }).default;
const colours = config.theme.extend.colors;

function colour(name: string): string {
  if (name === "white") return "#ffffff";
  const [family = "", shade = ""] = name.split("-");
  const hex = colours[family]?.[shade];
  if (!hex) throw new Error(`no colour ${name} in tailwind.config.js`);
  return hex;
}

/** Relative luminance of an sRGB colour "#rrggbb". */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4)) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

export function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}

// [text, background]: the pairs written in app/ (class names) and app/globals.css
const TEXT_PAIRS: [string, string][] = [
  // body text and hints on the page, cards and table headers
  ...["basalt-400", "basalt-500", "basalt-600", "basalt-700", "basalt-800", "basalt-900", "brick-700", "ochre-700", "moss-700", "brick-500"].flatMap((t): [string, string][] =>
    ["white", "grout-50", "grout-100"].map((b): [string, string] => [t, b]),
  ),
  // tags and notices
  ["ochre-700", "ochre-100"],
  ["moss-700", "moss-100"],
  ["brick-700", "brick-100"],
  ["basalt-500", "ochre-100"],
  ["basalt-600", "moss-100"],
  // dark header and primary buttons
  ["white", "basalt-800"],
  ["white", "basalt-700"],
  ["grout-300", "basalt-800"],
  ["grout-200", "basalt-800"],
  ["ochre-300", "basalt-800"],
];

describe("colour contrast of the theme", () => {
  it("computes the WCAG ratio on known values", () => {
    expect(contrastRatio("#000000", "#ffffff")).toBeCloseTo(21, 10);
    expect(contrastRatio("#ffffff", "#ffffff")).toBe(1);
    // #767676 on white is the familiar lightest grey that passes AA: 4.54:1
    expect(contrastRatio("#767676", "#ffffff")).toBeCloseTo(4.54, 2);
  });

  it.each(TEXT_PAIRS)("%s text on %s reaches 4.5:1", (text, background) => {
    expect(contrastRatio(colour(text), colour(background))).toBeGreaterThanOrEqual(4.5);
  });
});
