import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  multiLineText,
  optionalSingleLineText,
  passwordText,
  singleLineText,
  textProblem,
} from '../../../shared/schemas/text';
import {
  calendarDate,
  calendarDateProblem,
  dateRanges,
  zonedInstant,
  zonedInstantProblem,
} from '../../../shared/schemas/dates';

/*
 * Property-based checks of the text and date rules. The oracles are outside our code: the ECMAScript Date object
 * (proleptic Gregorian calendar, ECMA-262 §21.4.1) for which days exist and where an offset instant falls in UTC,
 * and the Unicode Standard's definitions: surrogates U+D800–U+DFFF are well-formed only as a high-low pair
 * (Unicode 15 §3.9 D91, as `String.prototype.isWellFormed` implements it), C0/C1 controls are General Category
 * Cc, and U+202A–U+202E and U+2066–U+2069 are the explicit bidirectional formatting characters (UAX #9 §2).
 */

const controlCharacters = fc.oneof(
  fc.integer({ min: 0x00, max: 0x1f }).filter((c) => c !== 0x09 && c !== 0x0a && c !== 0x0d),
  fc.integer({ min: 0x7f, max: 0x9f }),
);
const bidiControls = fc.constantFrom(0x202a, 0x202b, 0x202c, 0x202d, 0x202e, 0x2066, 0x2067, 0x2068, 0x2069);
/** Text a person can type: any code point that is not a control, a bidi control, a surrogate or U+FFFD. */
const typedText = fc.string({
  unit: fc
    .integer({ min: 0x20, max: 0x10ffff })
    .filter(
      (c) =>
        !(c >= 0x7f && c <= 0x9f) &&
        !(c >= 0xd800 && c <= 0xdfff) &&
        !(c >= 0x202a && c <= 0x202e) &&
        !(c >= 0x2066 && c <= 0x2069) &&
        c !== 0x2028 &&
        c !== 0x2029 &&
        c !== 0xfffd,
    )
    .map((c) => String.fromCodePoint(c)),
  maxLength: 40,
});
const loneSurrogate = fc.oneof(fc.integer({ min: 0xd800, max: 0xdbff }), fc.integer({ min: 0xdc00, max: 0xdfff }));
const insertAt = (text: string, index: number, piece: string) => {
  // Insert between code points, so the inserted surrogate never completes a pair by accident.
  const points = Array.from(text);
  const at = index % (points.length + 1);
  return [...points.slice(0, at), piece, ...points.slice(at)].join('');
};

const isWellFormed = (text: string) => (text as string & { isWellFormed(): boolean }).isWellFormed();

describe('text rule', () => {
  it('accepts any typed text and returns it trimmed', () => {
    fc.assert(
      fc.property(typedText, (text) => {
        const parsed = optionalSingleLineText(1000).safeParse(text);
        expect(parsed.success).toBe(true);
        expect(parsed.data).toBe(text.trim() === '' ? null : text.trim());
      }),
    );
  });

  it('agrees with the standard well-formedness test: a lone surrogate anywhere is refused', () => {
    fc.assert(
      fc.property(typedText, loneSurrogate, fc.nat(), (text, surrogate, index) => {
        const damaged = insertAt(text, index, String.fromCharCode(surrogate));
        expect(isWellFormed(damaged)).toBe(false);
        expect(textProblem(damaged, 'multi-line')).not.toBeNull();
        expect(singleLineText(1000).safeParse(`x${damaged}`).success).toBe(false);
      }),
    );
  });

  it('keeps well-formed surrogate pairs (characters beyond U+FFFF)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0x10000, max: 0x10ffff }), (codePoint) => {
        expect(textProblem(`a${String.fromCodePoint(codePoint)}b`, 'single-line')).toBeNull();
      }),
    );
  });

  it('refuses control characters (except tab) and bidi controls in one-line fields, wherever they are', () => {
    fc.assert(
      fc.property(typedText, fc.oneof(controlCharacters, bidiControls), fc.nat(), (text, code, index) => {
        const value = insertAt(`a${text}b`, index, String.fromCharCode(code));
        expect(singleLineText(1000).safeParse(value).success).toBe(false);
        expect(multiLineText(1000).safeParse(value).success).toBe(false);
      }),
    );
  });

  it('lets multi-line fields keep tabs and line breaks, with every line ending read as \\n', () => {
    fc.assert(
      fc.property(
        fc.array(typedText, { minLength: 1, maxLength: 5 }),
        fc.constantFrom('\n', '\r\n', '\r'),
        (lines, eol) => {
          const text = `start\t${lines.join(eol)}end`;
          const parsed = multiLineText(5000).safeParse(text);
          expect(parsed.success).toBe(true);
          expect(parsed.data).not.toContain('\r');
          // Reading the result again changes nothing.
          expect(multiLineText(5000).parse(parsed.data)).toBe(parsed.data);
          expect(singleLineText(5000).safeParse(`a${eol}b`).success).toBe(false);
        },
      ),
    );
  });

  it('refuses passwords of only white space and keeps others exactly as typed', () => {
    const spaces = fc.string({ unit: fc.constantFrom(' ', '\u00a0', '\u3000', '\t'), minLength: 12, maxLength: 40 });
    fc.assert(
      fc.property(spaces, (password) => {
        expect(passwordText(12, 128).safeParse(password).success).toBe(false);
      }),
    );
    fc.assert(
      fc.property(typedText, (text) => {
        // Leading and trailing spaces are part of a password: nothing is trimmed.
        const password = ` pass ${text} word `;
        const parsed = passwordText(12, 400).safeParse(password);
        expect(parsed.success).toBe(true);
        expect(parsed.data).toBe(password);
      }),
    );
  });
});

const pad = (n: number, width: number) => String(n).padStart(width, '0');

/** The ECMAScript Date's answer to "does this day exist?", safe for years 0–99 (no Date.UTC year mapping). */
function dayExists(year: number, month: number, day: number): boolean {
  const date = new Date(0);
  date.setUTCFullYear(year, month - 1, day);
  return date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
}

describe('date rule', () => {
  const anyYear = fc.integer({ min: 0, max: 9999 });

  it('accepts exactly the days that exist within the range, for every year 0000–9999', () => {
    fc.assert(
      fc.property(anyYear, fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 31 }), (year, month, day) => {
        const text = `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}`;
        const range = dateRanges.planning;
        const expected = dayExists(year, month, day) && year >= range.fromYear && year <= range.toYear;
        expect(calendarDateProblem(text, range) === null).toBe(expected);
        expect(calendarDate(range).safeParse(text).success).toBe(expected);
      }),
      { numRuns: 2000 },
    );
  });

  it('never reads a year as another year: the accepted text is returned unchanged', () => {
    fc.assert(
      fc.property(
        fc.date({ min: new Date('1990-01-01T00:00:00Z'), max: new Date('2100-12-31T00:00:00Z'), noInvalidDate: true }),
        (date) => {
          const text = date.toISOString().slice(0, 10);
          expect(calendarDate(dateRanges.release).parse(text)).toBe(text);
        },
      ),
    );
  });

  it('judges an instant with an offset by its UTC moment, as Date.parse places it', () => {
    const offsets = fc.tuple(fc.constantFrom('+', '-'), fc.integer({ min: 0, max: 14 }), fc.constantFrom(0, 30, 45));
    fc.assert(
      fc.property(
        fc.integer({ min: 1990, max: 2110 }),
        fc.integer({ min: 1, max: 12 }),
        fc.integer({ min: 1, max: 28 }),
        fc.integer({ min: 0, max: 23 }),
        offsets,
        (year, month, day, hour, [sign, offsetHours, offsetMinutes]) => {
          const text = `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}T${pad(hour, 2)}:00:00${sign}${pad(offsetHours, 2)}:${pad(offsetMinutes, 2)}`;
          const utcYear = new Date(Date.parse(text)).getUTCFullYear();
          const range = dateRanges.booking;
          const expected = utcYear >= range.fromYear && utcYear <= range.toYear;
          expect(zonedInstantProblem(text, range) === null).toBe(expected);
          expect(zonedInstant(range).safeParse(text).success).toBe(expected);
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('refuses the last hour of year 9999 at -05:00, which is year 10000 in UTC', () => {
    expect(zonedInstant({ fromYear: 2000, toYear: 9999 }).safeParse('9999-12-31T23:00:00-05:00').success).toBe(false);
    expect(zonedInstant({ fromYear: 2000, toYear: 9999 }).safeParse('9999-12-31T23:00:00+05:00').success).toBe(true);
  });
});
