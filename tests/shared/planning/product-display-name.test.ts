import { describe, expect, it } from 'vitest';
import { productDisplayName } from '../../../shared/domain/planning/product-display-name';

// The expected names are the product's own naming rule (maker once, then model), written out by hand;
// the makers and models are the invented demo outlet's.
describe('productDisplayName', () => {
  it('writes the maker, then the model', () => {
    expect(productDisplayName({ maker: 'Ostrel Works', model: 'Holloway B50' })).toBe('Ostrel Works Holloway B50');
  });

  it('does not repeat a maker that already opens the model name', () => {
    expect(productDisplayName({ maker: 'Vesk', model: 'Vesk Halden B70' })).toBe('Vesk Halden B70');
    expect(productDisplayName({ maker: 'Tarnwell', model: 'tarnwell Wend B70' })).toBe('tarnwell Wend B70');
  });

  it('keeps a model that only begins with the same letters as the maker', () => {
    expect(productDisplayName({ maker: 'Vesk', model: 'Veskara B50' })).toBe('Vesk Veskara B50');
  });

  it('treats a maker followed by a hyphen as the maker written once', () => {
    expect(productDisplayName({ maker: 'Quillon', model: 'Quillon-Marlpit B50' })).toBe('Quillon-Marlpit B50');
  });

  it('tidies spaces and copes with a missing half', () => {
    expect(productDisplayName({ maker: ' Brightmoor ', model: 'Cinderline  B70' })).toBe('Brightmoor Cinderline B70');
    expect(productDisplayName({ maker: '', model: 'Lanthorn X90' })).toBe('Lanthorn X90');
    expect(productDisplayName({ maker: 'Brightmoor', model: '' })).toBe('Brightmoor');
  });
});
