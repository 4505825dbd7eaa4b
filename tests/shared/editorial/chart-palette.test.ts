import { describe, expect, it } from 'vitest';
import { contrastRatio, relativeLuminance } from '../../../shared/domain/editorial/contrast';
import {
  darkChartPalette,
  informationColours,
  lightChartPalette,
  textColours,
} from '../../../shared/domain/editorial/chart-palette';

describe('WCAG 2.x contrast', () => {
  it('matches the check values of the definition', () => {
    // REFERENCES.md, "Web", WCAG 2.x contrast: #000 on #FFF is 21:1, #949494 on #FFF about 3.03:1.
    expect(contrastRatio('#000000', '#FFFFFF')).toBeCloseTo(21, 6);
    expect(contrastRatio('#FFF', '#000')).toBeCloseTo(21, 6);
    expect(contrastRatio('#949494', '#FFFFFF')).toBeCloseTo(3.03, 2);
    // Luminance of black and white is 0 and 1 by the definition's formula.
    expect(relativeLuminance('#000')).toBe(0);
    expect(relativeLuminance('#ffffff')).toBeCloseTo(1, 10);
  });

  it('agrees with the design notes’ measured ratios on paper', () => {
    // DESIGN.md, "Palette": ink 14.7:1, copper 5.2:1, slate 4.1:1, red 6.2:1 on #FAF8F3 (rounded to one decimal).
    expect(contrastRatio('#1B2433', '#FAF8F3')).toBeCloseTo(14.7, 1);
    expect(contrastRatio('#A4521F', '#FAF8F3')).toBeCloseTo(5.2, 1);
    expect(contrastRatio('#6B7A8F', '#FAF8F3')).toBeCloseTo(4.1, 1);
    expect(contrastRatio('#B42318', '#FAF8F3')).toBeCloseTo(6.2, 1);
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
