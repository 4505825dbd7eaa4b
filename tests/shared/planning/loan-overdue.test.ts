import { describe, expect, it } from 'vitest';
import {
  calendarDateIn,
  daysPast,
  hasDateEnded,
  isLoanOverdue,
  isValidTimeZone,
  loanDaysOverdue,
} from '../../../shared/domain/planning/loan-overdue';

const loan = { source: 'vendor-loan' as const, status: 'received', returnBy: '2025-03-10' };

// Offsets from the IANA tz database (first principles of the zones' rules for the dates used):
// Europe/Berlin is UTC+1 in early March (summer time starts 2025-03-30), America/Los_Angeles is UTC−7 after
// 2025-03-09, Pacific/Auckland is UTC+13 until 2025-04-06.
describe('loan overdue: overdue once the return-by date has ended in the roundup’s time zone', () => {
  it('turns overdue at local midnight after the return-by date, not at UTC midnight', () => {
    // 2025-03-10 23:30 UTC is 2025-03-11 00:30 in Berlin: the day has ended there.
    expect(isLoanOverdue(loan, 'Europe/Berlin', new Date('2025-03-10T22:59:59.999Z'))).toBe(false);
    expect(isLoanOverdue(loan, 'Europe/Berlin', new Date('2025-03-10T23:00:00.000Z'))).toBe(true);
    // In UTC the same loan is still within its date until midnight UTC.
    expect(isLoanOverdue(loan, 'UTC', new Date('2025-03-10T23:30:00Z'))).toBe(false);
    expect(isLoanOverdue(loan, 'UTC', new Date('2025-03-11T00:00:00Z'))).toBe(true);
  });

  it('one instant, three outlets: overdue in Auckland, not yet in Los Angeles', () => {
    const instant = new Date('2025-03-10T11:30:00Z');
    expect(calendarDateIn('Pacific/Auckland', instant)).toBe('2025-03-11'); // 00:30 on the 11th (UTC+13)
    expect(calendarDateIn('America/Los_Angeles', instant)).toBe('2025-03-10'); // 04:30 on the 10th (UTC−7)
    expect(isLoanOverdue(loan, 'Pacific/Auckland', instant)).toBe(true);
    expect(isLoanOverdue(loan, 'America/Los_Angeles', instant)).toBe(false);
    expect(isLoanOverdue(loan, 'Europe/Berlin', instant)).toBe(false);
  });

  it('the summer-time change does not move the boundary off local midnight', () => {
    // Berlin switches to UTC+2 on 2025-03-30; a loan due that day ends at 2025-03-30 22:00 UTC.
    const due = { ...loan, returnBy: '2025-03-30' };
    expect(isLoanOverdue(due, 'Europe/Berlin', new Date('2025-03-30T21:59:59Z'))).toBe(false);
    expect(isLoanOverdue(due, 'Europe/Berlin', new Date('2025-03-30T22:00:00Z'))).toBe(true);
  });

  it('counts whole local days past the date', () => {
    expect(daysPast('2025-03-10', 'Europe/Berlin', new Date('2025-03-10T23:00:00Z'))).toBe(1);
    expect(loanDaysOverdue(loan, 'Europe/Berlin', new Date('2025-03-14T12:00:00Z'))).toBe(4);
    expect(loanDaysOverdue(loan, 'Europe/Berlin', new Date('2025-03-10T12:00:00Z'))).toBe(0);
  });

  it('returned, kept, retail and undated samples are never overdue', () => {
    const late = new Date('2025-04-30T12:00:00Z');
    expect(isLoanOverdue({ ...loan, status: 'returned' }, 'UTC', late)).toBe(false);
    expect(isLoanOverdue({ ...loan, status: 'kept' }, 'UTC', late)).toBe(false);
    expect(isLoanOverdue({ ...loan, source: 'retail' }, 'UTC', late)).toBe(false);
    expect(isLoanOverdue({ ...loan, returnBy: null }, 'UTC', late)).toBe(false);
    expect(hasDateEnded('2025-04-29', 'UTC', late)).toBe(true);
  });

  it('knows real IANA zones from invented ones', () => {
    expect(isValidTimeZone('Europe/Berlin')).toBe(true);
    expect(isValidTimeZone('Mars/Olympus')).toBe(false);
  });
});
