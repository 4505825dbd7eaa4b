// The invitation mail a new staff member receives. Names typed by admins reach the subject and the body: the subject
// goes through oneLine() (no CR/LF can start a header), every value in the HTML part is escaped.
import { escapeHtml, oneLine } from './compose';
import { roleLabels, type Role } from '../../shared/schemas/common';
import type { OutboxPayload } from '../entities/mail.entities';

export interface InvitationMail {
  outletName: string;
  inviteeName: string;
  inviterName: string;
  role: Role;
  link: string;
  expiresAt: Date;
  hours: number;
}

/** "Sun, 6 Dec 2026, 15:04 UTC": the expiry, stated in UTC so it reads the same wherever the mail is opened. */
export function expiryInWords(at: Date): string {
  return `${new Intl.DateTimeFormat('en-GB', {
    timeZone: 'UTC',
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).format(at)} UTC`;
}

export function invitationMail(mail: InvitationMail): OutboxPayload {
  const outlet = oneLine(mail.outletName, 80);
  const inviter = oneLine(mail.inviterName, 80);
  const invitee = oneLine(mail.inviteeName, 80);
  const role = roleLabels[mail.role];
  const until = expiryInWords(mail.expiresAt);
  const subject = `${inviter} invited you to Benchwire at ${outlet}`;
  const text = [
    `Hello ${invitee},`,
    `${inviter} has made you a Benchwire account at ${outlet}, with the role ${role}. Benchwire is where the outlet plans roundups, logs bench results and prepares what readers see.`,
    `Choose your password here:\n${mail.link}`,
    `The link works once, until ${until} (${mail.hours} hours after it was sent). If it has run out, ask your admin to send the invitation again.`,
    `Not expecting this? You can ignore this mail: nothing happens until the link is used.`,
  ].join('\n\n');
  const e = escapeHtml;
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${e(subject)}</title></head><body style="margin:0;font-family:system-ui,sans-serif;color:#1B2433;background:#FAF8F3;line-height:1.5"><div style="max-width:600px;margin:0 auto;padding:24px">
<p>Hello ${e(invitee)},</p>
<p>${e(inviter)} has made you a Benchwire account at ${e(outlet)}, with the role <strong>${e(role)}</strong>. Benchwire is where the outlet plans roundups, logs bench results and prepares what readers see.</p>
<p style="margin:24px 0"><a href="${e(mail.link)}" style="display:inline-block;background:#A4521F;color:#FFFFFF;padding:10px 18px;border-radius:3px;text-decoration:none;font-weight:600">Choose your password</a></p>
<p style="font-size:14px;color:#5B6472">Or open this address: <a href="${e(mail.link)}" style="color:#A4521F">${e(mail.link)}</a></p>
<p>The link works once, until <strong>${e(until)}</strong> (${mail.hours} hours after it was sent). If it has run out, ask your admin to send the invitation again.</p>
<p style="font-size:14px;color:#5B6472">Not expecting this? You can ignore this mail: nothing happens until the link is used.</p>
</div></body></html>`;
  return { subject, text, html };
}
