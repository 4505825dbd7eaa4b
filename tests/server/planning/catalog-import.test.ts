import { describe, expect, it } from 'vitest';
import { ProductEntity } from '../../../server/entities/product.entity';
import { ProductPriceEntity } from '../../../server/entities/product-price.entity';
import { signedIn, testApp, testDataSource } from '../support/test-app';
import { tag } from './support/planning-fixtures';

const header =
  'maker,model,platform,socket,chipset,form_factor,release_date,vrm_controller,controller_phases,phase_multiplication,' +
  'stages_per_phase,vcore_stage_type,vcore_stage_part,vcore_stage_current_a,rear_usb_10g,lan_speed_mbps,wifi,m2_slots,' +
  'io_shield_prefitted,price_region,price_currency,price_amount,price_observed_on,price_source';

function goodRow(maker: string, model: string, platform: string, price = '189.90') {
  return `${maker},${model},${platform},HX4,HX-B50,atx,2025-02-10,KV-PWM8,8,doubled,1,integrated-power-stage,KVS-60,60,2,2500,wifi-6e,3,yes,DE,EUR,${price},2025-06-01,Brightmoor Direct`;
}

async function countProducts(maker: string) {
  return (await testDataSource()).getRepository(ProductEntity).countBy({ maker });
}

describe('catalog CSV import', () => {
  it('when a file mixes good and bad rows, then the preview lists each error by row and column and saves nothing', async () => {
    const app = await testApp();
    const { agent: tester } = await signedIn(app, 'tester');
    const maker = `Quillon ${tag()}`;
    const platform = `Helix-1700 ${tag()}`;
    const csv = [
      header,
      goodRow(maker, 'Q50 Steady', platform),
      // Row 3: an unknown form factor and a price with three decimals.
      `${maker},Q50 Wide,${platform},HX4,HX-B50,wide-atx,,,,,,,,,,,,,,DE,EUR,189.999,2025-06-01,Brightmoor Direct`,
      goodRow(maker, 'Q70 Forge', platform, '249'),
      // Row 5: no model, a teamed design with one stage per phase, a non-number phase count.
      `${maker},,${platform},HX4,HX-B50,atx,,,eight,teamed,1,,,,,,,,,,,,,`,
      // Row 6: a price without its date and source.
      `${maker},Q90 Summit,${platform},HX4,HX-B70,e-atx,,,,,,,,,,,,,,DE,EUR,329.00,,`,
      // Row 7: the same product as row 2.
      goodRow(maker, 'Q50 Steady', platform),
    ].join('\n');

    const preview = await tester.post('/api/catalog/import/preview').send({ csv });
    expect(preview.status, preview.text).toBe(200);
    expect(preview.body).toMatchObject({ rowCount: 6, validRowCount: 2, canCommit: false });
    const errors = preview.body.errors as { rowNumber: number; column: string | null; message: string }[];
    const at = (row: number) => errors.filter((e) => e.rowNumber === row).map((e) => e.column);
    expect(at(2)).toEqual([]);
    expect(at(3)).toEqual(['form_factor', 'price_amount']);
    expect(at(4)).toEqual([]);
    expect(at(5)).toEqual(expect.arrayContaining(['model', 'controller_phases']));
    expect(at(6)).toEqual(['price_observed_on', 'price_source']);
    expect(at(7)).toEqual(['model']);
    expect(errors.find((e) => e.rowNumber === 3 && e.column === 'price_amount')?.message).toMatch(/2 decimal places/);
    expect(errors.find((e) => e.rowNumber === 7)?.message).toMatch(/Row 2 already has/);
    const good = preview.body.rows.find((r: { rowNumber: number }) => r.rowNumber === 4);
    expect(good).toMatchObject({ action: 'create', price: { amountMinor: 24900, currency: 'EUR', action: 'add' } });

    // Nothing is saved by a preview, and a commit of a file with errors saves nothing either.
    expect(await countProducts(maker)).toBe(0);
    const commit = await tester.post('/api/catalog/import/commit').send({ csv, checksum: preview.body.checksum });
    expect(commit.status).toBe(422);
    expect(commit.body.error.code).toBe('import_has_errors');
    expect(commit.body.error.fields['row 3 form_factor']).toBeTruthy();
    expect(await countProducts(maker)).toBe(0);
  });

  it('when the corrected file is previewed and confirmed, then every row is saved in one go, prices included', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const maker = `Quillon ${tag()}`;
    const platform = `Helix-1700 ${tag()}`;
    const csv = [header, goodRow(maker, 'Q50 Steady', platform), goodRow(maker, 'Q70 Forge', platform, '249')].join(
      '\r\n',
    );
    const preview = await editor.post('/api/catalog/import/preview').send({ csv });
    expect(preview.body.canCommit).toBe(true);
    expect(await countProducts(maker)).toBe(0);

    // A different file with the old checksum is refused: the editor confirms what was previewed.
    const changed = await editor
      .post('/api/catalog/import/commit')
      .send({ csv: csv.replace('249', '259'), checksum: preview.body.checksum });
    expect(changed.status).toBe(409);
    expect(changed.body.error.code).toBe('import_changed');

    const commit = await editor.post('/api/catalog/import/commit').send({ csv, checksum: preview.body.checksum });
    expect(commit.status, commit.text).toBe(200);
    expect(commit.body).toMatchObject({ created: 2, updated: 0, pricesAdded: 2 });
    const ds = await testDataSource();
    const forge = await ds.getRepository(ProductEntity).findOneByOrFail({ maker, model: 'Q70 Forge' });
    expect(forge.effectivePhases).toBe(16);
    expect(forge.vcoreStageCurrentA).toBe('60.0');
    const prices = await ds.getRepository(ProductPriceEntity).findBy({ productId: forge.id });
    expect(prices.map((p) => [p.region, p.currency, p.amountMinor, p.observedOn])).toEqual([
      ['DE', 'EUR', 24900, '2025-06-01'],
    ]);

    // Importing the same file again changes nothing and does not duplicate the price history.
    const again = await editor.post('/api/catalog/import/preview').send({ csv });
    expect(
      again.body.rows.map((r: { action: string; changedFields: string[]; price: { action: string } }) => [
        r.action,
        r.changedFields,
        r.price.action,
      ]),
    ).toEqual([
      ['update', [], 'duplicate'],
      ['update', [], 'duplicate'],
    ]);
    const second = await editor.post('/api/catalog/import/commit').send({ csv, checksum: again.body.checksum });
    expect(second.body).toMatchObject({ created: 0, updated: 0, unchanged: 2, pricesAdded: 0 });
  });

  it('a multipart upload works like the JSON body, and a missing required column is reported on the header row', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const maker = `Brightmoor ${tag()}`;
    const csv = [header, goodRow(maker, 'B60 Field', `Helix-1700 ${tag()}`)].join('\n');
    const preview = await editor
      .post('/api/catalog/import/preview')
      .attach('file', Buffer.from(`\uFEFF${csv}`), 'boards.csv');
    expect(preview.status, preview.text).toBe(200);
    expect(preview.body.canCommit).toBe(true);
    const commit = await editor
      .post('/api/catalog/import/commit')
      .attach('file', Buffer.from(`\uFEFF${csv}`), 'boards.csv')
      .field('checksum', preview.body.checksum);
    expect(commit.status, commit.text).toBe(200);
    expect(commit.body.created).toBe(1);

    const noChipset = await editor
      .post('/api/catalog/import/preview')
      .send({ csv: 'maker,model,platform,socket,form_factor,colour\nA,B,C,D,atx,red' });
    expect(noChipset.body.errors).toEqual([
      { rowNumber: 1, column: 'chipset', message: expect.stringMatching(/chipset/) },
    ]);
    expect(noChipset.body.ignoredColumns).toEqual(['colour']);
    expect(noChipset.body.canCommit).toBe(false);
  });

  it('an updated row shows which fields change, and export writes the same columns so the file imports back', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const maker = `Ostrel Works ${tag()}`;
    const platform = `Helix-1700 ${tag()}`;
    const csv = [header, goodRow(maker, 'O40 Runner', platform)].join('\n');
    const first = await editor.post('/api/catalog/import/preview').send({ csv });
    await editor.post('/api/catalog/import/commit').send({ csv, checksum: first.body.checksum });

    const exported = await editor.get(
      `/api/catalog/export.csv?platform=${encodeURIComponent(platform)}&priceRegion=DE`,
    );
    expect(exported.status).toBe(200);
    expect(exported.headers['content-type']).toMatch(/text\/csv/);
    expect(exported.headers['content-disposition']).toMatch(/attachment; filename="benchwire-catalog-/);
    const lines = exported.text
      .replace(/^\uFEFF/, '')
      .trim()
      .split('\r\n');
    expect(lines).toHaveLength(2);
    expect(lines[1]).toContain(`${maker},O40 Runner,${platform},HX4,HX-B50,atx,2025-02-10,KV-PWM8,8,doubled,1`);
    expect(lines[1]).toMatch(/,DE,EUR,189\.90,2025-06-01,Brightmoor Direct$/);

    const edited = exported.text.replace('HX-B50', 'HX-B60').replace('KV-PWM8,8,doubled', 'KV-PWM8,7,doubled');
    const preview = await editor.post('/api/catalog/import/preview').send({ csv: edited });
    expect(preview.body.canCommit, JSON.stringify(preview.body.errors)).toBe(true);
    expect(preview.body.rows[0]).toMatchObject({
      action: 'update',
      changedFields: ['chipset', 'powerDesign.controllerPhases'],
      price: { action: 'duplicate' },
    });
  });

  it('a catalog column named twice in the header is refused by name, not read from one of the two', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const maker = `Brightmoor ${tag()}`;
    const csv = `maker,model,platform,socket,chipset,form_factor,model\n${maker},B70,Helix-1700,HX4,HX-B50,atx,B71\n`;
    const preview = await editor.post('/api/catalog/import/preview').send({ csv });
    expect(preview.status, preview.text).toBe(200);
    expect(preview.body.canCommit).toBe(false);
    expect(preview.body.errors).toEqual([
      { rowNumber: 1, column: 'model', message: expect.stringContaining('“model” appears twice') },
    ]);
    expect(preview.body.ignoredColumns).toEqual([]);
  });

  it('a UTF-16 file with its byte-order mark reads as UTF-8 does; a Latin-1 file and a binary file are refused, nothing is saved', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const maker = `Kühlstrand ${tag()}`;
    const csv = [header, goodRow(maker, 'G50 Feld', `Helix-1700 ${tag()}`)].join('\r\n');

    // Byte-order marks from the Unicode Standard §23.8: FF FE starts UTF-16LE.
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(csv, 'utf16le')]);
    const read = await editor.post('/api/catalog/import/preview').attach('file', utf16, 'boards.csv');
    expect(read.status, read.text).toBe(200);
    expect(read.body.canCommit, JSON.stringify(read.body.errors)).toBe(true);
    expect(read.body.rows[0]).toMatchObject({ maker, model: 'G50 Feld' });

    // ISO 8859-1 writes "ü" as the single byte 0xFC, which is not valid UTF-8 (RFC 3629 §3).
    const latin1 = Buffer.from(csv, 'latin1');
    const refused = await editor.post('/api/catalog/import/preview').attach('file', latin1, 'boards.csv');
    expect(refused.status).toBe(200);
    expect(refused.body.canCommit).toBe(false);
    expect(refused.body.errors).toEqual([
      { rowNumber: 2, column: null, message: expect.stringContaining('not UTF-8') },
    ]);
    const commit = await editor
      .post('/api/catalog/import/commit')
      .attach('file', latin1, 'boards.csv')
      .field('checksum', refused.body.checksum);
    expect(commit.status).toBe(422);

    const workbook = await editor
      .post('/api/catalog/import/preview')
      .attach('file', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x00, 0x00]), 'boards.csv');
    expect(workbook.status).toBe(415);
    expect(workbook.body.error.code).toBe('unsupported_file');
    expect(await countProducts(maker)).toBe(0);
  });

  it('export quotes and neutralises formula triggers at the start of a cell and after a semicolon or tab (OWASP CSV injection)', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const maker = `Ostrel Works ${tag()}`;
    const platform = `Helix-1700 ${tag()}`;
    const row = goodRow(maker, '=HYPERLINK("x") Runner', platform).replace('Brightmoor Direct', '"Shop;=1+2"');
    const csv = [header, row].join('\n');
    const preview = await editor.post('/api/catalog/import/preview').send({ csv });
    expect(preview.body.canCommit, JSON.stringify(preview.body.errors)).toBe(true);
    await editor.post('/api/catalog/import/commit').send({ csv, checksum: preview.body.checksum });

    const exported = await editor.get(
      `/api/catalog/export.csv?platform=${encodeURIComponent(platform)}&priceRegion=DE`,
    );
    const line = exported.text
      .replace(/^\uFEFF/, '')
      .trim()
      .split('\r\n')[1];
    // A cell starting with = gets a leading apostrophe (and its quotes doubled inside quotes, RFC 4180 §2.7).
    expect(line).toContain(`,"'=HYPERLINK(""x"") Runner",`);
    // A semicolon followed by = stays inside one quoted cell in a spreadsheet that splits on semicolons.
    expect(line).toMatch(/,"Shop;=1\+2"$/);

    // The file imports back to the same names.
    const back = await editor.post('/api/catalog/import/preview').send({ csv: exported.text });
    expect(back.body.rows[0]).toMatchObject({ model: '=HYPERLINK("x") Runner', action: 'update' });
  });
});
