import { describe, expect, it } from 'vitest';
import { contrastRatio, relativeLuminance } from '../../../shared/domain/editorial/contrast';
import {
  darkChartPalette,
  informationColours,
  lightChartPalette,
  textColours,
} from '../../../shared/domain/editorial/chart-palette';

describe('WCAG 2.x contrast', () => {
  it.each([
    // REFERENCES.md, "Web", WCAG 2.x contrast: #000 on #FFF is 21:1, #949494 on #FFF about 3.03:1.
    ['#000000', '#FFFFFF', 21, 6],
    ['#FFF', '#000', 21, 6],
    ['#949494', '#FFFFFF', 3.03, 2],
    // DESIGN.md, "Palette": ink 14.7:1, copper 5.2:1, slate 4.1:1, red 6.2:1 on #FAF8F3 (rounded to one decimal).
    ['#1B2433', '#FAF8F3', 14.7, 1],
    ['#A4521F', '#FAF8F3', 5.2, 1],
    ['#6B7A8F', '#FAF8F3', 4.1, 1],
    ['#B42318', '#FAF8F3', 6.2, 1],
  ])(
    '%s on %s is %d:1, as the definition’s check values and the design notes’ measured ratios say',
    (ink, paper, ratio, digits) => {
      expect(contrastRatio(ink, paper)).toBeCloseTo(ratio, digits);
    },
  );

  it('gives black and white the luminance 0 and 1', () => {
    // Luminance of black and white is 0 and 1 by the definition's formula.
    expect(relativeLuminance('#000')).toBe(0);
    expect(relativeLuminance('#ffffff')).toBeCloseTo(1, 10);
  });
});

describe('chart palettes', () => {
  for (const [name, palette] of [
    ['light', lightChartPalette],
    ['dark', darkChartPalette],
  ] as const) {
    it(`${name}: every bar, whisker and label colour is at least 3:1 against the background`, () => {
      for (const token of informationColours) {
        expect(contrastRatio(palette[token], palette.background), token).toBeGreaterThanOrEqual(3);
      }
    });

    it(`${name}: text colours are at least 4.5:1 (WCAG AA, normal text)`, () => {
      for (const token of textColours) {
        expect(contrastRatio(palette[token], palette.background), token).toBeGreaterThanOrEqual(4.5);
      }
    });

    it(`${name}: the roundup's products and the references are told apart by more than hue`, () => {
      // Not a WCAG rule: the two roles differ in lightness so they stay apart in grey print (Benchwire's own check).
      expect(contrastRatio(palette.roundup, palette.reference)).toBeGreaterThan(1.05);
    });
  }
});
