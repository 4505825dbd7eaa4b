import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { buildPublishedRoundup } from '../../../server/public-site/published-roundup';
import { renderRoundupPage } from '../../../server/public-site/render-roundup-page';
import { testApp, testDataSource } from '../support/test-app';
import { expectValidHtml } from './support/html-check';
import { publishedFixture, publishForReaders } from './support/published-fixture';

const site = {
  baseUrl: 'https://results.test',
  outletName: 'The Soak Sheet',
  assets: { stylesheet: null, script: null },
};

describe('published roundup model and results page', () => {
  it('when a roundup is live, then its model carries runs of record with their figures, markers and prices at publication', async () => {
    const fixture = await publishedFixture(
      [
        [{ peakC: 62.0 }, { peakC: 97.5, throttled: true }],
        [
          { peakC: 71.5, ambientC: 22.0 },
          { peakC: 84.0, withheld: true },
        ],
      ],
      {
        prices: [
          [
            { amountMinor: 18999, observedOn: '2026-01-10' },
            // Observed after publication: not the price at publication.
            { amountMinor: 15999, observedOn: '2026-03-01' },
          ],
          [],
        ],
      },
    );
    const ds = await testDataSource();
    const model = await buildPublishedRoundup(ds.manager, fixture.roundupId, {
      publishedAt: new Date('2026-02-01T09:00:00Z'),
      labels: [{ entryId: fixture.products[0].entryId, label: 'Bench pick' }],
    });
    expect(model.products.map((p) => p.model)).toEqual(fixture.products.map((p) => p.model));
    expect(model.products[0].priceAtPublication).toEqual({
      amountMinor: 18999,
      currency: 'EUR',
      observedOn: '2026-01-10',
    });
    expect(model.products[1].priceAtPublication).toBeNull();
    expect(model.products[0].sample?.sourceLabel).toBe('Retail purchase');
    expect(model.picks).toEqual([{ entryId: fixture.products[0].entryId, label: 'Bench pick' }]);

    const [first, configB] = fixture.configurationIds;
    const result = (entry: number, config: number) =>
      model.results.find((r) => r.entryId === fixture.products[entry].entryId && r.configurationId === config);
    // Manual entries: peak and room as typed, rise = 71.5 − 22.0 = 49.5 °C (arithmetic).
    expect(result(1, first)).toMatchObject({
      status: 'measured',
      manual: true,
      peakC: 71.5,
      ambientC: 22,
      deltaOverAmbientC: 49.5,
    });
    expect(result(0, configB)).toMatchObject({ throttled: true, verdict: { code: 'throttled', status: 'final' } });
    // A withheld verdict publishes no figure at all.
    expect(result(1, configB)).toMatchObject({
      status: 'withheld',
      peakC: null,
      ambientC: null,
      deltaOverAmbientC: null,
    });
    expect(result(1, configB)?.notes.join(' ')).toMatch(/No figure is reported/);
  });

  it('when a run is accepted but not the run of record, then the cell shows no result', async () => {
    const fixture = await publishedFixture([[{ peakC: 65.0, notOfRecord: true }]]);
    const model = await buildPublishedRoundup((await testDataSource()).manager, fixture.roundupId, {
      publishedAt: new Date(),
    });
    expect(model.results).toEqual([]);
  });

  it('when a reader opens a live roundup, then the page is valid HTML with charts, tables, cautions and open data, in °C or °F', async () => {
    const fixture = await publishedFixture([
      [{ peakC: 71.5 }, { peakC: 80.0 }],
      [{ peakC: 66.0 }, { peakC: 92.0, throttled: true }],
    ]);
    const app = await testApp();
    const slugless = await request(app).get(`/read/roundups/${fixture.roundupId}`);
    expect(slugless.status).toBe(301);
    const path = slugless.headers.location as string;
    expect(path).toMatch(new RegExp(`^/read/roundups/${fixture.roundupId}-helix-1700-boards-`));

    const page = await request(app).get(path);
    expect(page.status).toBe(200);
    expect(page.headers['content-type']).toMatch(/^text\/html/);
    await expectValidHtml(page.text);
    expect(page.text).toContain(`<h1 id="headline">${fixture.title}</h1>`);
    for (const model of fixture.products.map((p) => p.model)) expect(page.text).toContain(model);
    expect(page.text).toContain('<caption>');
    expect(page.text).toMatch(/Power-delivery heatsinks and the rear of a board get hot enough to burn/);
    expect(page.text).toMatch(/Follow the maker's limits/);
    expect(page.text).toContain(`href="${path}/results.csv"`);
    expect(page.text).toContain('Throttled: the CPU slowed to protect itself.');
    // 71.5 °C is 160.7 °F (ITS-90 definition: °F = °C × 9/5 + 32).
    expect(page.text).toContain('71.5\u2009°C');
    const fahrenheit = await request(app).get(`${path}?unit=F`);
    expect(fahrenheit.text).toContain('160.7\u2009°F');
    expect(fahrenheit.headers['set-cookie']?.[0]).toMatch(/^bw_unit=F;/);
    // The cookie keeps the choice on the next page.
    const remembered = await request(app).get(path).set('Cookie', 'bw_unit=F');
    expect(remembered.text).toContain('160.7\u2009°F');
  });

  it('when a roundup is not live, then its page, open data and a made-up slug answer 404 without revealing it', async () => {
    const fixture = await publishedFixture([[{ peakC: 70.0 }]], { state: 'writing' });
    const app = await testApp();
    for (const path of [
      `/read/roundups/${fixture.roundupId}`,
      `/read/roundups/${fixture.roundupId}-anything`,
      `/read/roundups/${fixture.roundupId}-anything/results.csv`,
      `/read/roundups/${fixture.roundupId}-anything/analysis.json`,
    ]) {
      const response = await request(app).get(path);
      expect(response.status, path).toBe(404);
      expect(response.text).not.toContain(fixture.title);
    }
  });

  it('renders the same page from the frozen model alone, with picks and a corrections log', async () => {
    const fixture = await publishedFixture([[{ peakC: 70.0 }]]);
    const model = await buildPublishedRoundup((await testDataSource()).manager, fixture.roundupId, {
      publishedAt: new Date('2026-02-01T09:00:00Z'),
      updatedAt: new Date('2026-02-03T09:00:00Z'),
      labels: [{ entryId: fixture.products[0].entryId, label: 'Recommended' }],
      corrections: [{ at: '2026-02-03T09:00:00.000Z', kind: 'correction', note: 'The <b>price</b> was wrong.' }],
    });
    const frozen = JSON.parse(JSON.stringify(model));
    const markup = renderRoundupPage(site, frozen, { unit: 'C' });
    await expectValidHtml(markup);
    expect(markup).toContain('Correction:</strong> The &lt;b&gt;price&lt;/b&gt; was wrong.');
    expect(markup).toContain('<span class="pick-label">Recommended</span>');
    expect(markup).toContain('<link rel="canonical" href="https://results.test/read/roundups/');
  });
});

describe('write-up on the results page', () => {
  it('when the write-up has a signed-off introduction and a drafting conclusion, then readers see only the signed-off text', async () => {
    const fixture = await publishedFixture([[{ peakC: 70.0 }]], { state: 'writing' });
    const paragraph = (text: string) => ({
      type: 'doc',
      content: [{ type: 'paragraph', content: [{ type: 'text', text }] }],
    });
    const overview = await fixture.editor.get(`/api/roundups/${fixture.roundupId}/write-up`);
    expect(overview.status, overview.text).toBe(200);
    const sections = overview.body.sections as { id: number; kind: string; version: number }[];
    const intro = sections.find((s) => s.kind === 'introduction') as { id: number; version: number };
    const conclusion = sections.find((s) => s.kind === 'conclusion') as { id: number; version: number };
    const saved = await fixture.editor
      .put(`/api/write-up/sections/${intro.id}`)
      .send({ baseVersion: intro.version, content: paragraph('Budget boards held up better than we feared.') });
    expect(saved.status, saved.text).toBe(200);
    await fixture.editor
      .put(`/api/write-up/sections/${conclusion.id}`)
      .send({ baseVersion: conclusion.version, content: paragraph('Unfinished conclusion draft.') });
    expect((await fixture.editor.post(`/api/write-up/sections/${intro.id}/review-request`)).status).toBe(200);
    const signed = await fixture.editor.post(`/api/write-up/sections/${intro.id}/sign-off`);
    expect(signed.status, signed.text).toBe(200);
    await publishForReaders(fixture.roundupId);

    const app = await testApp();
    const first = await request(app).get(`/read/roundups/${fixture.roundupId}`);
    const page = await request(app).get(first.headers.location as string);
    expect(page.status).toBe(200);
    await expectValidHtml(page.text);
    expect(page.text).toContain('Budget boards held up better than we feared.');
    expect(page.text).not.toContain('Unfinished conclusion draft.');
  });
});
