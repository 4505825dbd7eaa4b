// Building mail: every text that reaches a header passes through oneLine(), so a CR/LF typed into a name, a
// category or a title can never start a header of its own; HTML parts escape every value.
import type { SendMailOptions } from 'nodemailer';

/** A header-safe single line: line breaks and other control characters become spaces. */
export function oneLine(value: string, max = 200): string {
  const flat = value
    // eslint-disable-next-line no-control-regex -- replacing control characters is the point
    .replace(/[\u0000-\u001f\u007f\u0085\u2028\u2029]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
  return flat.length > max ? `${flat.slice(0, max - 1)}…` : flat;
}

export function escapeHtml(value: string): string {
  return value
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

/** The address part of MAIL_FROM ("Name <a@b>" or "a@b") and its display name. */
export function parseFrom(from: string): { name: string; address: string; domain: string } {
  const match = /^\s*(.*?)\s*<([^<>\s]+@([^<>\s]+))>\s*$/.exec(from);
  if (match) return { name: oneLine(match[1].replace(/^"|"$/g, '')), address: match[2], domain: match[3] };
  const address = from.trim();
  return { name: '', address, domain: address.split('@')[1] ?? 'localhost' };
}

export interface UnsubscribeLinks {
  /** The one-click HTTPS address (RFC 8058); a GET of it shows a confirmation page. */
  oneClick: string;
  /** mailto: alternative (RFC 2369). */
  mailto: string;
  /** The self-service page: preferences, export, erase. */
  manage: string;
}

/** RFC 2369 + RFC 8058 headers: one List-Unsubscribe with the HTTPS URI first, and the one-click POST marker. */
export function listHeaders(links: UnsubscribeLinks, listId: string): Record<string, string> {
  return {
    'List-Unsubscribe': `<${links.oneClick}>, <${links.mailto}>`,
    'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    'List-Id': `<${listId}>`,
  };
}

export interface GoLivePick {
  name: string;
  label: string | null;
}

export interface GoLiveContent {
  kind: 'go-live' | 'update' | 'correction' | 'test';
  roundupTitle: string;
  summary: string | null;
  picks: GoLivePick[];
  /** The main chart as PNG, sent inline (cid) when the roundup has one. */
  chart: { png: Buffer; alt: string } | null;
  url: string;
  /** An update's or correction's note from the editor. */
  note: string | null;
  outletName: string;
}

const subjectPrefix: Record<GoLiveContent['kind'], string> = {
  'go-live': 'New roundup',
  update: 'Updated',
  correction: 'Correction',
  test: 'Test — new roundup',
};

export const chartContentId = 'main-chart@benchwire';

/** The inline chart's alt text: what it shows, and where its figures are in words. */
export function chartAltText(title: string): string {
  return oneLine(`Chart: ${title}. Every figure is also in the results table on the roundup page.`, 300);
}

/** The go-live (or update, or correction) mail for one subscriber: HTML and plain text with the same content. */
export function goLiveMessage(
  content: GoLiveContent,
  links: UnsubscribeLinks,
): Pick<SendMailOptions, 'subject' | 'text' | 'html' | 'attachments'> {
  const subject = oneLine(`${subjectPrefix[content.kind]}: ${content.roundupTitle}`, 150);
  const picksText = content.picks.map((p) => `- ${oneLine(p.name)}${p.label ? ` — ${oneLine(p.label)}` : ''}`);
  const text = [
    content.roundupTitle,
    '',
    ...(content.note ? [`${subjectPrefix[content.kind]}: ${content.note}`, ''] : []),
    ...(content.summary ? [content.summary, ''] : []),
    ...(picksText.length ? ['Top picks:', ...picksText, ''] : []),
    ...(content.chart ? [content.chart.alt, ''] : []),
    `Read the results: ${content.url}`,
    '',
    '--',
    `You get this because you subscribed to ${content.outletName}.`,
    `Preferences, your data, or erase: ${links.manage}`,
    `Unsubscribe: ${links.oneClick}`,
  ].join('\n');

  const picksHtml = content.picks.length
    ? `<h2 style="font-size:16px;margin:20px 0 8px">Top picks</h2><ul style="padding-left:20px;margin:0">${content.picks
        .map(
          (p) =>
            `<li style="margin:4px 0">${escapeHtml(p.name)}${p.label ? ` — <strong style="color:#A4521F">${escapeHtml(p.label)}</strong>` : ''}</li>`,
        )
        .join('')}</ul>`
    : '';
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escapeHtml(subject)}</title></head>
<body style="margin:0;background:#FAF8F3;color:#1B2433;font-family:system-ui,sans-serif;line-height:1.5">
<div style="max-width:640px;margin:0 auto;padding:24px">
<p style="margin:0 0 4px;color:#5B6472;font-size:13px;text-transform:uppercase;letter-spacing:.04em">${escapeHtml(content.outletName)} · ${escapeHtml(subjectPrefix[content.kind])}</p>
<h1 style="font-size:24px;line-height:1.25;margin:0 0 12px">${escapeHtml(content.roundupTitle)}</h1>
${content.note ? `<p style="border-left:3px solid #A4521F;padding-left:10px">${escapeHtml(content.note)}</p>` : ''}
${content.summary ? `<p>${escapeHtml(content.summary)}</p>` : ''}
${picksHtml}
${content.chart ? `<p style="margin:20px 0"><img src="cid:${chartContentId}" alt="${escapeHtml(content.chart.alt)}" width="600" style="max-width:100%;height:auto;border:1px solid #E4DFD3"></p>` : ''}
<p style="margin:24px 0"><a href="${escapeHtml(content.url)}" style="background:#A4521F;color:#FFFFFF;padding:10px 16px;text-decoration:none;border-radius:3px;display:inline-block">Read the results</a></p>
<hr style="border:0;border-top:1px solid #E4DFD3;margin:24px 0">
<p style="font-size:13px;color:#5B6472">You get this because you subscribed to ${escapeHtml(content.outletName)}.
<a href="${escapeHtml(links.manage)}" style="color:#5B6472">Preferences, your data, or erase</a> ·
<a href="${escapeHtml(links.oneClick)}" style="color:#5B6472">Unsubscribe</a></p>
</div></body></html>`;

  return {
    subject,
    text,
    html,
    attachments: content.chart
      ? [{ filename: 'chart.png', content: content.chart.png, contentType: 'image/png', cid: chartContentId }]
      : [],
  };
}

/** A simple transactional or staff mail: one-line subject, plain text, and the same text as minimal HTML. */
export function plainMessage(subject: string, text: string): Pick<SendMailOptions, 'subject' | 'text' | 'html'> {
  const paragraphs = text
    .split(/\n{2,}/)
    .map(
      (p) =>
        `<p>${escapeHtml(p)
          .replace(/\n/g, '<br>')
          .replace(/(https?:\/\/[^\s<]+)/g, '<a href="$1">$1</a>')}</p>`,
    )
    .join('\n');
  return {
    subject: oneLine(subject, 150),
    text,
    html: `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(oneLine(subject, 150))}</title></head><body style="font-family:system-ui,sans-serif;color:#1B2433;background:#FAF8F3;line-height:1.5"><div style="max-width:600px;margin:0 auto;padding:24px">${paragraphs}</div></body></html>`,
  };
}
