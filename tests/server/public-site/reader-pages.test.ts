import { XMLParser } from 'fast-xml-parser';
import Papa from 'papaparse';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { RoundupEntity } from '../../../server/entities/roundup.entity';
import { formatCsv, safeCsvText } from '../../../server/lib/csv-export';
import { testApp, testDataSource } from '../support/test-app';
import { expectValidHtml } from './support/html-check';
import { publishedFixture, publishForReaders } from './support/published-fixture';
import { dayFromToday } from '../planning/support/planning-fixtures';

async function followToPage(app: Awaited<ReturnType<typeof testApp>>, path: string) {
  const first = await request(app).get(path);
  if (first.status !== 301) return first;
  return request(app).get(first.headers.location as string);
}

function jsonLdOf(markup: string): unknown[] {
  return [...markup.matchAll(/<script type="application\/ld\+json">([\s\S]*?)<\/script>/g)].map((m) =>
    JSON.parse(m[1]),
  );
}

describe('reader pages, feeds and open data', () => {
  it("when a reader opens a board's page, then every published result shows, and the estimate works without JavaScript", async () => {
    // Three loads with rises 40, 50, 62 °C over a 21 °C room (peaks 61, 71, 83): the worked example of the estimate
    // test; fixture load configurations all state 230 W, so they are set apart below.
    const fixture = await publishedFixture([[{ peakC: 61.0 }, { peakC: 71.0 }, { peakC: 83.0 }]], {
      state: 'in-review',
    });
    const ds = await testDataSource();
    for (const [index, watts] of [200, 250, 300].entries()) {
      await ds.query('UPDATE load_configurations SET expected_package_power_w = ? WHERE id = ?', [
        watts,
        fixture.configurationIds[index],
      ]);
    }
    await publishForReaders(fixture.roundupId);
    const app = await testApp();
    const page = await followToPage(app, `/read/products/${fixture.products[0].productId}`);
    expect(page.status).toBe(200);
    await expectValidHtml(page.text);
    expect(page.text).toContain(fixture.products[0].model);
    expect(page.text).toContain(fixture.title);
    expect(page.text).toMatch(/an estimate, not a guarantee/);
    expect(page.text).toMatch(/Cases and airflow differ/);
    expect(page.text).toMatch(/Follow the maker's limits/);
    const path = page.request.url.replace(/^https?:\/\/[^/]+/, '').split('?')[0];

    // 260 W in a 25 °C room: 25 + (−4.3333 + 0.22·260) = 77.87 °C (hand-worked in tests/shared/reader/vrm-estimate.test.ts).
    const estimated = await request(app).get(`${path}?power=260&room=25`);
    await expectValidHtml(estimated.text);
    expect(estimated.text).toContain('77.9\u2009°C');
    expect(estimated.text).not.toContain('Outside what we tested');
    const beyond = await request(app).get(`${path}?power=400&room=25`);
    expect(beyond.text).toContain('Outside what we tested');

    // Wrong input: each field says what is wrong and keeps what was typed.
    const wrong = await request(app).get(`${path}?power=abc&room=99`);
    expect(wrong.status).toBe(200);
    await expectValidHtml(wrong.text);
    expect(wrong.text).toContain('Enter a package power between 10 and 1000 W.');
    expect(wrong.text).toContain('Enter a room temperature between 5 and 45 °C.');
    expect(wrong.text).toMatch(/name="power"[^>]*value="abc"|value="abc"[^>]*name="power"/s);
    // The room is typed in the reader's unit: 77 °F is 25 °C (°F = °C × 9/5 + 32).
    const fahrenheit = await request(app).get(`${path}?power=260&room=77&unit=F`);
    expect(fahrenheit.text).toContain('172.2\u2009°F'); // 77.8667 °C × 9/5 + 32 = 172.16 °F

    const [jsonLd] = jsonLdOf(page.text) as { '@type': string; name: string; review: unknown[] }[];
    expect(jsonLd['@type']).toBe('Product');
    expect(jsonLd.name).toContain(fixture.products[0].model);
    expect(jsonLd.review).toHaveLength(1);
  });

  it('when a reader compares boards, then only like-for-like results are charted and the rest say why, without JavaScript', async () => {
    const first = await publishedFixture([[{ peakC: 70.0 }], [{ peakC: 64.0 }]]);
    // Another roundup on another test system under the same load configuration.
    const second = await publishedFixture([[{ peakC: 60.0 }]], { configurationIds: first.configurationIds });
    const app = await testApp();
    const [a, b] = first.products;
    const [c] = second.products;
    const query = `product=${a.productId}&product=${b.productId}&product=${c.productId}&configuration=${first.configurationIds[0]}`;
    const page = await request(app).get(`/read/compare?${query}`);
    expect(page.status).toBe(200);
    await expectValidHtml(page.text);
    const table = page.text.slice(page.text.indexOf('<table'), page.text.indexOf('</table>'));
    expect(table).toContain(a.model);
    expect(table).toContain(b.model);
    expect(table).not.toContain(c.model);
    expect(page.text).toMatch(/Measured on another test system/);
    // Rises over a 21 °C room: 49.0 and 43.0 °C (arithmetic), the lower first.
    expect(table.indexOf('43.0\u2009°C')).toBeLessThan(table.indexOf('49.0\u2009°C'));

    const empty = await request(app).get('/read/compare');
    expect(empty.status).toBe(200);
    await expectValidHtml(empty.text);
    const tooFew = await request(app).get(`/read/compare?product=${a.productId}`);
    expect(tooFew.text).toContain('Choose at least two boards.');
    expect(tooFew.text).toContain('Choose a load configuration.');
  });

  it('board pages and the compare form are stored at publication and served from memory, the same bytes the router renders', async () => {
    const fixture = await publishedFixture([[{ peakC: 66.0 }], [{ peakC: 72.0 }]]);
    const app = await testApp({ PUBLIC_SITE_URL: 'https://results.test' });
    const board = await followToPage(app, `/read/products/${fixture.products[0].productId}`);
    const path = board.request.url.replace(/^https?:\/\/[^/]+/, '');
    // Test files publish side by side, each under its own public address: compare the pages without it.
    const withoutOrigin = (text: string) => text.replace(/https?:\/\/[a-z0-9.:-]+(?=\/)/g, 'ORIGIN');
    for (const [address, unit] of [
      [path, 'C'],
      [path, 'F'],
      ['/read/compare', 'C'],
      ['/read/compare', 'F'],
    ]) {
      const stored = await request(app).get(address).set('Cookie', `bw_unit=${unit}`);
      expect(stored.status, address).toBe(200);
      // Only the lean path (stored pages) sends an ETag; `?unit=` makes the router render the page on request.
      expect(stored.headers.etag, `${address} in °${unit} comes from the stored pages`).toBeTruthy();
      const rendered = await request(app).get(`${address}?unit=${unit}`);
      expect(rendered.headers.etag).toBeUndefined();
      expect(withoutOrigin(stored.text), `${address} in °${unit}`).toBe(withoutOrigin(rendered.text));
    }
  });

  it('the Atom feed carries RFC 4287 required elements; the sitemap and robots point crawlers at the reader site', async () => {
    const fixture = await publishedFixture([[{ peakC: 70.0 }]]);
    const hidden = await publishedFixture([[{ peakC: 70.0 }]], { state: 'scheduled' });
    const app = await testApp({ PUBLIC_SITE_URL: 'https://results.test' });
    const feed = await request(app).get('/read/feed.atom');
    expect(feed.headers['content-type']).toMatch(/^application\/atom\+xml/);
    const parsed = new XMLParser({
      ignoreAttributes: false,
      isArray: (name) => ['entry', 'link', 'author'].includes(name),
    }).parse(feed.text);
    const root = parsed.feed;
    // RFC 4287 §4.1.1: exactly one id, title and updated; an author; a self link (REFERENCES.md "Web").
    expect(root['@_xmlns']).toBe('http://www.w3.org/2005/Atom');
    expect(typeof root.id).toBe('string');
    expect(root.title).toBeTruthy();
    expect(Number.isNaN(Date.parse(root.updated))).toBe(false);
    expect(root.author[0].name).toBeTruthy();
    expect(
      root.link.some(
        (l: Record<string, string>) => l['@_rel'] === 'self' && l['@_href'] === 'https://results.test/read/feed.atom',
      ),
    ).toBe(true);
    const entry = root.entry.find((e: { title: string }) => e.title === fixture.title);
    expect(entry).toBeDefined();
    // §4.1.2: each entry exactly one id, title, updated, and an alternate link as it has no content.
    expect(entry.id).toMatch(new RegExp(`^https://results.test/read/roundups/${fixture.roundupId}-`));
    expect(Number.isNaN(Date.parse(entry.updated))).toBe(false);
    expect(entry.link.some((l: Record<string, string>) => l['@_rel'] === 'alternate')).toBe(true);
    expect(root.entry.some((e: { title: string }) => e.title === hidden.title)).toBe(false);

    const sitemap = new XMLParser({ isArray: (name) => name === 'url' }).parse(
      (await request(app).get('/sitemap.xml')).text,
    );
    const locs = sitemap.urlset.url.map((u: { loc: string }) => u.loc);
    expect(locs).toContain(entry.id);
    expect(locs.every((loc: string) => loc.startsWith('https://results.test/'))).toBe(true);
    expect(locs.some((loc: string) => loc.includes(`/read/roundups/${hidden.roundupId}-`))).toBe(false);
    const robots = await request(app).get('/robots.txt');
    expect(robots.text).toContain('Sitemap: https://results.test/sitemap.xml');
    expect(robots.text).toMatch(/Disallow: \/api\//);
  });

  it('the results page carries canonical, Open Graph and schema.org Review of each Product with a rating where labelled', async () => {
    const fixture = await publishedFixture([[{ peakC: 70.0 }], [{ peakC: 74.0 }]], {
      prices: [[{ amountMinor: 17999, observedOn: dayFromToday(-5) }], []],
    });
    const app = await testApp({ PUBLIC_SITE_URL: 'https://results.test' });
    const page = await followToPage(app, `/read/roundups/${fixture.roundupId}`);
    expect(page.text).toMatch(/<link rel="canonical" href="https:\/\/results.test\/read\/roundups\//);
    for (const property of ['og:title', 'og:type', 'og:url']) expect(page.text).toContain(`property="${property}"`);
    const [graph] = jsonLdOf(page.text) as { '@context': string; '@graph': Record<string, unknown>[] }[];
    expect(graph['@context']).toBe('https://schema.org');
    expect(graph['@graph']).toHaveLength(2);
    for (const product of graph['@graph']) {
      // schema.org Product: name plus review; Review: author, itemReviewed (REFERENCES.md "Web").
      expect(product['@type']).toBe('Product');
      expect(product.name).toBeTruthy();
      const review = product.review as Record<string, unknown>;
      expect(review['@type']).toBe('Review');
      expect((review.author as { name: string }).name).toBeTruthy();
      expect(review.itemReviewed).toEqual({ '@id': product['@id'] });
      // No label given yet: no invented rating.
      expect(review.reviewRating).toBeUndefined();
    }
    // schema.org Offer (REFERENCES.md "Web": Product carries offers): price as digits with a full stop and no symbol,
    // priceCurrency an ISO 4217 code; 17999 minor units of EUR = 179.99 (ISO 4217: EUR has two minor-unit digits).
    // Availability is not tracked, so it is absent rather than guessed. The board without a known price has no offer.
    const priced = graph['@graph'].find((p) => String(p.name).includes(fixture.products[0].model));
    const unpriced = graph['@graph'].find((p) => String(p.name).includes(fixture.products[1].model));
    const offer = priced?.offers as Record<string, unknown>;
    expect(offer).toEqual({
      '@type': 'Offer',
      price: '179.99',
      priceCurrency: 'EUR',
      url: expect.stringMatching(/^https:\/\/results\.test\/read\/products\//),
    });
    expect(String(offer.price)).toMatch(/^\d+(\.\d+)?$/);
    expect(Intl.supportedValuesOf('currency')).toContain(offer.priceCurrency);
    expect(offer.availability).toBeUndefined();
    expect(unpriced?.offers).toBeUndefined();

    // The board's own page carries the same offer on its Product.
    const boardPage = await followToPage(app, `/read/products/${fixture.products[0].productId}`);
    const [boardLd] = jsonLdOf(boardPage.text) as Record<string, unknown>[];
    expect(boardLd.offers).toEqual(offer);
  });

  it('open data: the CSV has units in its column names, one row per run of record, and no cell runs as a formula', async () => {
    const fixture = await publishedFixture([[{ peakC: 70.5 }, { peakC: 88.0, throttled: true }]], {
      models: ['=HYPERLINK("x")'],
    });
    const app = await testApp();
    const page = await followToPage(app, `/read/roundups/${fixture.roundupId}`);
    const csvPath = /href="([^"]+results\.csv)"/.exec(page.text)?.[1] as string;
    const csv = await request(app).get(csvPath).buffer(true);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.headers['content-disposition']).toMatch(/^attachment;/);
    const text = csv.text;
    expect(text.split('\r\n')[0]).toContain('peak_c,ambient_c,delta_over_ambient_c');
    expect(text.split('\r\n')[0]).toContain('package_power_w,core_voltage_v');
    const rows = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true }).data;
    expect(rows).toHaveLength(2);
    expect(rows[0].peak_c).toBe('70.5');
    expect(rows[1].throttled).toBe('yes');
    // OWASP "CSV Injection": the cell starts with an apostrophe, never with "=".
    expect(rows.every((row) => row.model.startsWith("'="))).toBe(true);
    const json = await request(app).get(csvPath.replace('results.csv', 'analysis.json'));
    expect(json.body.rubric).toMatchObject({ comfortableBelowC: 80, warmUpToC: 100 });
    expect(json.body.runs).toHaveLength(2);
    expect(json.body.licence).toBeTruthy();
    // Raw logger files are off until the editor allows them.
    expect(page.text).toContain('The raw logger files of this roundup are not published.');
  });

  it('raw logger files are offered only when the editor allows them for the roundup', async () => {
    const fixture = await publishedFixture([[{ peakC: 70.5 }]]);
    const ds = await testDataSource();
    await ds.getRepository(RoundupEntity).update({ id: fixture.roundupId }, { openDataRawFiles: true });
    const app = await testApp();
    const page = await followToPage(app, `/read/roundups/${fixture.roundupId}`);
    // Manual runs have no logger file, so there is nothing to offer even when allowed.
    expect(page.text).toContain('The raw logger files of this roundup are not published.');
    const missing = await request(app).get(
      `${page.request.url.replace(/^https?:\/\/[^/]+/, '')}/raw/run-${fixture.runIds[0][0]}.csv`,
    );
    expect(missing.status).toBe(404);
  });

  it('the CSV helper quotes per RFC 4180 and guards formula starts, also after a delimiter inside a field', () => {
    expect(safeCsvText('=1+1')).toBe("'=1+1");
    expect(safeCsvText('@SUM(A1)')).toBe("'@SUM(A1)");
    expect(safeCsvText('ok;=cmd')).toBe("ok;'=cmd");
    expect(formatCsv(['a', 'b'], [['x, "y"', -3.5]])).toBe('a,b\r\n"x, ""y""",-3.5\r\n');
  });
});
