/**
 * A small tagged-template for server-rendered pages: every interpolated value is escaped unless it is already
 * `SafeHtml` (the result of another `html` template, or `trustedHtml` for markup that was sanitised elsewhere).
 * Arrays are joined, and null, undefined and false render as nothing, so conditionals read naturally.
 */
export class SafeHtml {
  constructor(readonly value: string) {}
  toString(): string {
    return this.value;
  }
}

const escapes: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for HTML content and double- or single-quoted attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (char) => escapes[char]);
}

function renderValue(value: unknown): string {
  if (value === null || value === undefined || value === false) return '';
  if (value instanceof SafeHtml) return value.value;
  if (Array.isArray(value)) return value.map(renderValue).join('');
  return escapeHtml(String(value));
}

export function html(strings: TemplateStringsArray, ...values: unknown[]): SafeHtml {
  let out = strings[0];
  for (let i = 0; i < values.length; i++) out += renderValue(values[i]) + strings[i + 1];
  return new SafeHtml(out);
}

/** Markup that is safe by construction (sanitised write-up HTML, an inline SVG we built): passed through as is. */
export function trustedHtml(markup: string): SafeHtml {
  return new SafeHtml(markup);
}

/**
 * JSON for a `<script type="application/ld+json">` block: `<` is written as \u003c so no value can close the script
 * element or open a comment, whatever text it holds.
 */
export function jsonForScript(value: unknown): SafeHtml {
  return new SafeHtml(
    JSON.stringify(value)
      .replace(/</g, '\\u003c')
      .replace(/\u2028/g, '\\u2028')
      .replace(/\u2029/g, '\\u2029'),
  );
}
