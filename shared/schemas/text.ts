import { z } from 'zod';

/**
 * The one rule for text people type into Benchwire, used by every request schema and every form.
 *
 * - Text must be well-formed Unicode: a lone UTF-16 surrogate (half of a character pair) is refused, and so is
 *   U+FFFD, the replacement character a decoder leaves where bytes were not valid in its encoding — storing it
 *   would keep the damage silently.
 * - Single-line fields (names, titles, codes) refuse line breaks and control characters except tab.
 * - Multi-line fields (notes) keep tab, line feed and carriage return and refuse the other control characters.
 * - Both refuse the bidirectional embedding, override and isolate controls (U+202A–U+202E, U+2066–U+2069): they
 *   make text display in an order other than the one stored, which hides what a name or note really says
 *   (Unicode Technical Report #36, Unicode Security Considerations, section 2.4).
 */

export type TextKind = 'single-line' | 'multi-line' | 'password';

const loneSurrogate = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;
const replacementCharacter = /\uFFFD/;
const bidiControl = /[\u202A-\u202E\u2066-\u2069]/;
/** C0 controls except tab, DEL, C1 controls, and the Unicode line and paragraph separators. */
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const singleLineControl = /[\u0000-\u0008\u000A-\u001F\u007F-\u009F\u2028\u2029]/;
/** C0 controls except tab, line feed and carriage return; DEL and C1 controls. */
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const multiLineControl = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;

function codePoint(character: string): string {
  return `U+${(character.codePointAt(0) ?? 0).toString(16).toUpperCase().padStart(4, '0')}`;
}

/** What is wrong with a text for a field of this kind, in words for the person who typed it; null when fine. */
export function textProblem(text: string, kind: TextKind): string | null {
  if (loneSurrogate.test(text)) {
    return 'This text is damaged: it holds half of a two-part character (not valid Unicode). Type or paste it again.';
  }
  if (replacementCharacter.test(text)) {
    return 'This text holds the replacement character �, a sign it was damaged by a wrong encoding. Type or paste it again.';
  }
  const bidi = bidiControl.exec(text);
  if (bidi) {
    return `Remove the invisible text-direction control (${codePoint(bidi[0])}): it makes the text read differently from what is stored.`;
  }
  if (kind === 'multi-line') {
    const control = multiLineControl.exec(text);
    if (control) return `Remove the control character ${codePoint(control[0])}.`;
    return null;
  }
  const control = singleLineControl.exec(text);
  if (control) {
    return /[\n\r\u2028\u2029]/.test(control[0])
      ? 'Use one line: line breaks are not allowed here.'
      : `Remove the control character ${codePoint(control[0])}.`;
  }
  return null;
}

/** A string whose content passes textProblem for the kind (before trimming, so nothing is hidden by it). */
function checkedString(kind: TextKind) {
  return z.string().check((payload) => {
    const problem = textProblem(payload.value, kind);
    if (problem) payload.issues.push({ code: 'custom', message: problem, input: payload.value, abort: true });
  });
}

const tooLong = (max: number) => `Use at most ${max} characters.`;

/** Marks the field's kind in the OpenAPI document (`x-text`), so tests generated from it know the rule. */
const textMeta = (kind: TextKind) => ({ 'x-text': kind });

/** Text as typed, trimmed; text that may span lines has its line endings made \n first. */
function trimmedText(kind: TextKind) {
  const text = checkedString(kind);
  return (kind === 'multi-line' ? text.overwrite((value) => value.replace(/\r\n?/g, '\n')) : text).trim();
}

function requiredText(kind: TextKind, max: number, emptyMessage: string) {
  return trimmedText(kind).min(1, emptyMessage).max(max, tooLong(max)).meta(textMeta(kind));
}

/** Empty, null or absent become null. */
function optionalText(kind: TextKind, max: number) {
  return trimmedText(kind)
    .max(max, tooLong(max))
    .meta(textMeta(kind))
    .nullable()
    .optional()
    .transform((value) => (value ? value : null));
}

/** Required one-line text: trimmed, 1 to max characters. */
export function singleLineText(max: number, emptyMessage = 'This cannot be empty.') {
  return requiredText('single-line', max, emptyMessage);
}

/** Optional one-line text: trimmed; empty, null or absent become null. */
export function optionalSingleLineText(max: number) {
  return optionalText('single-line', max);
}

/** Required text that may span lines: line endings become \n, trimmed, 1 to max characters. */
export function multiLineText(max: number, emptyMessage = 'This cannot be empty.') {
  return requiredText('multi-line', max, emptyMessage);
}

/** Optional text that may span lines: line endings become \n, trimmed; empty, null or absent become null. */
export function optionalMultiLineText(max: number) {
  return optionalText('multi-line', max);
}

/** Free text in a query string (search boxes, filters): one line, trimmed, at most max characters. */
export function queryText(max: number) {
  return checkedString('single-line').trim().max(max, tooLong(max)).meta(textMeta('single-line'));
}

/**
 * A password as typed: never trimmed or changed, well-formed, without line breaks or control characters (a
 * browser's password field cannot type them), and not only spaces.
 */
export function passwordText(min: number, max: number, shortMessage = `Use at least ${min} characters.`) {
  return checkedString('password')
    .min(min, shortMessage)
    .max(max, tooLong(max))
    .refine((value) => value.length === 0 || value.trim().length > 0, 'A password cannot be only spaces.')
    .meta(textMeta('password'));
}
