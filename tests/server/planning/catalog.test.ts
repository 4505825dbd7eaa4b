import { describe, expect, it } from 'vitest';
import { AuditEntryEntity } from '../../../server/entities/audit-entry.entity';
import { signedIn, testApp, testDataSource } from '../support/test-app';
import { addEntry, addPrice, createProduct, createRoundup, productBody, tag } from './support/planning-fixtures';

describe('catalog products', () => {
  it('when a tester adds a board, then its power design comes back with the effective phase count computed', async () => {
    const app = await testApp();
    const { agent: tester } = await signedIn(app, 'tester');
    const response = await tester.post('/api/catalog/products').send(productBody(`Helix-1700 ${tag()}`));
    expect(response.status, response.text).toBe(201);
    // First principles: 8 controller phases through doublers → 16 effective phases, 1 stage each → 16 stages;
    // 16 × 60 A = 960 A of rated stage current.
    expect(response.body.powerDesign).toMatchObject({
      controllerPhases: 8,
      phaseMultiplication: 'doubled',
      effectivePhases: 16,
      vcoreStageCount: 16,
      vcoreStageCurrentA: 60,
      vcoreRatedCurrentA: 960,
    });
    expect(response.body.features.rearUsb).toEqual({ usb2: 4, usb5g: 2, usb10g: 2, usb20g: 1, usb40g: 0 });
    expect(response.body.deletable).toBe(true);
  });

  it('teamed stages add stages but not phases, and a teamed design with one stage per phase is refused', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const base = productBody(`Helix-1700 ${tag()}`);
    const teamed = await editor.post('/api/catalog/products').send({
      ...base,
      powerDesign: { ...base.powerDesign, controllerPhases: 6, phaseMultiplication: 'teamed', stagesPerPhase: 2 },
    });
    expect(teamed.status, teamed.text).toBe(201);
    // First principles: 6 teamed phases × 2 stages = 12 stages, still 6 phases.
    expect(teamed.body.powerDesign).toMatchObject({ effectivePhases: 6, vcoreStageCount: 12 });
    const wrong = await editor.post('/api/catalog/products').send({
      ...base,
      model: `${base.model} b`,
      powerDesign: { ...base.powerDesign, phaseMultiplication: 'teamed', stagesPerPhase: 1 },
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields['powerDesign.stagesPerPhase']).toMatch(/two or more/);
  });

  it('a writer reads the catalog but may not change it', async () => {
    const app = await testApp();
    const { agent: writer } = await signedIn(app, 'writer');
    const { agent: editor } = await signedIn(app, 'editor');
    const id = await createProduct(editor, `Helix-1700 ${tag()}`);
    expect((await writer.get(`/api/catalog/products/${id}`)).status).toBe(200);
    expect((await writer.patch(`/api/catalog/products/${id}`).send({ chipset: 'HX-Z90' })).status).toBe(403);
  });

  it('the same maker and model twice is a 409 naming the field', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const body = productBody(`Helix-1700 ${tag()}`);
    expect((await editor.post('/api/catalog/products').send(body)).status).toBe(201);
    const again = await editor.post('/api/catalog/products').send(body);
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('product_exists');
    expect(again.body.error.fields.model).toBeTruthy();
  });

  it('prices are kept as history: a new price adds a row and becomes the latest for its region', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const id = await createProduct(editor, `Helix-1700 ${tag()}`);
    await addPrice(editor, id, { region: 'DE', currency: 'EUR', amountMinor: 21999, observedOn: '2025-05-01' });
    await addPrice(editor, id, { region: 'DE', currency: 'EUR', amountMinor: 19999, observedOn: '2025-06-01' });
    await addPrice(editor, id, { region: 'GB', currency: 'GBP', amountMinor: 17999, observedOn: '2025-05-15' });
    const detail = await editor.get(`/api/catalog/products/${id}`);
    expect(detail.body.prices.map((p: { amountMinor: number }) => p.amountMinor)).toEqual([19999, 17999, 21999]);
    expect(detail.body.latestPrices).toEqual([
      expect.objectContaining({ region: 'DE', amountMinor: 19999, observedOn: '2025-06-01' }),
      expect.objectContaining({ region: 'GB', amountMinor: 17999, currency: 'GBP' }),
    ]);
    const history = await editor.get(`/api/catalog/products/${id}/prices?region=DE`);
    expect(history.body.prices).toHaveLength(2);
  });

  it('a price amount that is not whole minor units, or an unknown currency, is refused', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const id = await createProduct(editor, `Helix-1700 ${tag()}`);
    const fraction = await editor
      .post(`/api/catalog/products/${id}/prices`)
      .send({ region: 'DE', currency: 'EUR', amountMinor: 199.5, observedOn: '2025-06-01', source: 'shop' });
    expect(fraction.status).toBe(400);
    expect(fraction.body.error.fields.amountMinor).toBeTruthy();
    const currency = await editor
      .post(`/api/catalog/products/${id}/prices`)
      .send({ region: 'DE', currency: 'EUX', amountMinor: 19900, observedOn: '2025-06-01', source: 'shop' });
    expect(currency.status).toBe(400);
    expect(currency.body.error.fields.currency).toMatch(/ISO 4217/);
  });

  it('deleting a product that is in a roundup is refused with 409; archiving works and hides it from the list', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, platform } = await createRoundup(editor);
    const used = await createProduct(editor, platform);
    const unused = await createProduct(editor, platform);
    await addEntry(editor, roundupId, used);

    const refused = await editor.delete(`/api/catalog/products/${used}`);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('product_in_use');
    expect(refused.body.error.message).toMatch(/Archive it instead/);
    expect((await editor.get(`/api/catalog/products/${used}`)).body.deletable).toBe(false);

    const archived = await editor.patch(`/api/catalog/products/${used}`).send({ archived: true });
    expect(archived.status).toBe(200);
    expect(archived.body.archived).toBe(true);
    const list = await editor.get(`/api/catalog/products?platform=${encodeURIComponent(platform)}`);
    expect(list.body.products.map((p: { id: number }) => p.id)).toEqual([unused]);
    const withArchived = await editor.get(
      `/api/catalog/products?platform=${encodeURIComponent(platform)}&archived=include`,
    );
    expect(withArchived.body.total).toBe(2);

    expect((await editor.delete(`/api/catalog/products/${unused}`)).status).toBe(204);
    const audit = await (
      await testDataSource()
    )
      .getRepository(AuditEntryEntity)
      .findOneBy({ action: 'product.deleted', subjectId: String(unused) });
    expect(audit).toBeTruthy();
  });

  it('the list filters, searches and sorts, with unknown values last and price sort by region', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const platform = `Helix-1700 ${tag()}`;
    const maker = `Ostrel Works ${tag()}`;
    const a = await createProduct(editor, platform, { maker, model: 'Alpha', formFactor: 'mini-itx' });
    const b = await createProduct(editor, platform, { maker, model: 'Bravo', formFactor: 'atx' });
    const c = await createProduct(editor, platform, { maker, model: 'Charlie', formFactor: 'atx' });
    await addPrice(editor, a, { region: 'DE', currency: 'EUR', amountMinor: 25000, observedOn: '2025-06-01' });
    await addPrice(editor, b, { region: 'DE', currency: 'EUR', amountMinor: 15000, observedOn: '2025-06-01' });
    const q = `platform=${encodeURIComponent(platform)}`;

    const byPrice = await editor.get(`/api/catalog/products?${q}&sort=price&priceRegion=DE`);
    expect(byPrice.body.products.map((p: { id: number }) => p.id)).toEqual([b, a, c]);
    const byPriceDesc = await editor.get(`/api/catalog/products?${q}&sort=price&priceRegion=DE&direction=desc`);
    expect(byPriceDesc.body.products.map((p: { id: number }) => p.id)).toEqual([a, b, c]);
    const atx = await editor.get(`/api/catalog/products?${q}&formFactor=atx&sort=model&direction=desc`);
    expect(atx.body.products.map((p: { model: string }) => p.model)).toEqual(['Charlie', 'Bravo']);
    const search = await editor.get(`/api/catalog/products?${q}&search=brav`);
    expect(search.body.products.map((p: { id: number }) => p.id)).toEqual([b]);
    const paged = await editor.get(`/api/catalog/products?${q}&sort=model&limit=1&offset=1`);
    expect(paged.body.total).toBe(3);
    expect(paged.body.products.map((p: { model: string }) => p.model)).toEqual(['Bravo']);
    expect(paged.body.facets.platforms).toContain(platform);
  });
});
