// Text labels along the frequency axis of a plot (operating speeds, natural frequencies):
// labels at practically the same place are merged into one, and the others are staggered
// over a few rows so no two print over each other. Pure, in pixels of the plot area.

export interface AxisLabel {
  /** Position along the axis (px). */
  x: number;
  text: string;
}

export interface PlacedLabel {
  x: number;
  /** The merged text ("M-1 motor · P-1 pump"). */
  text: string;
  /** 0 for the first row, 1 the next ... */
  row: number;
  /** How many labels were merged into this one. */
  merged: number;
}

export interface LabelLayout {
  /** Labels closer than this are one label (px). */
  mergeWithinPx: number;
  /** Width of one character at the label's font size (px); an estimate is enough. */
  charWidthPx: number;
  /** Free space kept between two labels on one row (px). */
  gapPx: number;
  /** Rows available; beyond them a label takes the row where it overlaps least. */
  maxRows: number;
}

export const DEFAULT_LABEL_LAYOUT: LabelLayout = { mergeWithinPx: 4, charWidthPx: 5, gapPx: 4, maxRows: 3 };

export function labelWidth(text: string, layout: LabelLayout): number {
  return text.length * layout.charWidthPx;
}

/**
 * Merges labels within `mergeWithinPx` of the first of their group (identical texts once),
 * then places each, left to right, on the lowest row where it clears the previous label by
 * `gapPx`.
 */
export function placeAxisLabels(labels: readonly AxisLabel[], layout: LabelLayout = DEFAULT_LABEL_LAYOUT): PlacedLabel[] {
  const sorted = [...labels.filter((l) => Number.isFinite(l.x))].sort((a, b) => a.x - b.x);
  const groups: { x: number; texts: string[]; merged: number }[] = [];
  for (const l of sorted) {
    const last = groups.at(-1);
    if (last && l.x - last.x <= layout.mergeWithinPx) {
      if (!last.texts.includes(l.text)) last.texts.push(l.text);
      last.merged += 1;
    } else {
      groups.push({ x: l.x, texts: [l.text], merged: 1 });
    }
  }
  const rowEnds: number[] = [];
  return groups.map((g) => {
    const text = g.texts.join(" · ");
    const width = labelWidth(text, layout);
    let row = rowEnds.findIndex((end) => end + layout.gapPx <= g.x);
    if (row === -1) {
      if (rowEnds.length < layout.maxRows) row = rowEnds.length;
      else row = rowEnds.indexOf(Math.min(...rowEnds));
    }
    rowEnds[row] = g.x + width;
    return { x: g.x, text, row, merged: g.merged };
  });
}

/** Whether two placed labels on one row overlap (for checks and tests). */
export function labelsOverlap(a: PlacedLabel, b: PlacedLabel, layout: LabelLayout = DEFAULT_LABEL_LAYOUT): boolean {
  if (a.row !== b.row) return false;
  const [l, r] = a.x <= b.x ? [a, b] : [b, a];
  return l.x + labelWidth(l.text, layout) > r.x;
}
