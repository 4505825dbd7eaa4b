import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router';
import { describe, expect, it, vi } from 'vitest';
import { ApiError } from '../../src/lib/api-client';
import { ReadinessPanel } from '../../src/features/editorial/components/readiness-panel';
import type { Readiness } from '../../shared/schemas/readiness';

const readiness: Readiness = {
  roundupId: 4,
  ready: false,
  blocking: [{ kind: 'cell', label: 'Board A at 300 W: no run of record', link: '/roundups/4/cells/7', cellId: 7 }],
  excludedCells: [],
  state: 'writing',
  canRequestReview: false,
};

function renderPanel(onExclude: (cellId: number, reason: string) => Promise<unknown>) {
  render(
    <MemoryRouter>
      <ReadinessPanel readiness={readiness} canExclude onExclude={onExclude} onInclude={vi.fn()} />
    </MemoryRouter>,
  );
}

describe('Leaving a matrix cell out of the roundup', () => {
  it('when the reason is empty, then the shared schema says what is missing beside the field and nothing is sent', async () => {
    const user = userEvent.setup();
    const onExclude = vi.fn(() => Promise.resolve());
    renderPanel(onExclude);
    await user.click(screen.getByRole('button', { name: 'Leave this cell out…' }));
    await user.click(screen.getByRole('button', { name: 'Leave out' }));
    // The message of excludeCellRequestSchema (shared/schemas/readiness.ts).
    expect(screen.getByText('Write why this cell is left out of the roundup.')).toBeTruthy();
    expect(onExclude).not.toHaveBeenCalled();
  });

  it('when a reason is given, then it is sent trimmed for that cell, and a refusal shows beside it with the text kept', async () => {
    const user = userEvent.setup();
    const onExclude = vi.fn(() =>
      Promise.reject(new ApiError(409, 'conflict', 'The cell already has a run of record.')),
    );
    renderPanel(onExclude);
    await user.click(screen.getByRole('button', { name: 'Leave this cell out…' }));
    await user.type(screen.getByLabelText(/Why this cell is left out/), '  The sample went back early  ');
    await user.click(screen.getByRole('button', { name: 'Leave out' }));
    expect(onExclude).toHaveBeenCalledWith(7, 'The sample went back early');
    expect(await screen.findByText('The cell already has a run of record.')).toBeTruthy();
    expect((screen.getByLabelText(/Why this cell is left out/) as HTMLTextAreaElement).value).toBe(
      '  The sample went back early  ',
    );
  });
});
