// Money is stored and sent as an integer amount of the currency's minor unit plus its ISO 4217 code.
// Nothing here converts between currencies: Benchwire never does.

/**
 * ISO 4217 minor-unit exponents that differ from the usual 2 (ISO 4217 list one, "minor unit" column).
 * Currencies not listed use 2.
 */
const minorUnitExceptions: Record<string, number> = {
  BHD: 3,
  BIF: 0,
  CLP: 0,
  DJF: 0,
  GNF: 0,
  IQD: 3,
  ISK: 0,
  JOD: 3,
  JPY: 0,
  KMF: 0,
  KRW: 0,
  KWD: 3,
  LYD: 3,
  OMR: 3,
  PYG: 0,
  RWF: 0,
  TND: 3,
  UGX: 0,
  VND: 0,
  VUV: 0,
  XAF: 0,
  XOF: 0,
  XPF: 0,
};

/** Number of digits after the decimal point in the currency's major unit (2 for EUR: 1 EUR = 100 cent). */
export function minorUnitDigits(currency: string): number {
  return minorUnitExceptions[currency.toUpperCase()] ?? 2;
}

let knownCurrencies: Set<string> | null = null;

/** Whether the runtime knows the code as an ISO 4217 currency (Intl's list; falls back to the shape check). */
export function isKnownCurrency(code: string): boolean {
  if (!/^[A-Z]{3}$/.test(code)) return false;
  if (knownCurrencies === null) {
    const supported = (Intl as { supportedValuesOf?: (key: string) => string[] }).supportedValuesOf;
    knownCurrencies = new Set(supported ? supported('currency') : []);
  }
  return knownCurrencies.size === 0 || knownCurrencies.has(code);
}

/** 18999 EUR → "189.99"; 1500 JPY → "1500". Plain digits for CSV and form fields (no grouping, no symbol). */
export function minorToMajorString(amountMinor: number, currency: string): string {
  const digits = minorUnitDigits(currency);
  const negative = amountMinor < 0;
  const text = String(Math.abs(Math.trunc(amountMinor))).padStart(digits + 1, '0');
  const whole = digits === 0 ? text : text.slice(0, -digits);
  const fraction = digits === 0 ? '' : `.${text.slice(-digits)}`;
  return `${negative ? '-' : ''}${whole}${fraction}`;
}

export type ParsedAmount = { ok: true; amountMinor: number } | { ok: false; message: string };

/**
 * Parses a typed or imported major-unit amount ("189.99", "189.9", "189") into minor units without
 * floating-point arithmetic. Grouping separators are refused because "1,299" and "1.299" mean different
 * things in different locales.
 */
export function parseMajorAmount(text: string, currency: string): ParsedAmount {
  const digits = minorUnitDigits(currency);
  const trimmed = text.trim();
  const match = /^(\d{1,12})(?:\.(\d+))?$/.exec(trimmed);
  if (!match) {
    return {
      ok: false,
      message: `Write the amount as plain digits with a dot for decimals, e.g. ${exampleAmount(digits)}.`,
    };
  }
  const fraction = match[2] ?? '';
  if (fraction.length > digits) {
    return {
      ok: false,
      message:
        digits === 0
          ? `${currency} has no minor unit: write a whole number.`
          : `${currency} has ${digits} decimal places at most.`,
    };
  }
  const amountMinor = Number(match[1]) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
  if (!Number.isSafeInteger(amountMinor) || amountMinor > MAX_AMOUNT_MINOR) {
    return { ok: false, message: 'The amount is too large.' };
  }
  return { ok: true, amountMinor };
}

/** Largest amount a price column holds (INT UNSIGNED is larger; this keeps JSON numbers comfortably exact). */
export const MAX_AMOUNT_MINOR = 2_000_000_000;

function exampleAmount(digits: number) {
  return digits === 0 ? '1500' : `189.${'9'.repeat(digits)}`;
}

/** "€189.99" / "189,99 €" in the reader's locale; the currency always shows. */
export function formatMoney(amountMinor: number, currency: string, locale = 'en-GB'): string {
  const digits = minorUnitDigits(currency);
  try {
    return new Intl.NumberFormat(locale, {
      style: 'currency',
      currency,
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
    }).format(amountMinor / 10 ** digits);
  } catch {
    return `${minorToMajorString(amountMinor, currency)} ${currency}`;
  }
}
