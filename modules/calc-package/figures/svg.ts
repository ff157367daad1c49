// Small helpers for the figures' SVG text.
export function esc(text: string): string {
  return text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
}

/** A coordinate with two decimals (SVG user units). */
export const n2 = (v: number) => (Math.round(v * 100) / 100).toString();

export function svgDocument(width: number, height: number, body: string, title: string): string {
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="IBM Plex Sans" role="img"><title>${esc(title)}</title><rect width="${width}" height="${height}" fill="#ffffff"/>${body}</svg>`;
}
