import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router';
import { describe, expect, it } from 'vitest';
import { ApiError } from '../../src/lib/api-client';
import { MyBenchOverview, type MoveCellInput } from '../../src/features/my-bench/components/my-bench-overview';
import type { MyBench } from '../../shared/schemas/benches';
import type { MatrixCell, QueueItem } from '../../shared/schemas/matrix';

const cell: MatrixCell = {
  id: 41,
  roundupId: 7,
  entryId: 3,
  loadConfigurationId: 2,
  state: 'assigned',
  tester: { id: 5, displayName: 'Test tester' },
  dueDate: '2026-12-10',
  overdue: false,
  note: null,
  stateChangedAt: '2026-12-01T08:00:00.000Z',
  runCount: 0,
  qaFlags: [],
  actions: ['start'],
};
const item: QueueItem = {
  cell,
  roundup: { id: 7, title: 'Helix-1700 boards', state: 'on-the-bench', timeZone: 'Europe/Berlin' },
  product: { id: 9, maker: 'Quillon', model: 'Q50 Steady', chipset: 'HX-B50', formFactor: 'atx', archived: false },
  loadConfiguration: { id: 2, name: 'Stock all-core' },
};
const myBench: MyBench = { queue: [item], awaitingReview: [], upcomingBookings: [] };

/**
 * Stands in for the transition route: a start with no reason gets the server's 409 start_outside_booking (no booking
 * of the cell covers now); a start with a reason moves the cell to running.
 */
function transitionRoute() {
  const sent: MoveCellInput[] = [];
  const moveCell = async (input: MoveCellInput): Promise<MatrixCell> => {
    sent.push(input);
    if (input.action === 'start' && !input.overrideReason) {
      throw new ApiError(
        409,
        'start_outside_booking',
        'No booking of this cell covers now; its next one is Bench B 2026-12-04 09:00–12:00 UTC. Book a slot, or start anyway and say why.',
        { overrideReason: 'Say why the run starts outside its bookings.' },
      );
    }
    return { ...cell, state: 'running', actions: ['pause', 'record'] };
  };
  return { sent, moveCell };
}

/** My bench of the tester, its moves answered by `transitionRoute`; returns the user and the moves sent. */
function renderMyBench() {
  const { sent, moveCell } = transitionRoute();
  render(
    <MemoryRouter>
      <MyBenchOverview myBench={myBench} matrixPath={(id) => `/roundups/${id}`} moveCell={moveCell} />
    </MemoryRouter>,
  );
  return { user: userEvent.setup(), sent };
}

describe('My bench: starting a run outside its bookings', () => {
  it('warns with the server’s reason, asks why, and starts with the reason once it is given', async () => {
    const { user, sent } = renderMyBench();

    await user.click(screen.getByRole('button', { name: /^Start.*Quillon Q50 Steady · Stock all-core/ }));
    const dialog = await screen.findByRole('dialog', { name: 'Start outside your bookings?' });
    expect(dialog.textContent).toContain('its next one is Bench B');

    // No reason, no start: the dialog says what is missing and sends nothing more.
    await user.click(within(dialog).getByRole('button', { name: 'Start anyway' }));
    expect(within(dialog).getByText('Say why the run starts outside its bookings.')).toBeTruthy();
    expect(sent).toHaveLength(1);

    await user.type(within(dialog).getByLabelText(/Why start now/), 'Bench B is free all morning');
    await user.click(within(dialog).getByRole('button', { name: 'Start anyway' }));
    await waitFor(() => expect(screen.getByText(/Quillon Q50 Steady · Stock all-core: Running\./)).toBeTruthy());
    expect(sent[1]).toEqual({
      roundupId: 7,
      cellId: 41,
      action: 'start',
      overrideReason: 'Bench B is free all morning',
    });
  });

  it('keeps the cell queued when the tester does not want to start after all', async () => {
    const { user, sent } = renderMyBench();
    await user.click(screen.getByRole('button', { name: /^Start.*Quillon Q50 Steady/ }));
    const dialog = await screen.findByRole('dialog', { name: 'Start outside your bookings?' });
    await user.click(within(dialog).getByRole('button', { name: 'Keep it queued' }));
    expect(sent).toHaveLength(1);
    expect(screen.queryByText(/: Running\./)).toBeNull();
  });
});
