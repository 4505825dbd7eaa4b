import { describe, expect, it } from 'vitest';
import { signedIn, testApp, type Client } from '../support/test-app';
import {
  acceptedCell,
  addEntry,
  assignCells,
  createProduct,
  createRoundup,
  dayFromToday,
  matrixOf,
  moveCell,
  moveToBench,
  pricedProduct,
  roundupOnTheBench,
} from './support/planning-fixtures';

type Suggestion = { product: { id: number }; priceCheck: { fit: string; latestPrice: { amountMinor: number } | null } };

async function suggestedIds(editor: Client, roundupId: number) {
  const response = await editor.get(`/api/roundups/${roundupId}/suggestions`);
  expect(response.status, response.text).toBe(200);
  return (response.body.suggestions as Suggestion[]).map((s) => s.product.id);
}

describe('adding catalog products to a roundup', () => {
  it('suggests products whose latest price in the band’s region is inside the inclusive band, cheapest first', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    // Band 150.00–220.00 EUR in DE (createRoundup's default).
    const { roundupId, platform } = await createRoundup(editor);
    const recent = dayFromToday(-3);
    const priced = (...prices: Parameters<typeof pricedProduct>[2]) => pricedProduct(editor, platform, prices);
    const atMin = await priced({ amountMinor: 15000, observedOn: recent });
    const atMax = await priced({ amountMinor: 22000, observedOn: recent });
    await priced({ amountMinor: 14999, observedOn: recent }); // just below
    await priced({ amountMinor: 22001, observedOn: recent }); // just above
    // In the band in another region only.
    await priced({ region: 'AT', amountMinor: 18000, observedOn: recent });
    // Was in the band, but its latest DE price is above it: the latest price counts, history does not.
    await priced(
      { amountMinor: 19000, observedOn: dayFromToday(-30) },
      { amountMinor: 23900, observedOn: dayFromToday(-2) },
    );
    // Was above, latest is inside.
    const fellInside = await priced(
      { amountMinor: 25900, observedOn: dayFromToday(-30) },
      { amountMinor: 17900, observedOn: dayFromToday(-1) },
    );
    // Two prices on the same day: the later record wins.
    await priced({ amountMinor: 16000, observedOn: recent }, { amountMinor: 30000, observedOn: recent });
    // Inside by number, but priced in another currency: never converted, never in the band.
    await priced({ currency: 'USD', amountMinor: 18000, observedOn: recent });
    // Inside, but on another platform, or archived.
    await pricedProduct(editor, `${platform} other`, [{ amountMinor: 18000, observedOn: recent }]);
    const archived = await priced({ amountMinor: 18000, observedOn: recent });
    await editor.patch(`/api/catalog/products/${archived}`).send({ archived: true });

    // Inclusive bounds (first principles: min ≤ price ≤ max), ordered by price.
    expect(await suggestedIds(editor, roundupId)).toEqual([atMin, fellInside, atMax]);

    // Products already in the roundup are not suggested again.
    await addEntry(editor, roundupId, fellInside);
    expect(await suggestedIds(editor, roundupId)).toEqual([atMin, atMax]);
  });

  it('warns when an added product is outside the band, has no price there, or is priced in another currency', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, platform } = await createRoundup(editor);
    const yesterday = dayFromToday(-1);
    const priced = (price: Parameters<typeof pricedProduct>[2][number]) => pricedProduct(editor, platform, [price]);
    const above = await priced({ amountMinor: 24900, observedOn: yesterday });
    const unpriced = await priced({ region: 'GB', currency: 'GBP', amountMinor: 17900, observedOn: yesterday });
    const dollars = await priced({ currency: 'USD', amountMinor: 19900, observedOn: yesterday });
    const stale = await priced({ amountMinor: 19900, observedOn: dayFromToday(-200) });
    const fine = await priced({ amountMinor: 19900, observedOn: yesterday });

    const outside = await addEntry(editor, roundupId, above);
    expect(outside.warnings).toEqual([expect.stringMatching(/above the band €150\.00–€220\.00/)]);
    const none = await addEntry(editor, roundupId, unpriced);
    expect(none.warnings).toEqual([expect.stringMatching(/No price recorded in DE/)]);
    const converted = await addEntry(editor, roundupId, dollars);
    expect(converted.warnings).toEqual([
      expect.stringMatching(/in USD .* not converted, so it does not count as in the band/),
    ]);
    const old = await addEntry(editor, roundupId, stale);
    // A quarter-old price is no current price (common practice, no source: PRICE_STALE_AFTER_DAYS = 90).
    expect(old.warnings).toEqual([expect.stringMatching(/more than 90 days old, so there is no current price/)]);
    const ok = await addEntry(editor, roundupId, fine);
    expect(ok.warnings).toEqual([]);

    const detail = await editor.get(`/api/roundups/${roundupId}`);
    expect(detail.body.entries.map((e: { priceCheck: { fit: string } }) => e.priceCheck.fit)).toEqual([
      'above-band',
      'no-price',
      'other-currency',
      'in-band',
      'in-band',
    ]);
    expect(detail.body.entries[0].sample).toMatchObject({ status: 'ordered', source: null, overdue: false });
  });

  it('a product with accepted results in an earlier roundup can be a reference entry: shown, not re-tested', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const { agent: tester, user: testerUser } = await signedIn(app, 'tester');
    const earlier = await roundupOnTheBench(editor, { configurations: 1 });
    const [veteran] = earlier.productIds;
    const [cell] = earlier.matrix.rows[0].cells;
    await assignCells(editor, earlier.roundupId, { entryIds: earlier.entryIds }, testerUser.id, dayFromToday(7));
    await acceptedCell(editor, tester, earlier.roundupId, cell.id);

    const { roundupId, platform } = await createRoundup(editor, { platform: earlier.platform, configurations: 2 });
    const untested = await createProduct(editor, platform);
    const candidates = await editor.get(`/api/roundups/${roundupId}/reference-candidates`);
    // Candidates come from every earlier roundup (a reference may be last generation's pick), so look for ours.
    const candidateIds = candidates.body.candidates.map((c: { product: { id: number } }) => c.product.id);
    expect(candidateIds).toContain(veteran);
    expect(candidateIds).not.toContain(untested);
    expect(
      candidates.body.candidates.find((c: { product: { id: number } }) => c.product.id === veteran).testedIn,
    ).toEqual([expect.objectContaining({ roundupId: earlier.roundupId })]);

    const refused = await editor
      .post(`/api/roundups/${roundupId}/entries`)
      .send({ productId: untested, kind: 'reference' });
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('no_earlier_results');

    const reference = await addEntry(editor, roundupId, veteran, 'reference');
    expect(reference.entry).toMatchObject({
      kind: 'reference',
      referenceRoundup: { id: earlier.roundupId },
      sample: null,
    });
    // The band does not apply to a reference entry, so adding one raises no price warning.
    expect(reference.warnings).toEqual([]);
    await addEntry(editor, roundupId, untested);
    const matrix = await matrixOf(editor, roundupId);
    expect(matrix.rows.map((r) => [r.kind, r.cells.length])).toEqual([
      ['reference', 0],
      ['tested', 2],
    ]);
    expect(matrix.progress.cellCount).toBe(2);
  });

  it('adding the same product twice is a 409; removing an entry whose cells have work is refused', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const { agent: tester, user: testerUser } = await signedIn(app, 'tester');
    const { roundupId, platform } = await createRoundup(editor, { configurations: 1 });
    const product = await createProduct(editor, platform);
    const { entry } = await addEntry(editor, roundupId, product);
    const twice = await editor.post(`/api/roundups/${roundupId}/entries`).send({ productId: product });
    expect(twice.status).toBe(409);
    expect(twice.body.error.code).toBe('entry_exists');

    await moveToBench(editor, roundupId);
    await assignCells(editor, roundupId, { entryIds: [entry.id] }, testerUser.id, dayFromToday(3));
    const [cell] = (await matrixOf(editor, roundupId)).rows[0].cells;
    await moveCell(tester, roundupId, cell.id, 'start');
    const remove = await editor.delete(`/api/roundups/${roundupId}/entries/${entry.id}`);
    expect(remove.status).toBe(409);
    expect(remove.body.error.code).toBe('entry_has_work');
    expect(remove.body.error.message).toMatch(/running/);
  });
});
