import { describe, expect, it } from 'vitest';
import type { Client } from '../support/test-app';
import { signedIn, testApp } from '../support/test-app';
import { createRoundup } from '../planning/support/planning-fixtures';
import { roundupInWriting } from './support/write-up-fixtures';
import type { WriteUpDocument } from '../../../shared/schemas/write-up-document';

const paragraph = (text: string): WriteUpDocument => ({
  type: 'doc',
  content: [{ type: 'paragraph', content: [{ type: 'text', text }] }],
});

async function overview(agent: Client, roundupId: number) {
  const response = await agent.get(`/api/roundups/${roundupId}/write-up`);
  expect(response.status, response.text).toBe(200);
  return response.body as {
    editable: boolean;
    blocking: string[];
    sections: {
      id: number;
      kind: string;
      entryId: number | null;
      version: number;
      reviewState: string;
      title: string;
    }[];
  };
}

async function section(agent: Client, sectionId: number) {
  const response = await agent.get(`/api/write-up/sections/${sectionId}`);
  expect(response.status, response.text).toBe(200);
  return response.body as { version: number; content: WriteUpDocument; reviewState: string; title: string };
}

describe('write-up sections through the API', () => {
  it('when two people save the same version, then one save lands, the other gets 409 stale_version with the current text, and the refused text is kept as a revision', async () => {
    const app = await testApp();
    const { editor, writer, roundupId } = await roundupInWriting(app, { products: 1 });
    const intro = (await overview(writer.agent, roundupId)).sections.find((s) => s.kind === 'introduction')!;
    expect(intro.version).toBe(1);

    const [first, second] = await Promise.all([
      writer.agent
        .put(`/api/write-up/sections/${intro.id}`)
        .send({ baseVersion: 1, content: paragraph('The writer’s opening.') }),
      editor.agent
        .put(`/api/write-up/sections/${intro.id}`)
        .send({ baseVersion: 1, content: paragraph('The editor’s opening.') }),
    ]);
    const statuses = [first.status, second.status].sort();
    expect(statuses).toEqual([200, 409]);
    const refused = first.status === 409 ? first : second;
    const landed = first.status === 200 ? first : second;
    expect(refused.body.error.code).toBe('stale_version');
    expect(refused.body.error.details.current.version).toBe(2);
    expect(landed.body.version).toBe(2);

    // Nothing lost: the landed text is the section's, the refused one is a revision anyone can restore.
    const now = await section(writer.agent, intro.id);
    expect(now.content).toEqual(refused.body.error.details.current.content);
    const revisions = (await writer.agent.get(`/api/write-up/sections/${intro.id}/revisions`)).body.revisions as {
      id: number;
      kind: string;
    }[];
    const copy = revisions.find((r) => r.id === refused.body.error.details.refusedCopyRevisionId)!;
    expect(copy.kind).toBe('refused-copy');
    const copyDetail = await writer.agent.get(`/api/write-up/sections/${intro.id}/revisions/${copy.id}`);
    const texts = [JSON.stringify(now.content), JSON.stringify(copyDetail.body.content)].join(' ');
    expect(texts).toContain('The writer’s opening.');
    expect(texts).toContain('The editor’s opening.');

    // "Keep my copy": save again from the current version.
    const retry = await (first.status === 409 ? writer : editor).agent
      .put(`/api/write-up/sections/${intro.id}`)
      .send({ baseVersion: 2, content: copyDetail.body.content });
    expect(retry.status, retry.text).toBe(200);
    expect(retry.body.version).toBe(3);
  });

  it('a writer renames a section: the title is stored and revisioned like the text, checked, escaped in the preview and named in the readiness list', async () => {
    const app = await testApp();
    const { editor, writer, roundupId } = await roundupInWriting(app, { products: 1 });
    const product = (await overview(writer.agent, roundupId)).sections.find((s) => s.kind === 'product')!;
    const oldTitle = product.title;
    const title = 'Cool at stock <script>alert(1)</script> & quiet';

    const renamed = await writer.agent
      .put(`/api/write-up/sections/${product.id}`)
      .send({ baseVersion: 1, title: `  ${title}  `, content: paragraph('Runs cool.') });
    expect(renamed.status, renamed.text).toBe(200);
    expect(renamed.body).toMatchObject({ version: 2, title });
    expect((await section(editor.agent, product.id)).title).toBe(title);

    // An empty title or one with control characters is refused with the field named; nothing changes.
    for (const bad of ['   ', 'Line one\nline two', 'Bell\u0007']) {
      const refused = await writer.agent
        .put(`/api/write-up/sections/${product.id}`)
        .send({ baseVersion: 2, title: bad, content: paragraph('Runs cool.') });
      expect(refused.status, bad).toBe(400);
      expect(refused.body.error.fields.title).toBeTruthy();
    }
    // A title change alone is a new version, kept in the history with the title it had; restoring brings it back.
    const retitled = await writer.agent
      .put(`/api/write-up/sections/${product.id}`)
      .send({ baseVersion: 2, title: 'Second title', content: paragraph('Runs cool.') });
    expect(retitled.body.version).toBe(3);
    const revisions = (await writer.agent.get(`/api/write-up/sections/${product.id}/revisions`)).body.revisions as {
      id: number;
      kind: string;
      title: string;
    }[];
    expect(revisions.map((r) => r.title)).toEqual(expect.arrayContaining([oldTitle, 'Second title']));
    const prefill = revisions.find((r) => r.kind === 'prefill')!;
    const restored = await writer.agent
      .post(`/api/write-up/sections/${product.id}/revisions/${prefill.id}/restore`)
      .send({ baseVersion: 3 });
    expect(restored.status, restored.text).toBe(200);
    expect(restored.body.title).toBe(oldTitle);
    const again = await writer.agent
      .put(`/api/write-up/sections/${product.id}`)
      .send({ baseVersion: 4, title, content: paragraph('Runs cool.') });
    expect(again.status, again.text).toBe(200);

    // The preview shows it as text, never as markup; the write-up's blockers name the section by its new title.
    const preview = await writer.agent.get(`/api/roundups/${roundupId}/write-up/preview`);
    expect(preview.status).toBe(200);
    expect(preview.text).toContain('Cool at stock &lt;script&gt;alert(1)&lt;/script&gt; &amp; quiet</h2>');
    expect(preview.text).not.toContain('<script>alert(1)');
    const readiness = await editor.agent.get(`/api/roundups/${roundupId}/readiness`);
    expect(readiness.body.blocking.map((b: { label: string }) => b.label)).toContain(
      `Write-up section “${title}” is Drafting, not signed off.`,
    );
  });

  it('when a write-up section blocks readiness, then its line in the readiness list opens that section, not the overview', async () => {
    const app = await testApp();
    const { editor, roundupId } = await roundupInWriting(app, { products: 2 });
    const sections = (await overview(editor.agent, roundupId)).sections;
    const readiness = await editor.agent.get(`/api/roundups/${roundupId}/readiness`);
    expect(readiness.status, readiness.text).toBe(200);
    const sectionLines = (readiness.body.blocking as { kind: string; label: string; link: string | null }[]).filter(
      (blocker) => blocker.kind === 'section',
    );
    // Every section starts in Drafting, so each one blocks once.
    expect(sectionLines).toHaveLength(sections.length);
    for (const section of sections) {
      expect(sectionLines).toContainEqual(
        expect.objectContaining({
          label: `Write-up section “${section.title}” is Drafting, not signed off.`,
          link: `/roundups/${roundupId}/write-up/${section.id}`,
        }),
      );
    }
  });

  it('when a revision is restored, then it becomes a new version and the history keeps every step', async () => {
    const app = await testApp();
    const { writer, roundupId } = await roundupInWriting(app, { products: 1 });
    const conclusion = (await overview(writer.agent, roundupId)).sections.find((s) => s.kind === 'conclusion')!;
    const put = (baseVersion: number, text: string) =>
      writer.agent.put(`/api/write-up/sections/${conclusion.id}`).send({ baseVersion, content: paragraph(text) });
    expect((await put(1, 'First take on the verdicts.')).status).toBe(200);
    const revisionsAfterFirst = (await writer.agent.get(`/api/write-up/sections/${conclusion.id}/revisions`)).body
      .revisions as { id: number; version: number }[];
    const firstTake = revisionsAfterFirst.find((r) => r.version === 2)!;
    // A restore or another author starts a new revision; the same author's quick saves share one.
    expect((await put(2, 'Second take, shorter.')).status).toBe(200);

    const restored = await writer.agent
      .post(`/api/write-up/sections/${conclusion.id}/revisions/${revisionsAfterFirst.at(-1)!.id}/restore`)
      .send({ baseVersion: 3 });
    expect(restored.status, restored.text).toBe(200);
    expect(restored.body.version).toBe(4);
    expect((await section(writer.agent, conclusion.id)).content).toEqual({
      type: 'doc',
      content: [{ type: 'paragraph' }],
    });

    const history = (await writer.agent.get(`/api/write-up/sections/${conclusion.id}/revisions`)).body.revisions as {
      kind: string;
      version: number;
      restoredFromId: number | null;
    }[];
    expect(history[0]).toMatchObject({ kind: 'restore', version: 4 });
    expect(history.map((r) => r.kind)).toContain('prefill');
    expect(firstTake).toBeDefined();

    const stale = await writer.agent
      .post(`/api/write-up/sections/${conclusion.id}/revisions/${firstTake.id}/restore`)
      .send({ baseVersion: 3 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale_version');
  });

  it('a writer asks for review, an editor signs off or hands back; editing a signed-off section sends it back to drafting; a writer cannot sign off', async () => {
    const app = await testApp();
    const { editor, writer, roundupId } = await roundupInWriting(app, { products: 1 });
    const intro = (await overview(writer.agent, roundupId)).sections.find((s) => s.kind === 'introduction')!;

    const asked = await writer.agent.post(`/api/write-up/sections/${intro.id}/review-request`);
    expect(asked.status, asked.text).toBe(200);
    expect(asked.body.reviewState).toBe('with-editor');
    expect((await writer.agent.post(`/api/write-up/sections/${intro.id}/sign-off`)).status).toBe(403);
    const twice = await writer.agent.post(`/api/write-up/sections/${intro.id}/review-request`);
    expect(twice.status).toBe(422);

    const back = await editor.agent
      .post(`/api/write-up/sections/${intro.id}/hand-back`)
      .send({ note: 'Open with the throttling result, it is the story.' });
    expect(back.status, back.text).toBe(200);
    expect(back.body).toMatchObject({ reviewState: 'drafting', openThreadCount: 1 });

    await writer.agent.post(`/api/write-up/sections/${intro.id}/review-request`);
    const signed = await editor.agent.post(`/api/write-up/sections/${intro.id}/sign-off`);
    expect(signed.body.reviewState).toBe('signed-off');

    const edited = await writer.agent
      .put(`/api/write-up/sections/${intro.id}`)
      .send({ baseVersion: signed.body.version, content: paragraph('One more sentence.') });
    expect(edited.status, edited.text).toBe(200);
    expect(edited.body.reviewState).toBe('drafting');

    const blocking = (await overview(editor.agent, roundupId)).blocking;
    expect(blocking).toContain('Write-up section “Introduction” is Drafting, not signed off.');
    expect(blocking).toContain('Write-up section “Introduction” has 1 open comment thread.');
  });

  it('comments thread one level deep, resolve and reopen; a reply reopens a resolved thread; testers read but do not comment', async () => {
    const app = await testApp();
    const { editor, writer, tester, roundupId } = await roundupInWriting(app, { products: 1 });
    const product = (await overview(writer.agent, roundupId)).sections.find((s) => s.kind === 'product')!;
    const base = `/api/write-up/sections/${product.id}/comments`;

    const thread = await editor.agent.post(base).send({ body: 'Say which heatsink the probe sat under.' });
    expect(thread.status, thread.text).toBe(201);
    const reply = await writer.agent
      .post(base)
      .send({ body: 'Added: the one above the rear I/O.', parentId: thread.body.id });
    expect(reply.status).toBe(201);
    expect(reply.body.replies).toHaveLength(1);
    // A reply to a reply joins the same thread.
    const nested = await editor.agent.post(base).send({ body: 'Thanks.', parentId: reply.body.replies[0].id });
    expect(nested.body.id).toBe(thread.body.id);
    expect(nested.body.replies).toHaveLength(2);

    const resolved = await writer.agent.post(`/api/write-up/comments/${thread.body.id}/resolve`);
    expect(resolved.status, resolved.text).toBe(200);
    expect(resolved.body.resolvedBy.id).toBe(writer.user.id);
    expect((await overview(editor.agent, roundupId)).sections.find((s) => s.id === product.id)).toMatchObject({
      reviewState: 'drafting',
    });

    const replyAfter = await editor.agent.post(base).send({ body: 'One more thing.', parentId: thread.body.id });
    expect(replyAfter.body.resolvedAt).toBeNull();
    await editor.agent.post(`/api/write-up/comments/${thread.body.id}/resolve`);
    const reopened = await editor.agent.post(`/api/write-up/comments/${thread.body.id}/reopen`);
    expect(reopened.body.resolvedAt).toBeNull();
    const replyId = reopened.body.replies[0].id as number;
    expect((await editor.agent.post(`/api/write-up/comments/${replyId}/resolve`)).status).toBe(422);

    expect((await tester.agent.get(base)).status).toBe(200);
    expect((await tester.agent.post(base).send({ body: 'A tester’s note.' })).status).toBe(403);
    const list = await writer.agent.get(base);
    expect(list.body.threads).toHaveLength(1);
  });

  it('when the roundup is still in Planning, then its write-up has no sections yet and says why', async () => {
    const app = await testApp();
    const editor = await signedIn(app, 'editor');
    const { roundupId } = await createRoundup(editor.agent, { configurations: 1 });
    const response = await editor.agent.get(`/api/roundups/${roundupId}/write-up`);
    expect(response.status, response.text).toBe(200);
    expect(response.body).toMatchObject({ sections: [], editable: false });
    expect(response.body.lockedReason).toMatch(/opens when the roundup reaches Writing/);
    expect(response.body.blocking).toEqual([
      'The write-up has not been started: open Write-up to create its sections.',
    ]);
  });
});
