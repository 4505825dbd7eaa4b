// The rule, chosen and documented here: a return-by date is a calendar date in the outlet's time zone (set
// per roundup). A loan is overdue once that whole day has ended there, i.e. from 00:00 local time on the
// next day, and only while the sample is still with the outlet (not returned, not kept with the vendor's
// agreement). The same rule makes a matrix cell's due date overdue.

// Building a formatter loads the zone's rules, which costs far more than formatting: lists and matrices ask for
// one per row, so each zone's formatter is built once.
const dateFormats = new Map<string, Intl.DateTimeFormat>();
function dateFormatIn(timeZone: string): Intl.DateTimeFormat {
  let format = dateFormats.get(timeZone);
  if (!format) {
    format = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit' });
    dateFormats.set(timeZone, format);
  }
  return format;
}

/** The calendar date (YYYY-MM-DD) an instant falls on in an IANA time zone. */
export function calendarDateIn(timeZone: string, instant: Date): string {
  const parts = dateFormatIn(timeZone).formatToParts(instant);
  const part = (type: string) => parts.find((p) => p.type === type)?.value ?? '';
  return `${part('year')}-${part('month')}-${part('day')}`;
}

/** Whether the runtime knows the IANA time zone name. */
export function isValidTimeZone(timeZone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone });
    return true;
  } catch {
    return false;
  }
}

/** A date (YYYY-MM-DD) has passed once it has ended in the zone: the local date is later than it. */
export function hasDateEnded(date: string, timeZone: string, now: Date): boolean {
  return calendarDateIn(timeZone, now) > date;
}

/** Whole local days since the date ended (0 while it has not ended; 1 on the first day after it). */
export function daysPast(date: string, timeZone: string, now: Date): number {
  const today = calendarDateIn(timeZone, now);
  if (today <= date) return 0;
  return Math.round((Date.parse(`${today}T00:00:00Z`) - Date.parse(`${date}T00:00:00Z`)) / 86_400_000);
}

export interface LoanFacts {
  source: 'retail' | 'vendor-loan' | null;
  status: string;
  returnBy: string | null;
}

/** Sample statuses after which nothing is owed back to the vendor. */
const settledStatuses = new Set(['returned', 'kept']);

export function isLoanOverdue(loan: LoanFacts, timeZone: string, now: Date): boolean {
  if (loan.source !== 'vendor-loan' || !loan.returnBy || settledStatuses.has(loan.status)) return false;
  return hasDateEnded(loan.returnBy, timeZone, now);
}

export function loanDaysOverdue(loan: LoanFacts, timeZone: string, now: Date): number {
  return isLoanOverdue(loan, timeZone, now) ? daysPast(loan.returnBy as string, timeZone, now) : 0;
}
