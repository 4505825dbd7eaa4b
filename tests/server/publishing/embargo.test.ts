import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import sharp from 'sharp';
import type { DataSource } from 'typeorm';
import type { Services } from '../../../server/compose-services';
import { AuditEntryEntity } from '../../../server/entities/audit-entry.entity';
import { JobEntity } from '../../../server/entities/job.entity';
import { MailingEntity } from '../../../server/entities/mail.entities';
import { RoundupPublicationEntity } from '../../../server/entities/roundup-publication.entity';
import { RoundupEntity } from '../../../server/entities/roundup.entity';
import { createJobRegistry } from '../../../server/jobs/all';
import { ManualClock } from '../../../server/jobs/clock';
import { JobRunner } from '../../../server/jobs/job-runner';
import { buildPublishedRoundup } from '../../../server/public-site/published-roundup';
import { publishJobKey } from '../../../server/services/publishing.service';
import { signedIn, TEST_HOST, type Client, type TestApp } from '../support/test-app';
import { WriteUpSectionEntity } from '../../../server/entities/write-up-section.entity';
import { addEntry, createProduct, createRoundup } from '../planning/support/planning-fixtures';
import { publishingContext, roundupInReview, scheduleAt } from './support/publishing-fixtures';

const quiet = { error: () => {}, warn: () => {} };
let dataSource: DataSource;
let services: Services;
let app: TestApp;

/** A reader: no session, no Origin, just a browser asking for a public address. */
const reader = () => ({ get: (path: string) => request(app).get(path).set('Host', TEST_HOST) });

/**
 * A runner over the app's own services, on a clock the test sets, confined to this roundup's publish job (other
 * test files share the database and schedule their own).
 */
function runnerAt(clock: ManualClock, roundupId: number) {
  return new JobRunner(dataSource, createJobRegistry(services), {
    clock,
    log: quiet,
    onlyUniqueKeys: [publishJobKey(roundupId)],
  });
}

/** A whole second about an hour from now. */
function anHourAhead() {
  return new Date(Math.ceil((Date.now() + 3_600_000) / 1000) * 1000);
}

/** Schedules the roundup an hour ahead and lets the publish job run at that time; answers its public path. */
async function publishByJob(editor: Client, roundupId: number) {
  const at = anHourAhead();
  await scheduleAt(editor, roundupId, at);
  await runnerAt(new ManualClock(at), roundupId).runDue();
  return (await services.publishing.status(roundupId)).publicPath as string;
}

/** Asks for a publishing time as the schedule form sends it: a local date and time in a time zone. */
function putSchedule(agent: Client, roundupId: number, date: string, time: string, timeZone: string) {
  return agent.put(`/api/roundups/${roundupId}/schedule`).send({ date, time, timeZone });
}

/** Every address a published roundup appears at, and whether the response shows it. */
async function publicSurfaces(roundupId: number, title: string) {
  const model = await buildPublishedRoundup(dataSource.manager, roundupId, { publishedAt: new Date() });
  // Its results page and open data; the pages over all roundups; addresses that only exist for published boards.
  const own = [model.path, model.openData.csvPath, model.openData.analysisJsonPath];
  // The compare page answers any query; it must not show an unpublished board.
  const shared = ['/read', '/read/feed.atom', '/sitemap.xml', `/read/compare?product=${model.products[0].productId}`];
  const others = [...model.products.map((p) => p.path), '/read/photos/1/640.webp'];
  const shows = async (path: string) => {
    const response = await reader().get(path);
    const names = [title, model.path, ...model.products.map((p) => p.name)];
    return { status: response.status, mentions: names.some((name) => response.text.includes(name)) };
  };
  return { model, own, shared, others, shows };
}

beforeAll(async () => {
  ({ dataSource, services, app } = await publishingContext());
});

// Each publication renders the pages of every published roundup in the shared test database: allow for it.
describe('embargo publishing', { timeout: 120_000 }, () => {
  it('nothing is public one second before the time; everything is at the time, published once', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, title } = await roundupInReview(app, editor, dataSource);
    const at = anHourAhead();
    const scheduled = await scheduleAt(editor, roundupId, at);
    expect(scheduled.state).toBe('scheduled');
    expect(scheduled.schedule.publishAt).toBe(at.toISOString());

    const surfaces = await publicSurfaces(roundupId, title);
    const clock = new ManualClock(at.getTime() - 1_000);
    await runnerAt(clock, roundupId).runDue();
    expect((await dataSource.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId })).state).toBe('scheduled');
    for (const path of [...surfaces.own, ...surfaces.others]) {
      const seen = await surfaces.shows(path);
      expect(seen.status, path).toBe(404);
    }
    for (const path of surfaces.shared) expect((await surfaces.shows(path)).mentions, path).toBe(false);

    clock.set(at);
    expect(await runnerAt(clock, roundupId).runDue()).toBe(1);
    const roundup = await dataSource.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId });
    expect(roundup.state).toBe('live');
    for (const path of surfaces.own) expect((await surfaces.shows(path)).status, path).toBe(200);
    expect((await surfaces.shows(surfaces.model.path)).mentions).toBe(true);
    expect((await surfaces.shows('/read')).mentions).toBe(true);
    const publications = await dataSource.getRepository(RoundupPublicationEntity).findBy({ roundupId });
    expect(publications.map((p) => [p.version, p.kind, p.publishedAt.toISOString()])).toEqual([
      [1, 'publication', at.toISOString()],
    ]);
    const job = await dataSource.getRepository(JobEntity).findOneByOrFail({ uniqueKey: publishJobKey(roundupId) });
    expect(job.state).toBe('done');

    // A second pass, or a retry, changes nothing.
    await runnerAt(clock, roundupId).runDue();
    await services.publishing.publishDue(roundupId, clock.now());
    expect(await dataSource.getRepository(RoundupPublicationEntity).countBy({ roundupId })).toBe(1);
  });

  it('two runners at the due time publish exactly once', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId } = await roundupInReview(app, editor, dataSource);
    const at = new Date(Math.ceil((Date.now() + 7_200_000) / 1000) * 1000);
    await scheduleAt(editor, roundupId, at, 'Asia/Kolkata');
    const clock = new ManualClock(at);
    await Promise.all([
      runnerAt(clock, roundupId).runDue(),
      runnerAt(clock, roundupId).runDue(),
      services.publishing.publishDue(roundupId, at),
    ]);
    expect(await dataSource.getRepository(RoundupPublicationEntity).countBy({ roundupId })).toBe(1);
    const published = await dataSource
      .getRepository(AuditEntryEntity)
      .countBy({ subjectType: 'roundup', subjectId: String(roundupId), action: 'roundup.published' });
    expect(published).toBe(1);
    // The go-live mail is queued in the publish transaction, once, however many runners raced.
    expect(await dataSource.getRepository(MailingEntity).countBy({ roundupId, kind: 'go-live' })).toBe(1);
  });

  it('serves the snapshot with ETag, 304, the accepted compression, caching and content-type', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, title } = await roundupInReview(app, editor, dataSource);
    const path = await publishByJob(editor, roundupId);

    const plain = await reader().get(path).set('Accept-Encoding', 'identity');
    expect(plain.status).toBe(200);
    expect(plain.headers['content-type']).toBe('text/html; charset=utf-8');
    expect(plain.headers['content-encoding']).toBeUndefined();
    // Each page exists in °C and °F (the reader's unit cookie picks one).
    expect(plain.headers.vary).toBe('Accept-Encoding, Cookie');
    expect(plain.headers['cache-control']).toMatch(/public/);
    expect(plain.headers.etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(plain.text).toContain(title);
    // The lean path sends the app's own security headers.
    const api = await reader().get('/api/health');
    for (const header of ['content-security-policy', 'x-frame-options', 'x-content-type-options', 'referrer-policy']) {
      expect(plain.headers[header], header).toBe(api.headers[header]);
    }

    // The client decodes what it was sent: the stored compressed bodies decode to the same page.
    const br = await reader().get(path).set('Accept-Encoding', 'gzip, deflate, br');
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.text).toBe(plain.text);
    const gz = await reader().get(path).set('Accept-Encoding', 'gzip;q=1.0, br;q=0');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.text).toBe(plain.text);
    expect(gz.headers.etag).not.toBe(br.headers.etag);

    const again = await reader().get(path).set('Accept-Encoding', 'br').set('If-None-Match', br.headers.etag);
    expect(again.status).toBe(304);
    expect(again.headers.etag).toBe(br.headers.etag);
    const head = await request(app).head(path).set('Host', TEST_HOST).set('Accept-Encoding', 'identity');
    expect(head.status).toBe(200);
    expect(head.headers['content-length']).toBe(String(Buffer.byteLength(plain.text)));
  });

  it('later edits reach readers only with a published update, logged on the page with its note and date', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, title } = await roundupInReview(app, editor, dataSource);
    const path = await publishByJob(editor, roundupId);
    const before = await reader().get(path);

    const renamed = `${title} (corrected)`;
    expect((await editor.patch(`/api/roundups/${roundupId}`).send({ title: renamed })).status).toBe(200);
    expect((await reader().get(path)).text).not.toContain(renamed);

    const refused = await editor
      .post(`/api/roundups/${roundupId}/publication-updates`)
      .send({ kind: 'correction', note: ' ' });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.note).toBeTruthy();

    const update = await editor
      .post(`/api/roundups/${roundupId}/publication-updates`)
      .send({ kind: 'correction', note: 'The second board’s price was for the wrong region.' });
    expect(update.status, update.text).toBe(201);
    expect(update.body.state).toBe('updated');
    expect(update.body.publications.map((p: { version: number; kind: string }) => [p.version, p.kind])).toEqual([
      [1, 'publication'],
      [2, 'correction'],
    ]);
    // The page shows the new title and the note; the old address leads to the new one.
    const newPath = update.body.publicPath as string;
    const after = await reader().get(newPath);
    expect(after.status).toBe(200);
    expect(after.text).toContain(renamed);
    expect(after.text).toContain('The second board’s price was for the wrong region.');
    expect(after.headers.etag).not.toBe(before.headers.etag);
    if (newPath !== path) {
      const old = await reader().get(path);
      expect(old.status).toBe(301);
      expect(old.headers.location).toBe(newPath);
    }
  });

  it('reschedules and unschedules; the job follows the schedule', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId } = await roundupInReview(app, editor, dataSource);
    const first = anHourAhead();
    const later = new Date(first.getTime() + 86_400_000);
    await scheduleAt(editor, roundupId, first);
    await scheduleAt(editor, roundupId, later, 'America/Los_Angeles');
    const job = await dataSource.getRepository(JobEntity).findOneByOrFail({ uniqueKey: publishJobKey(roundupId) });
    expect(job.runAt.toISOString()).toBe(later.toISOString());

    await runnerAt(new ManualClock(first), roundupId).runDue();
    expect((await dataSource.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId })).state).toBe('scheduled');

    const off = await editor.delete(`/api/roundups/${roundupId}/schedule`);
    expect(off.status, off.text).toBe(200);
    expect(off.body.state).toBe('in-review');
    expect(off.body.schedule).toBeNull();
    await runnerAt(new ManualClock(later), roundupId).runDue();
    expect((await dataSource.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId })).state).toBe('in-review');
    expect(
      (await dataSource.getRepository(JobEntity).findOneByOrFail({ uniqueKey: publishJobKey(roundupId) })).state,
    ).toBe('cancelled');
  });

  it('a schedule across a daylight-saving change lands on the right UTC instant', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId } = await roundupInReview(app, editor, dataSource);
    // United States daylight time begins 14 March 2027 at 02:00 local (15 U.S.C. § 260a): 09:00 is UTC−8 the day
    // before and UTC−7 the day after.
    const before = await putSchedule(editor, roundupId, '2027-03-13', '09:00', 'America/Los_Angeles');
    expect(before.status, before.text).toBe(200);
    expect(before.body.schedule).toMatchObject({ publishAt: '2027-03-13T17:00:00.000Z', utcOffset: 'UTC−08:00' });
    const after = await putSchedule(editor, roundupId, '2027-03-15', '09:00', 'America/Los_Angeles');
    expect(after.body.schedule).toMatchObject({ publishAt: '2027-03-15T16:00:00.000Z', utcOffset: 'UTC−07:00' });
    const gap = await putSchedule(editor, roundupId, '2027-03-14', '02:30', 'America/Los_Angeles');
    expect(gap.status).toBe(422);
    expect(gap.body.error.fields.time).toMatch(/does not exist/);
  });

  it('refuses a schedule in the past, for a roundup not in review, and from a writer', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId } = await roundupInReview(app, editor, dataSource);
    const past = await putSchedule(editor, roundupId, '2026-01-05', '09:00', 'UTC');
    expect(past.status).toBe(422);
    expect(past.body.error.fields.time).toMatch(/passed/);

    await dataSource.getRepository(RoundupEntity).update({ id: roundupId }, { state: 'writing' });
    const notReady = await putSchedule(editor, roundupId, '2030-01-05', '09:00', 'UTC');
    expect(notReady.status).toBe(409);
    const status = await editor.get(`/api/roundups/${roundupId}/publishing`);
    expect(status.body.readiness.ready).toBe(false);

    const { agent: writer } = await signedIn(app, 'writer');
    const denied = await putSchedule(writer, roundupId, '2030-01-05', '09:00', 'UTC');
    expect(denied.status).toBe(403);
  });

  it('refuses to schedule a roundup with blockers, naming each with the screen where it is fixed', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    // In review with nothing tested yet: the state alone does not make it ready.
    const setup = await createRoundup(editor, { configurations: 1 });
    const productId = await createProduct(editor, setup.platform);
    await addEntry(editor, setup.roundupId, productId);
    await dataSource.getRepository(RoundupEntity).update({ id: setup.roundupId }, { state: 'in-review' });

    const status = await editor.get(`/api/roundups/${setup.roundupId}/publishing`);
    expect(status.body.readiness.ready).toBe(false);
    const refused = await putSchedule(editor, setup.roundupId, '2030-01-05', '09:00', 'UTC');
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('not_ready');
    const problems = refused.body.error.details.problems as { message: string; link: string | null }[];
    expect(problems).toEqual(status.body.readiness.problems);
    expect(problems.length).toBeGreaterThan(0);
    for (const problem of problems) {
      expect(refused.body.error.message).toContain(problem.message);
      expect(problem.link).toMatch(new RegExp(`^/roundups/${setup.roundupId}`));
    }
    // The matrix cell that is not accepted is among them, linked to the matrix.
    expect(problems.some((p) => /accept a run/.test(p.message) && p.link?.includes('tab=matrix'))).toBe(true);
    expect((await dataSource.getRepository(RoundupEntity).findOneByOrFail({ id: setup.roundupId })).state).toBe(
      'in-review',
    );
    expect(await dataSource.getRepository(JobEntity).countBy({ uniqueKey: publishJobKey(setup.roundupId) })).toBe(0);
  });

  it('the publish job refuses a roundup that gained a blocker after scheduling: back In review, nothing public', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, title } = await roundupInReview(app, editor, dataSource);
    const at = anHourAhead();
    await scheduleAt(editor, roundupId, at);
    // A signed-off section goes back to the writer after scheduling.
    await dataSource
      .getRepository(WriteUpSectionEntity)
      .update({ roundupId, sectionKey: 'conclusion' }, { reviewState: 'drafting' });

    await runnerAt(new ManualClock(at), roundupId).runDue();
    expect((await dataSource.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId })).state).toBe('in-review');
    expect(await dataSource.getRepository(RoundupPublicationEntity).countBy({ roundupId })).toBe(0);
    const refusal = await dataSource
      .getRepository(AuditEntryEntity)
      .findOneByOrFail({ subjectType: 'roundup', subjectId: String(roundupId), action: 'roundup.publish_refused' });
    expect((refusal.details as { problems: string[] }).problems.length).toBeGreaterThan(0);
    expect((await reader().get('/read')).text).not.toContain(title);
    const status = await editor.get(`/api/roundups/${roundupId}/publishing`);
    expect(status.body.schedule).toBeNull();
    // The blocker opens the section that went back to the writer.
    const conclusion = await dataSource
      .getRepository(WriteUpSectionEntity)
      .findOneByOrFail({ roundupId, sectionKey: 'conclusion' });
    expect(status.body.readiness.problems.map((p: { link: string }) => p.link)).toContain(
      `/roundups/${roundupId}/write-up/${conclusion.id}`,
    );
  });

  it('pages outside the snapshot read the publication: an edit shows only once an update is published', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, products } = await roundupInReview(app, editor, dataSource);
    const path = await publishByJob(editor, roundupId);
    const board = (await services.publishing.publishedModels()).find((m) => m.roundupId === roundupId) as unknown as {
      products: { productId: number; name: string; path: string }[];
      configurations: { id: number }[];
    };
    const first = board.products.find((p) => p.productId === products[0].productId) as { name: string; path: string };
    // Every page a query or a board builds on request: product page, estimate, compare, °F page, open data.
    const pages = [
      first.path,
      `${first.path}?power=230&room=21`,
      `/read/compare?product=${products[0].productId}&product=${products[1].productId}&configuration=${board.configurations[0].id}`,
      `${path}?unit=F`,
      `${path}/results.csv`,
      `${path}/analysis.json`,
    ];
    for (const page of pages) {
      const seen = await reader().get(page);
      expect(seen.status, page).toBe(200);
      // Every page and file names the board (the CSV one row per run of record, the JSON one entry per run).
      expect(seen.text, page).toContain(first.name);
    }

    // The board is renamed in the catalog after publication: readers still see the published name everywhere.
    const renamed = `Renamed ${products[0].productId}`;
    const edit = await editor.patch(`/api/catalog/products/${products[0].productId}`).send({ model: renamed });
    expect(edit.status, edit.text).toBe(200);
    for (const page of [...pages, path, '/read']) {
      const seen = await reader().get(page);
      expect(seen.status, page).toBe(200);
      expect(seen.text, page).not.toContain(renamed);
    }

    // An editor publishes it as an update: now every page shows it, and the results page logs the dated note.
    const note = 'The first board’s name follows its maker’s final listing.';
    const update = await editor.post(`/api/roundups/${roundupId}/publication-updates`).send({ kind: 'update', note });
    expect(update.status, update.text).toBe(201);
    const updatedAt = update.body.publications.at(-1).publishedAt as string;
    for (const page of pages) {
      // The renamed board's page has a new address; the old one leads there.
      const seen = await reader().get(page).redirects(2);
      expect(seen.status, page).toBe(200);
      expect(seen.text, page).toContain(renamed);
    }
    const results = await reader().get(update.body.publicPath as string);
    expect(results.text).toContain(renamed);
    expect(results.text).toContain(note);
    expect(results.text).toContain(`datetime="${updatedAt}"`);
  });

  it('photos and chart images are public by the publication record, not by the roundup state', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId, products } = await roundupInReview(app, editor, dataSource);
    const image = await sharp({ create: { width: 1000, height: 640, channels: 3, background: '#2a6f97' } })
      .png()
      .toBuffer();
    const uploaded = await editor
      .post(`/api/roundups/${roundupId}/entries/${products[0].entryId}/photos`)
      .attach('file', image, 'board.png')
      .field('kind', 'overview')
      .field('altText', 'The board from above');
    expect(uploaded.status, uploaded.text).toBe(201);
    const photoPath = `/read/photos/${uploaded.body.id}/480.webp`;
    const model = await buildPublishedRoundup(dataSource.manager, roundupId, { publishedAt: new Date() });

    // Marked Live in the database without a publication: still nothing public, photo and pages alike.
    await dataSource.getRepository(RoundupEntity).update({ id: roundupId }, { state: 'live' });
    for (const page of [photoPath, model.path, model.openData.csvPath, model.products[0].path]) {
      expect((await reader().get(page)).status, page).toBe(404);
    }
    await dataSource.getRepository(RoundupEntity).update({ id: roundupId }, { state: 'in-review' });

    await publishByJob(editor, roundupId);
    const photo = await reader().get(photoPath);
    expect(photo.status).toBe(200);
    expect(photo.headers['content-type']).toBe('image/webp');

    // The chart image approved before publication is frozen with it and is the page's Open Graph image.
    const published = (await services.publishing.publishedModels()).find(
      (m) => m.roundupId === roundupId,
    ) as unknown as {
      path: string;
      chartImages: { url: string }[];
    };
    expect(published.chartImages.length).toBeGreaterThan(0);
    const chart = await reader().get(published.chartImages[0].url);
    expect(chart.status).toBe(200);
    expect(chart.headers['content-type']).toBe('image/png');
    // PNG signature (ISO/IEC 15948, 5.2): 89 50 4E 47 0D 0A 1A 0A.
    expect((chart.body as Buffer).subarray(0, 8).toString('hex')).toBe('89504e470d0a1a0a');
    const page = await reader().get(published.path);
    expect(page.text).toContain(`<meta property="og:image" content="`);
    expect(page.text).toContain(`${published.chartImages[0].url}" />`);
    // An address that is not one of the frozen images is not found.
    expect((await reader().get(`${published.path}/charts/configuration-999999.png`)).status).toBe(404);
  });
});
