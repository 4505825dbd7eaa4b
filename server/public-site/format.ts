import { formatMoney } from '../../shared/domain/planning/money';
import { formatTemperature, type DisplayUnit } from '../../shared/domain/reader/temperature-display';
import { html, type SafeHtml } from './html';

/**
 * A temperature with its value in °C kept in data attributes, so the reader script can switch units in place
 * without asking the server again.
 */
export function temperature(
  celsius: number,
  unit: DisplayUnit,
  kind: 'absolute' | 'difference' = 'absolute',
): SafeHtml {
  return html`<span class="temp" data-c="${celsius}" data-kind="${kind}"
    >${formatTemperature(celsius, unit, kind)}</span
  >`;
}

export function plusMinusTemperature(celsius: number, unit: DisplayUnit): SafeHtml {
  return html`±${temperature(celsius, unit, 'difference')}`;
}

export function watts(value: number): string {
  return `${Number.isInteger(value) ? value : value.toFixed(1)}\u2009W`;
}

export function price(amountMinor: number, currency: string): string {
  return formatMoney(amountMinor, currency);
}

/** "3 December 2026", in UTC: the publication day as the outlet states it. */
export function longDate(iso: string): string {
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(iso),
  );
}
