import { describe, expect, it } from 'vitest';
import { AuditEntryEntity } from '../../../server/entities/audit-entry.entity';
import { signedIn, testApp, testDataSource, type Client } from '../support/test-app';
import { createBenchProfile, createLoadConfiguration, tag } from './support/planning-fixtures';

// Benchwire's own rules for named staff records, no outside source: one name per record, every write audited.
const kinds: {
  path: string;
  listKey: string;
  subject: string;
  label: string;
  create: (editor: Client) => Promise<number>;
}[] = [
  {
    path: '/api/bench-profiles',
    listKey: 'benchProfiles',
    subject: 'bench_profile',
    label: 'bench profile',
    create: createBenchProfile,
  },
  {
    path: '/api/load-configurations',
    listKey: 'loadConfigurations',
    subject: 'load_configuration',
    label: 'load configuration',
    create: (editor) => createLoadConfiguration(editor),
  },
  {
    path: '/api/benches',
    listKey: 'benches',
    subject: 'bench',
    label: 'bench',
    create: async (editor) => {
      const response = await editor.post('/api/benches').send({ name: `Bench ${tag()}` });
      expect(response.status, response.text).toBe(201);
      return response.body.id as number;
    },
  },
];

/** The records of one kind as the list shows them (archived ones too where a kind can be archived). */
async function listed(editor: Client, path: string, listKey: string, query = '') {
  const response = await editor.get(`${path}${query}`);
  expect(response.status, response.text).toBe(200);
  return response.body[listKey] as ({ id: number; name: string } & Record<string, unknown>)[];
}

describe.each(kinds)('named records: $label', ({ path, listKey, subject, label, create }) => {
  const read = async (editor: Client, id: number) => {
    const query = listKey === 'benches' ? '' : '?archived=include';
    const record = (await listed(editor, path, listKey, query)).find((r) => r.id === id);
    expect(record).toBeDefined();
    return record!;
  };

  it('refuses a name another record has, on create and on rename, naming the field', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const first = await create(editor);
    const second = await create(editor);
    const { name } = await read(editor, first);
    const taken = { error: { code: 'name_taken', fields: { name: `Another ${label} already has this name.` } } };

    const renamed = await editor.patch(`${path}/${second}`).send({ name });
    expect(renamed.status).toBe(409);
    expect(renamed.body).toMatchObject(taken);

    const copy = await read(editor, first);
    const fields = Object.fromEntries(
      Object.entries(copy).filter(
        ([key]) =>
          !['id', 'createdAt', 'updatedAt', 'roundupCount', 'archived', 'benchProfile', 'active'].includes(key),
      ),
    );
    const created = await editor.post(path).send(fields);
    expect(created.status, created.text).toBe(409);
    expect(created.body).toMatchObject(taken);

    const missing = await editor.patch(`${path}/999999999`).send({ name: `Other ${tag()}` });
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toBe(`That ${label} was not found.`);
  });

  it('audits the creation and each change, and leaves no entry for an edit that changes nothing', async () => {
    const app = await testApp();
    const { agent: editor, user } = await signedIn(app, 'editor');
    const id = await create(editor);
    const { name } = await read(editor, id);
    await editor.patch(`${path}/${id}`).send({ name });
    const newName = `Renamed ${tag()}`;
    expect((await editor.patch(`${path}/${id}`).send({ name: newName })).status).toBe(200);

    const entries = await (
      await testDataSource()
    )
      .getRepository(AuditEntryEntity)
      .find({ where: { subjectType: subject, subjectId: String(id) }, order: { id: 'ASC' } });
    expect(entries.map((e) => [e.action, e.actorId])).toEqual([
      [`${subject}.created`, user.id],
      [`${subject}.updated`, user.id],
    ]);
    expect(entries[0].details).toEqual({ name });
    expect(entries[1].details).toEqual({ name: { from: name, to: newName } });
  });
});

describe.each(kinds.slice(0, 2))('archiving: $label', ({ path, listKey, create }) => {
  it('hides an archived record from the default list, shows it with archived=only, and restores it', async () => {
    const app = await testApp();
    const { agent: editor } = await signedIn(app, 'editor');
    const id = await create(editor);
    const ids = async (query: string) => (await listed(editor, path, listKey, query)).map((record) => record.id);

    const archived = await editor.patch(`${path}/${id}`).send({ archived: true });
    expect(archived.status).toBe(200);
    expect(archived.body.archived).toBe(true);
    expect(await ids('')).not.toContain(id);
    expect(await ids('?archived=only')).toContain(id);

    expect((await editor.patch(`${path}/${id}`).send({ archived: false })).body.archived).toBe(false);
    expect(await ids('')).toContain(id);
    expect(await ids('?archived=only')).not.toContain(id);
  });
});
