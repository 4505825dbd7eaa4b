import { describe, expect, it } from 'vitest';
import { detectLoadStartIndex } from '../../../shared/domain/analysis/load-onset';

describe('load start from package power', () => {
  it('finds the step from idle to load', () => {
    const power = Float64Array.from({ length: 100 }, (_, i) => (i < 30 ? 35 : 210));
    expect(detectLoadStartIndex(power)).toBe(30);
  });

  it('is the first sample when the log starts under load, or has no power column', () => {
    expect(detectLoadStartIndex(Float64Array.from({ length: 100 }, () => 200))).toBe(0);
    expect(detectLoadStartIndex(null)).toBe(0);
  });
});
