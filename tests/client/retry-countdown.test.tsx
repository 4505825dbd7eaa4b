import { act, render, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { RetryCountdown } from '../../src/features/auth/components/retry-countdown';

describe('RetryCountdown', () => {
  beforeEach(() => {
    vi.useFakeTimers();
    vi.setSystemTime(new Date('2026-03-02T10:00:00Z'));
  });
  afterEach(() => vi.useRealTimers());

  it('when sign-in is locked for 3 seconds, then the wait counts down and then says to try again', () => {
    render(<RetryCountdown until={Date.now() + 3000} />);
    expect(screen.getByText(/You can try again in 3 seconds/)).toBeTruthy();
    act(() => vi.advanceTimersByTime(1000));
    expect(screen.getByText(/You can try again in 2 seconds/)).toBeTruthy();
    act(() => vi.advanceTimersByTime(2000));
    expect(screen.getByText('You can try again now.')).toBeTruthy();
  });

  it('long waits are said in minutes', () => {
    render(<RetryCountdown until={Date.now() + 14 * 60_000 + 5000} />);
    expect(screen.getByText(/You can try again in 15 minutes/)).toBeTruthy();
  });
});
