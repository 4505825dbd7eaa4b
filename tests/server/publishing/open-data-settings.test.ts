import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import type { Services } from '../../../server/compose-services';
import { createJobRegistry } from '../../../server/jobs/all';
import { ManualClock } from '../../../server/jobs/clock';
import { JobRunner } from '../../../server/jobs/job-runner';
import { publishJobKey } from '../../../server/services/publishing.service';
import { signedIn, TEST_HOST, type TestApp } from '../support/test-app';
import { publishingContext, roundupInReview, scheduleAt } from './support/publishing-fixtures';

let dataSource: DataSource;
let services: Services;
let app: TestApp;
const reader = (path: string) => request(app).get(path).set('Host', TEST_HOST);

beforeAll(async () => {
  ({ dataSource, services, app } = await publishingContext());
});

describe('open-data settings', { timeout: 120_000 }, () => {
  it('editors and admins set the raw-files switch and the licence line; the published page follows at once', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId } = await roundupInReview(app, editor, dataSource);
    const at = new Date(Math.ceil((Date.now() + 3_600_000) / 1000) * 1000);
    await scheduleAt(editor, roundupId, at);
    await new JobRunner(dataSource, createJobRegistry(services), {
      clock: new ManualClock(at),
      log: { error: () => {}, warn: () => {} },
      onlyUniqueKeys: [publishJobKey(roundupId)],
    }).runDue();
    const path = (await services.publishing.status(roundupId)).publicPath as string;

    const shown = await editor.get(`/api/roundups/${roundupId}/open-data`);
    expect(shown.status, shown.text).toBe(200);
    // Runs entered by hand have no logger file: nothing would be offered.
    expect(shown.body).toMatchObject({ roundupId, rawFilesAllowed: false, rawFileCount: 0 });

    const licence = `Results by the test outlet ${roundupId}, reuse with credit.`;
    const saved = await editor.put(`/api/roundups/${roundupId}/open-data`).send({ rawFilesAllowed: true, licence });
    expect(saved.status, saved.text).toBe(200);
    expect(saved.body).toMatchObject({ rawFilesAllowed: true, licence });
    // The snapshot page and the open-data file show the new line without an update being published.
    expect((await reader(path)).text).toContain(licence);
    expect((await reader(`${path}/analysis.json`)).body.licence).toBe(licence);
    expect((await services.publishing.status(roundupId)).publications).toHaveLength(1);

    // What is wrong is said per field, and nothing is saved.
    const empty = await editor
      .put(`/api/roundups/${roundupId}/open-data`)
      .send({ rawFilesAllowed: false, licence: ' ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.licence).toBeTruthy();
    expect((await editor.get(`/api/roundups/${roundupId}/open-data`)).body.licence).toBe(licence);

    const { agent: admin } = await signedIn(app, 'admin');
    const byAdmin = await admin.put(`/api/roundups/${roundupId}/open-data`).send({ rawFilesAllowed: false, licence });
    expect(byAdmin.status, byAdmin.text).toBe(200);
    expect(byAdmin.body.rawFilesAllowed).toBe(false);

    for (const role of ['writer', 'tester'] as const) {
      const { agent } = await signedIn(app, role);
      expect((await agent.get(`/api/roundups/${roundupId}/open-data`)).status, role).toBe(403);
      const denied = await agent.put(`/api/roundups/${roundupId}/open-data`).send({ rawFilesAllowed: true, licence });
      expect(denied.status, role).toBe(403);
      expect(denied.body.error.code).toBe('forbidden');
    }
  });
});
