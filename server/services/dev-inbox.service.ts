import { simpleParser } from 'mailparser';
import type { DataSource } from 'typeorm';
import { RelayMessageEntity } from '../entities/relay-message.entity';
import { AppError, notFound } from '../errors';
import type { DevInbox, DevInboxItem, DevInboxMessage, DevInboxQuery } from '../../shared/schemas/dev-inbox';

function item(row: RelayMessageEntity): DevInboxItem {
  return {
    id: Number(row.id),
    from: row.mailFrom,
    to: row.recipient,
    subject: row.subject,
    sizeBytes: row.sizeBytes,
    receivedAt: row.receivedAt.toISOString(),
  };
}

/** The admin's view of what the local relay kept; there is none when mail goes through a real relay. */
export class DevInboxService {
  constructor(
    private readonly dataSource: DataSource,
    readonly enabled: boolean,
  ) {}

  async list(query: DevInboxQuery): Promise<DevInbox> {
    if (!this.enabled) return { enabled: false, total: 0, messages: [] };
    const builder = this.dataSource.getRepository(RelayMessageEntity).createQueryBuilder('m');
    if (query.to) builder.where('m.recipient = :to', { to: query.to });
    const [rows, total] = await builder.orderBy('m.id', 'DESC').take(query.limit).getManyAndCount();
    return { enabled: true, total, messages: rows.map(item) };
  }

  async message(id: number): Promise<DevInboxMessage> {
    if (!this.enabled)
      throw new AppError('dev_inbox_off', 404, 'Mail goes through a real relay: there is no dev inbox.');
    const row = await this.dataSource
      .getRepository(RelayMessageEntity)
      .createQueryBuilder('m')
      .addSelect('m.raw')
      .where('m.id = :id', { id })
      .getOne();
    if (!row) throw notFound('That message');
    const parsed = await simpleParser(row.raw, { skipImageLinks: true, skipTextLinks: true });
    let html = typeof parsed.html === 'string' ? parsed.html : null;
    if (html) {
      for (const attachment of parsed.attachments) {
        if (!attachment.cid) continue;
        const dataUrl = `data:${attachment.contentType};base64,${attachment.content.toString('base64')}`;
        html = html.split(`cid:${attachment.cid}`).join(dataUrl);
      }
    }
    return {
      ...item(row),
      messageId: row.messageId,
      headers: parsed.headerLines.map((header) => {
        const colon = header.line.indexOf(':');
        return {
          name: colon > 0 ? header.line.slice(0, colon) : header.key,
          value: (colon > 0 ? header.line.slice(colon + 1) : header.line).replace(/\r?\n[ \t]+/g, ' ').trim(),
        };
      }),
      text: parsed.text ?? null,
      html,
      attachments: parsed.attachments.map((attachment) => ({
        filename: attachment.filename ?? null,
        contentType: attachment.contentType,
        sizeBytes: attachment.size,
        contentId: attachment.cid ?? null,
        inline: attachment.contentDisposition === 'inline' || Boolean(attachment.related),
      })),
    };
  }
}
