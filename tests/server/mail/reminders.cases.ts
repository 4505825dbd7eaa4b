import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ManualClock } from '../../../server/jobs/clock';
import { calendarDateIn } from '../../../shared/domain/planning/loan-overdue';
import { createTestUser, signedIn, testDataSource } from '../support/test-app';
import {
  sendAll,
  closeMailTestContext,
  createRoundup,
  mailTestContext,
  messagesTo,
  type MailTestContext,
} from './mail-support';

let ctx: MailTestContext;
beforeAll(async () => {
  ctx = await mailTestContext();
});
afterAll(async () => {
  await closeMailTestContext(ctx);
});

/** A vendor loan of a product in a roundup the editor made, due back on `returnBy`. */
async function loanDueOn(editorId: number, returnBy: string) {
  const ds = await testDataSource();
  const roundup = await createRoundup({ state: 'on-the-bench', createdBy: editorId, timeZone: 'Europe/Berlin' });
  const product: { insertId: number } = await ds.query(
    `INSERT INTO products (maker, model, category, platform, socket, chipset, form_factor)
     VALUES ('Quillfield', ?, 'motherboard', 'Helix-1700', 'HX1700', 'H17', 'ATX')`,
    [`Loaner ${randomBytes(3).toString('hex')}`],
  );
  const entry: { insertId: number } = await ds.query(
    "INSERT INTO roundup_entries (roundup_id, product_id, kind, position) VALUES (?, ?, 'tested', 1)",
    [roundup.id, product.insertId],
  );
  const sample: { insertId: number } = await ds.query(
    "INSERT INTO samples (roundup_entry_id, source, status, return_by) VALUES (?, 'vendor-loan', 'received', ?)",
    [entry.insertId, returnBy],
  );
  return sample.insertId;
}

const outboxFor = async (kind: string, sampleId: number) =>
  (await testDataSource()).query('SELECT id FROM mail_outbox WHERE idempotency_key LIKE ?', [
    `${kind}:sample:${sampleId}:%`,
  ]);

describe('staff reminders', () => {
  it('a loan due in three days yields one reminder however often the scan runs; overdue yields one more', async () => {
    const editor = await createTestUser('editor');
    const clock = new ManualClock('2026-03-02T09:00:00Z');
    // Three calendar days after the clock's date in the roundup's zone (the rule of shared/domain/planning/loan-overdue).
    const today = calendarDateIn('Europe/Berlin', clock.now());
    const returnBy = new Date(Date.parse(`${today}T00:00:00Z`) + 3 * 86_400_000).toISOString().slice(0, 10);
    const sampleId = await loanDueOn(editor.id, returnBy);

    for (let run = 0; run < 5; run++) {
      await ctx.services.staffMail.scanReminders(clock.now());
      clock.advance(10 * 60_000);
    }
    expect(await outboxFor('loan-due-soon', sampleId)).toHaveLength(1);
    await sendAll(ctx.services.mailSender);
    const mails = (await messagesTo(editor.email)).filter((m) => m.subject?.startsWith('Due back in three days'));
    expect(mails).toHaveLength(1);

    // The day after the return date has begun in Berlin: overdue, once.
    clock.set(`${returnBy}T23:30:00Z`);
    for (let run = 0; run < 3; run++) await ctx.services.staffMail.scanReminders(clock.now());
    expect(await outboxFor('loan-overdue', sampleId)).toHaveLength(1);
  });

  it('a person who turned a kind off in Account gets none of it', async () => {
    const editor = await createTestUser('editor');
    const { agent } = await signedIn(ctx.app, editor);
    const saved = await agent.put('/api/account/mail').send({ disabled: ['loan-due-soon'] });
    expect(saved.status).toBe(200);
    expect(saved.body.kinds.find((k: { kind: string }) => k.kind === 'loan-due-soon').enabled).toBe(false);
    const now = new Date('2026-04-01T08:00:00Z');
    const returnBy = new Date(Date.parse(`${calendarDateIn('Europe/Berlin', now)}T00:00:00Z`) + 3 * 86_400_000)
      .toISOString()
      .slice(0, 10);
    const sampleId = await loanDueOn(editor.id, returnBy);
    await ctx.services.staffMail.scanReminders(now);
    await sendAll(ctx.services.mailSender);
    const rows: { state: string }[] = await (
      await testDataSource()
    ).query('SELECT state FROM mail_outbox WHERE idempotency_key LIKE ?', [`loan-due-soon:sample:${sampleId}:%`]);
    expect(rows.map((r) => r.state)).toEqual(['suppressed']);
    expect(await messagesTo(editor.email)).toHaveLength(0);
  });
});
