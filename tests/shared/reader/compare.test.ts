import { describe, expect, it } from 'vitest';
import { compareLikeForLike, type ComparableResult } from '../../../shared/domain/reader/compare';

const names = new Map([
  [1, 'Stock all-core'],
  [2, 'Fixed 5.0 GHz'],
]);

function result(overrides: Partial<ComparableResult>): ComparableResult {
  return {
    productId: 1,
    productName: 'Board A',
    roundupId: 10,
    roundupTitle: 'Spring boards',
    publishedAt: '2026-03-01T09:00:00.000Z',
    benchProfileId: 7,
    benchProfileName: 'Open bench A',
    configurationId: 1,
    status: 'measured',
    deltaOverAmbientC: 50,
    ...overrides,
  };
}

const boardA = { productId: 1, productName: 'Board A' };
const boardB = { productId: 2, productName: 'Board B' };
const boardC = { productId: 3, productName: 'Board C' };

describe('compare: like for like only', () => {
  it('when boards share the load configuration and test system, then all are compared', () => {
    const comparison = compareLikeForLike(
      [boardA, boardB],
      1,
      [result({}), result({ productId: 2, productName: 'Board B', deltaOverAmbientC: 44 })],
      names,
    );
    expect(comparison.rows.map((r) => r.productName)).toEqual(['Board A', 'Board B']);
    expect(comparison.excluded).toEqual([]);
    expect(comparison.problem).toBeNull();
    expect(comparison.benchProfileName).toBe('Open bench A');
  });

  it('when a board was tested only under another load, then it is left out and the reason names both loads', () => {
    const comparison = compareLikeForLike(
      [boardA, boardB],
      1,
      [result({}), result({ productId: 2, productName: 'Board B', configurationId: 2 })],
      names,
    );
    expect(comparison.rows).toHaveLength(1);
    expect(comparison.excluded).toEqual([
      {
        productId: 2,
        productName: 'Board B',
        reason: expect.stringMatching(/Not tested under Stock all-core; .* under Fixed 5\.0 GHz/),
      },
    ]);
    expect(comparison.problem).toMatch(/Fewer than two/);
  });

  it('when one board was measured on another test system, then it is left out rather than compared', () => {
    const comparison = compareLikeForLike(
      [boardA, boardB, boardC],
      1,
      [
        result({}),
        result({ productId: 2, productName: 'Board B' }),
        result({ productId: 3, productName: 'Board C', benchProfileId: 8, benchProfileName: 'Closed case B' }),
      ],
      names,
    );
    expect(comparison.rows.map((r) => r.productId)).toEqual([1, 2]);
    expect(comparison.excluded[0]).toMatchObject({
      productId: 3,
      reason: expect.stringMatching(/another test system \(Closed case B\)/),
    });
  });

  it('when a board has only a withheld result, then no figure is compared for it', () => {
    const comparison = compareLikeForLike(
      [boardA, boardB],
      1,
      [result({}), result({ productId: 2, productName: 'Board B', status: 'withheld', deltaOverAmbientC: null })],
      names,
    );
    expect(comparison.excluded[0].reason).toMatch(/quality checks/);
  });

  it('when a board has results from two roundups, then the newer one is compared', () => {
    const comparison = compareLikeForLike(
      [boardA, boardB],
      1,
      [
        result({ publishedAt: '2026-01-01T00:00:00.000Z', deltaOverAmbientC: 55, roundupId: 9 }),
        result({ publishedAt: '2026-04-01T00:00:00.000Z', deltaOverAmbientC: 48, roundupId: 11 }),
        result({ productId: 2, productName: 'Board B' }),
      ],
      names,
    );
    expect(comparison.rows[0]).toMatchObject({ productId: 1, roundupId: 11, deltaOverAmbientC: 48 });
  });

  it('asks for two boards when fewer are chosen', () => {
    expect(compareLikeForLike([boardA], 1, [result({})], names).problem).toBe('Choose at least two boards to compare.');
  });
});
