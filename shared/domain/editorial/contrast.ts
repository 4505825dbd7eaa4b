// WCAG 2.x relative luminance and contrast ratio (REFERENCES.md, "Web": WCAG 2.x contrast definitions).

function channel(value: number): number {
  const c = value / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** The colour's channels from #RGB or #RRGGBB. */
export function parseHexColour(hex: string): [number, number, number] {
  const match = /^#([0-9a-f]{3}|[0-9a-f]{6})$/i.exec(hex.trim());
  if (!match) throw new Error(`Not a hex colour: ${hex}`);
  const digits =
    match[1].length === 3
      ? match[1]
          .split('')
          .map((d) => d + d)
          .join('')
      : match[1];
  return [0, 2, 4].map((i) => parseInt(digits.slice(i, i + 2), 16)) as [number, number, number];
}

/** Relative luminance L = 0.2126 R + 0.7152 G + 0.0722 B of the linearised channels. */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = parseHexColour(hex).map(channel);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** (L_light + 0.05) / (L_dark + 0.05), from 1 to 21. */
export function contrastRatio(a: string, b: string): number {
  const [light, dark] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x);
  return (light + 0.05) / (dark + 0.05);
}
