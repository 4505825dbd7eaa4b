import { In, type DataSource, type EntityManager } from 'typeorm';
import {
  MailCategoryEntity,
  MailingEntity,
  MailSuppressionEntity,
  SubscriberCategoryEntity,
  SubscriberEntity,
} from '../entities/mail.entities';
import { RoundupEntity } from '../entities/roundup.entity';
import { AppError, invalid, notFound } from '../errors';
import { hashConfirmToken, manageToken, newConfirmToken, readManageToken, type LinkSecret } from '../mail/link-secret';
import { enqueueMail, enqueueRoundupMailing } from '../mail/outbox';
import { recordAction } from './audit.service';
import type { CurrentUser } from '../../shared/schemas/auth';
import type {
  MailCategory,
  Mailing,
  MailingCounts,
  RoundupMailings,
  SignUpRequest,
  StaffMailCategoryList,
} from '../../shared/schemas/subscribers';
import { mailCategoryInputSchema } from '../../shared/schemas/subscribers';
import type { z } from 'zod';

const CONFIRM_HOURS = 48;
export const signUpAnswer = {
  status: 'check-your-inbox' as const,
  message:
    'Thank you. If the address can receive our mail, a message is on its way: open its link to confirm. Nothing else is sent until you do.',
};

function toCategory(row: MailCategoryEntity): MailCategory {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    matchProductClass: row.matchProductClass,
    matchPlatform: row.matchPlatform,
    position: row.position,
  };
}

export interface SubscriberSettings {
  siteUrl: string;
  outletName: string;
  /** Whether a relay is configured, so queued mail goes out. */
  sending: boolean;
}

/** What a subscriber sees and may change through their signed link. */
export interface SubscriberView {
  subscriber: SubscriberEntity;
  categoryIds: number[];
  token: string;
}

/**
 * Readers' subscriptions: double opt-in sign-up, confirmation, self-service through a signed link (preferences,
 * export, erase, unsubscribe), the editors' list of categories, and the mailings of a roundup.
 */
export class SubscribersService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly secret: LinkSecret,
    private readonly settings: SubscriberSettings,
  ) {}

  get outletName(): string {
    return this.settings.outletName;
  }

  async publicCategories(): Promise<MailCategory[]> {
    const rows = await this.dataSource
      .getRepository(MailCategoryEntity)
      .find({ order: { position: 'ASC', name: 'ASC' } });
    return rows.map(toCategory);
  }

  /**
   * A sign-up. The answer is the same whatever happens, so it never tells whether an address is known: a new or
   * pending address gets a confirmation link; a confirmed one keeps its subscription (nothing is downgraded) and gets
   * a note with its self-service link; an unsubscribed one starts over as pending. A filled-in honeypot does nothing.
   */
  async signUp(input: SignUpRequest, now = new Date()): Promise<typeof signUpAnswer> {
    if (input.website && input.website.trim() !== '') return signUpAnswer;
    const known = await this.dataSource
      .getRepository(MailCategoryEntity)
      .findBy({ id: In([...new Set(input.categoryIds)]) });
    if (known.length === 0) {
      throw invalid('Choose at least one subject from the list.', { categoryIds: 'Choose at least one subject.' });
    }
    const categoryIds = known.map((c) => c.id);
    const addressHash = await this.secret.addressHash(input.email);
    await this.dataSource.transaction(async (manager) => {
      const suppression = await manager.getRepository(MailSuppressionEntity).findOneBy({ addressHash });
      // Bounced or complained: never mailed again, not even a confirmation.
      if (suppression && suppression.reason !== 'erased') return;
      const repo = manager.getRepository(SubscriberEntity);
      let subscriber = await repo.findOne({ where: { email: input.email }, lock: { mode: 'pessimistic_write' } });
      if (subscriber?.status === 'confirmed') {
        // One note per hour at most, however often the form is sent.
        const hour = now.toISOString().slice(0, 13);
        await enqueueMail(manager, {
          key: `subscriber-notice:${subscriber.id}:${hour}`,
          kind: 'subscriber-notice',
          subscriberId: subscriber.id,
          payload: {
            subject: `You are already subscribed to ${this.settings.outletName}`,
            text: [
              `Someone (perhaps you) asked to subscribe this address to ${this.settings.outletName}. It is already subscribed, and nothing has changed.`,
              `To change your subjects, export your data or unsubscribe: ${this.manageUrl(await manageToken(this.secret, subscriber))}`,
            ].join('\n\n'),
          },
        });
        return;
      }
      const { token, hash } = newConfirmToken();
      const expires = new Date(now.getTime() + CONFIRM_HOURS * 3_600_000);
      if (!subscriber) {
        subscriber = await repo.save(
          repo.create({
            email: input.email,
            status: 'pending',
            confirmTokenHash: hash,
            confirmExpiresAt: expires,
            createdAt: now,
            updatedAt: now,
          }),
        );
      } else {
        await repo.update(
          { id: subscriber.id },
          { status: 'pending', confirmTokenHash: hash, confirmExpiresAt: expires, updatedAt: now },
        );
      }
      await this.setCategories(manager, subscriber.id, categoryIds);
      await enqueueMail(manager, {
        key: `confirm:${subscriber.id}:${hash.slice(0, 16)}`,
        kind: 'confirm',
        subscriberId: subscriber.id,
        payload: {
          subject: `Confirm your subscription to ${this.settings.outletName}`,
          text: [
            `Please confirm that you want ${this.settings.outletName}'s mail about: ${known.map((c) => c.name).join(', ')}.`,
            `Confirm: ${this.settings.siteUrl}/subscribe/confirm/${token}`,
            `The link works once and for ${CONFIRM_HOURS} hours. If you did not ask for this, ignore this message: nothing more will be sent.`,
          ].join('\n\n'),
        },
      });
    });
    return signUpAnswer;
  }

  /** Whether a confirmation link is still good (for the page that asks to press Confirm). */
  async confirmationOpen(token: string, now = new Date()): Promise<boolean> {
    const subscriber = await this.dataSource
      .getRepository(SubscriberEntity)
      .findOneBy({ confirmTokenHash: hashConfirmToken(token) });
    return Boolean(subscriber && subscriber.status === 'pending' && subscriber.confirmExpiresAt! > now);
  }

  /** Confirms a pending address: the link works once and until it expires. Returns the self-service token. */
  async confirm(token: string, now = new Date()): Promise<string> {
    return this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(SubscriberEntity);
      const subscriber = await repo.findOne({
        where: { confirmTokenHash: hashConfirmToken(token) },
        lock: { mode: 'pessimistic_write' },
      });
      if (!subscriber || subscriber.status !== 'pending' || !subscriber.confirmExpiresAt) {
        throw new AppError('confirm_link_used', 410, 'This confirmation link has been used or replaced.');
      }
      if (subscriber.confirmExpiresAt <= now) {
        throw new AppError('confirm_link_expired', 410, 'This confirmation link has expired: sign up again.');
      }
      await repo.update(
        { id: subscriber.id },
        { status: 'confirmed', confirmedAt: now, confirmTokenHash: null, confirmExpiresAt: null, updatedAt: now },
      );
      // An erased reader who signs up and confirms again is welcome back.
      await manager
        .getRepository(MailSuppressionEntity)
        .delete({ addressHash: await this.secret.addressHash(subscriber.email), reason: 'erased' });
      return manageToken(this.secret, subscriber);
    });
  }

  /** The subscriber a self-service token names, or null when forged, outdated or erased. */
  async view(token: string, manager: EntityManager = this.dataSource.manager): Promise<SubscriberView | null> {
    const read = await readManageToken(this.secret, token);
    if (!read) return null;
    const subscriber = await manager.getRepository(SubscriberEntity).findOneBy({ id: read.subscriberId });
    if (!subscriber || subscriber.linkVersion !== read.linkVersion) return null;
    const links = await manager.getRepository(SubscriberCategoryEntity).findBy({ subscriberId: subscriber.id });
    return { subscriber, categoryIds: links.map((l) => l.categoryId), token };
  }

  private async requireView(token: string, manager?: EntityManager): Promise<SubscriberView> {
    const view = await this.view(token, manager);
    if (!view) throw new AppError('link_invalid', 404, 'This link does not open a subscription (any more).');
    return view;
  }

  async updatePreferences(token: string, categoryIds: number[], now = new Date()) {
    return this.dataSource.transaction(async (manager) => {
      const view = await this.requireView(token, manager);
      const known = categoryIds.length
        ? await manager.getRepository(MailCategoryEntity).findBy({ id: In([...new Set(categoryIds)]) })
        : [];
      if (known.length === 0) {
        throw invalid('Choose at least one subject, or unsubscribe instead.', {
          categoryIds: 'Choose at least one subject.',
        });
      }
      await this.setCategories(
        manager,
        view.subscriber.id,
        known.map((c) => c.id),
      );
      await manager.getRepository(SubscriberEntity).update({ id: view.subscriber.id }, { updatedAt: now });
    });
  }

  /** One-click (RFC 8058) or the page's button: no more mailings. Idempotent. */
  async unsubscribe(token: string, now = new Date()): Promise<boolean> {
    return this.dataSource.transaction(async (manager) => {
      const view = await this.view(token, manager);
      if (!view) return false;
      if (view.subscriber.status !== 'unsubscribed') {
        await manager
          .getRepository(SubscriberEntity)
          .update(
            { id: view.subscriber.id },
            { status: 'unsubscribed', unsubscribedAt: now, confirmTokenHash: null, confirmExpiresAt: null },
          );
      }
      return true;
    });
  }

  /** Everything kept about the subscriber, as JSON they can download. */
  async export(token: string) {
    const view = await this.requireView(token);
    const categories = view.categoryIds.length
      ? await this.dataSource.getRepository(MailCategoryEntity).findBy({ id: In(view.categoryIds) })
      : [];
    const mail: { kind: string; state: string; created_at: Date; sent_at: Date | null }[] = await this.dataSource.query(
      'SELECT kind, state, created_at, sent_at FROM mail_outbox WHERE subscriber_id = ? ORDER BY id',
      [view.subscriber.id],
    );
    const s = view.subscriber;
    return {
      exportedAt: new Date().toISOString(),
      outlet: this.settings.outletName,
      email: s.email,
      status: s.status,
      subscribedAt: s.createdAt.toISOString(),
      confirmedAt: s.confirmedAt?.toISOString() ?? null,
      unsubscribedAt: s.unsubscribedAt?.toISOString() ?? null,
      categories: categories.map((c) => c.name),
      mail: mail.map((m) => ({
        kind: m.kind,
        state: m.state,
        queuedAt: new Date(m.created_at).toISOString(),
        sentAt: m.sent_at ? new Date(m.sent_at).toISOString() : null,
      })),
    };
  }

  /** Erases the subscriber: the address and its history are gone; a salted hash stays so it is never mailed again. */
  async erase(token: string, now = new Date()) {
    await this.dataSource.transaction(async (manager) => {
      const view = await this.requireView(token, manager);
      await manager
        .createQueryBuilder()
        .insert()
        .into(MailSuppressionEntity)
        .orIgnore()
        .values({ addressHash: await this.secret.addressHash(view.subscriber.email), reason: 'erased', createdAt: now })
        .execute();
      // Sent rows keep their counts for the mailing's progress but lose the link to the person.
      await manager.query(
        "UPDATE mail_outbox SET subscriber_id = NULL, recipient = NULL, payload = NULL, state = IF(state IN ('queued','deferred'), 'suppressed', state) WHERE subscriber_id = ?",
        [view.subscriber.id],
      );
      await manager.getRepository(SubscriberEntity).delete({ id: view.subscriber.id });
    });
  }

  manageUrl(token: string) {
    return `${this.settings.siteUrl}/subscribe/manage/${token}`;
  }

  private async setCategories(manager: EntityManager, subscriberId: number, categoryIds: number[]) {
    const repo = manager.getRepository(SubscriberCategoryEntity);
    await repo.delete({ subscriberId });
    if (categoryIds.length) await repo.insert(categoryIds.map((categoryId) => ({ subscriberId, categoryId })));
  }

  // ---- Staff: the categories list and mailings ------------------------------------------------------------------

  async staffCategories(): Promise<StaffMailCategoryList> {
    const categories = await this.publicCategories();
    const counts: { category_id: number; n: string }[] = await this.dataSource.query(
      `SELECT sc.category_id, COUNT(*) AS n FROM subscriber_categories sc
         JOIN subscribers s ON s.id = sc.subscriber_id AND s.status = 'confirmed' GROUP BY sc.category_id`,
    );
    const byCategory = new Map(counts.map((c) => [Number(c.category_id), Number(c.n)]));
    const statuses: { status: string; n: string }[] = await this.dataSource.query(
      'SELECT status, COUNT(*) AS n FROM subscribers GROUP BY status',
    );
    const status = (name: string) => Number(statuses.find((s) => s.status === name)?.n ?? 0);
    return {
      categories: categories.map((c) => ({ ...c, confirmedSubscribers: byCategory.get(c.id) ?? 0 })),
      subscribers: { pending: status('pending'), confirmed: status('confirmed'), unsubscribed: status('unsubscribed') },
    };
  }

  async saveCategory(
    actor: CurrentUser,
    id: number | null,
    input: z.output<typeof mailCategoryInputSchema>,
  ): Promise<MailCategory> {
    return this.dataSource.transaction(async (manager) => {
      const repo = manager.getRepository(MailCategoryEntity);
      const clash = await repo.findOneBy({ name: input.name });
      if (clash && clash.id !== id) {
        throw new AppError('category_name_taken', 409, `A subject called “${input.name}” exists already.`, {
          name: 'Choose another name.',
        });
      }
      let row: MailCategoryEntity;
      if (id === null) {
        const last = await repo.maximum('position');
        row = await repo.save(
          repo.create({ ...input, position: input.position ?? (last ?? 0) + 1, createdAt: new Date() }),
        );
      } else {
        const found = await repo.findOneBy({ id });
        if (!found) throw notFound('That subject');
        await repo.update({ id }, { ...input, position: input.position ?? found.position });
        row = await repo.findOneByOrFail({ id });
      }
      const action = id === null ? 'mail_category.created' : 'mail_category.updated';
      await recordAction(manager, actor, action, ['mail_category', row.id], { name: row.name });
      return toCategory(row);
    });
  }

  async deleteCategory(actor: CurrentUser, id: number): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const found = await manager.getRepository(MailCategoryEntity).findOneBy({ id });
      if (!found) throw notFound('That subject');
      await manager.getRepository(MailCategoryEntity).delete({ id });
      await recordAction(manager, actor, 'mail_category.deleted', ['mail_category', id], { name: found.name });
    });
  }

  async roundupMailings(roundupId: number): Promise<RoundupMailings> {
    const roundup = await this.dataSource.getRepository(RoundupEntity).findOneBy({ id: roundupId });
    if (!roundup) throw notFound('That roundup');
    const mailings = await this.dataSource
      .getRepository(MailingEntity)
      .find({ where: { roundupId }, order: { id: 'DESC' } });
    const counts = await mailingCounts(
      this.dataSource.manager,
      mailings.map((m) => m.id),
    );
    return {
      sending: this.settings.sending,
      mailings: mailings.map((m): Mailing => ({
        id: m.id,
        kind: m.kind,
        note: m.note,
        createdAt: m.createdAt.toISOString(),
        counts: counts.get(m.id) ?? emptyCounts(),
      })),
    };
  }

  /** An update or correction of a live roundup, mailed because an editor chose to. */
  async createMailing(actor: CurrentUser, roundupId: number, kind: 'update' | 'correction', note: string) {
    await this.dataSource.transaction(async (manager) => {
      const roundup = await manager
        .getRepository(RoundupEntity)
        .findOne({ where: { id: roundupId }, lock: { mode: 'pessimistic_write' } });
      if (!roundup) throw notFound('That roundup');
      if (roundup.state !== 'live' && roundup.state !== 'updated') {
        throw new AppError('roundup_not_live', 422, 'Only a live roundup’s updates and corrections can be mailed.');
      }
      const { mailingId, queued } = await enqueueRoundupMailing(manager, roundupId, {
        kind,
        note,
        actorId: actor.id,
      });
      await recordAction(manager, actor, 'roundup.mailing_queued', ['roundup', roundupId], {
        mailingId,
        kind,
        recipients: queued,
      });
    });
    return this.roundupMailings(roundupId);
  }

  /** The roundup's go-live mail, to the editor alone, before it goes to anyone else. */
  async sendTest(actor: CurrentUser, roundupId: number, now = new Date()) {
    const roundup = await this.dataSource.getRepository(RoundupEntity).findOneBy({ id: roundupId });
    if (!roundup) throw notFound('That roundup');
    await this.dataSource.transaction((manager) =>
      enqueueMail(manager, {
        key: `test:${roundupId}:user:${actor.id}:${now.getTime()}`,
        kind: 'test',
        userId: actor.id,
        recipient: actor.email,
        payload: { subject: '', text: '', roundupId },
      }),
    );
    return { sentTo: actor.email };
  }

  /** Bounces and complaints a real relay reports: permanent bounces and complaints suppress the address. */
  async recordEvents(events: { type: 'bounce' | 'complaint'; email: string; permanent?: boolean }[]) {
    let suppressed = 0;
    for (const event of events) {
      if (event.type === 'bounce' && !event.permanent) continue;
      const result = await this.dataSource
        .createQueryBuilder()
        .insert()
        .into(MailSuppressionEntity)
        .orIgnore()
        .values({
          addressHash: await this.secret.addressHash(event.email),
          reason: event.type === 'complaint' ? 'complained' : 'bounced',
          createdAt: new Date(),
        })
        .updateEntity(false)
        .execute();
      if ((result.raw as { affectedRows?: number }).affectedRows) suppressed += 1;
      if (event.type === 'complaint') {
        await this.dataSource
          .getRepository(SubscriberEntity)
          .update({ email: event.email }, { status: 'unsubscribed', unsubscribedAt: new Date() });
      }
    }
    return { received: events.length, suppressed };
  }
}

export function emptyCounts(): MailingCounts {
  return { queued: 0, sending: 0, sent: 0, deferred: 0, failed: 0, suppressed: 0, total: 0 };
}

export async function mailingCounts(manager: EntityManager, mailingIds: number[]) {
  const result = new Map<number, MailingCounts>();
  if (mailingIds.length === 0) return result;
  const rows: { mailing_id: number; state: keyof MailingCounts; n: string }[] = await manager.query(
    'SELECT mailing_id, state, COUNT(*) AS n FROM mail_outbox WHERE mailing_id IN (?) GROUP BY mailing_id, state',
    [mailingIds],
  );
  for (const row of rows) {
    const counts = result.get(Number(row.mailing_id)) ?? emptyCounts();
    counts[row.state] = Number(row.n);
    counts.total += Number(row.n);
    result.set(Number(row.mailing_id), counts);
  }
  return result;
}
