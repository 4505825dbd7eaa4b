import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router';
import { describe, expect, it } from 'vitest';
import { MatrixBoard } from '../../src/features/matrix/components/matrix-board';
import type { CellAction } from '../../shared/domain/planning/matrix-cell-states';
import type { AssignCellsRequest, MatrixCell, RoundupMatrix } from '../../shared/schemas/matrix';

// The invented demo outlet: two boards by two makers, three load configurations; one cell already assigned.
function cell(id: number, entryId: number, loadConfigurationId: number, overrides: Partial<MatrixCell> = {}) {
  return {
    id,
    roundupId: 7,
    entryId,
    loadConfigurationId,
    state: 'not-started',
    tester: null,
    dueDate: null,
    overdue: false,
    note: null,
    stateChangedAt: '2026-11-30T09:00:00.000Z',
    runCount: 0,
    qaFlags: [],
    actions: [],
    ...overrides,
  } satisfies MatrixCell;
}

const product = (id: number, maker: string, model: string) => ({
  id,
  maker,
  model,
  chipset: 'HX-B50',
  formFactor: 'atx' as const,
  archived: false,
});

const matrix: RoundupMatrix = {
  roundupId: 7,
  roundupState: 'on-the-bench',
  timeZone: 'Europe/Oslo',
  columns: [
    { loadConfigurationId: 1, name: 'Stock, 125 W', position: 0 },
    { loadConfigurationId: 2, name: 'Stock, 200 W', position: 1 },
    { loadConfigurationId: 3, name: 'All-core overclock', position: 2 },
  ],
  rows: [
    {
      entryId: 11,
      kind: 'tested',
      product: product(101, 'Vesk', 'Vesk Halden B70'),
      cells: [cell(1, 11, 1), cell(2, 11, 2), cell(3, 11, 3)],
    },
    {
      entryId: 12,
      kind: 'tested',
      product: product(102, 'Ostrel Works', 'Holloway B50'),
      cells: [
        cell(4, 12, 1, {
          state: 'recorded',
          tester: { id: 5, displayName: 'Jules Marrow' },
          actions: ['accept', 'send-back'],
        }),
        cell(5, 12, 2),
        cell(6, 12, 3),
      ],
    },
  ],
  progress: {
    cellCount: 6,
    acceptedCount: 0,
    percentAccepted: 0,
    unassignedCount: 5,
    countsByState: { 'not-started': 5, assigned: 0, running: 0, recorded: 1, 'needs-retest': 0, accepted: 0 },
  },
};

const testers = [
  { id: 5, displayName: 'Jules Marrow' },
  { id: 6, displayName: 'Priya Okonkwo-Lind' },
];

/** Stands in for the server: records what was sent and answers as the API would. */
function fakeServer() {
  const assignments: AssignCellsRequest[] = [];
  const moves: { cellId: number; action: CellAction; note?: string }[] = [];
  return {
    assignments,
    moves,
    assignCells: async (assignment: AssignCellsRequest) => {
      assignments.push(assignment);
      const ids = new Set(assignment.cellIds ?? []);
      const rows = new Set(assignment.entryIds ?? []);
      const cells = matrix.rows
        .flatMap((row) => row.cells)
        .filter((c) => c.state === 'not-started' && (ids.has(c.id) || rows.has(c.entryId)));
      return { cells };
    },
    transitionCell: async (move: { cellId: number; action: CellAction; note?: string }) => {
      moves.push(move);
      const found = matrix.rows.flatMap((row) => row.cells).find((c) => c.id === move.cellId)!;
      return { ...found, state: 'accepted' as const, actions: [] };
    },
  };
}

describe('MatrixBoard', () => {
  it('names each product once, with the product column as the row header', () => {
    const server = fakeServer();
    render(<MatrixBoard matrix={matrix} canAssign testers={testers} {...server} />, { wrapper: MemoryRouter });
    expect(screen.getAllByRole('rowheader', { name: /Vesk Halden B70/ })[0]).toBeTruthy();
    expect(screen.queryByText(/Vesk Vesk/)).toBeNull();
  });

  it('when an editor assigns with nothing filled in, then every problem shows at once and nothing is sent', async () => {
    const user = userEvent.setup();
    const server = fakeServer();
    render(<MatrixBoard matrix={matrix} canAssign testers={testers} {...server} />, { wrapper: MemoryRouter });

    await user.click(screen.getByRole('button', { name: 'Assign chosen cells' }));

    expect(screen.getByText('Choose at least one cell or row.')).toBeTruthy();
    expect(screen.getByText('Choose a tester.')).toBeTruthy();
    expect(screen.getByText('Choose the due date.')).toBeTruthy();
    expect(server.assignments).toEqual([]);
  });

  it('when an editor chooses a row and a single cell, then both go to the tester in one assignment', async () => {
    const user = userEvent.setup();
    const server = fakeServer();
    render(<MatrixBoard matrix={matrix} canAssign testers={testers} {...server} />, { wrapper: MemoryRouter });

    await user.click(screen.getByRole('checkbox', { name: 'Choose the whole row: Vesk Halden B70' }));
    await user.click(screen.getByRole('checkbox', { name: 'Choose Ostrel Works Holloway B50 · Stock, 200 W' }));
    expect(screen.getByText(/4 cells chosen/)).toBeTruthy();

    await user.selectOptions(screen.getByRole('combobox', { name: /^Tester/ }), 'Priya Okonkwo-Lind');
    await user.type(screen.getByLabelText(/^Due date/), '2026-12-14');
    await user.click(screen.getByRole('button', { name: 'Assign chosen cells' }));

    expect(server.assignments).toEqual([{ cellIds: [5], entryIds: [11], testerId: 6, dueDate: '2026-12-14' }]);
    const status = await screen.findByRole('status');
    expect(status.textContent).toContain('4 cells assigned to Priya Okonkwo-Lind, due 14 Dec 2026.');
    expect(screen.getByText(/no cells chosen yet/)).toBeTruthy();
  });

  it('when an editor accepts a recorded cell, then the move is sent and its outcome is announced', async () => {
    const user = userEvent.setup();
    const server = fakeServer();
    render(<MatrixBoard matrix={matrix} canAssign testers={testers} {...server} />, { wrapper: MemoryRouter });

    const row = screen.getByRole('row', { name: /Holloway B50/ });
    await user.click(within(row).getByRole('button', { name: 'Accept: Ostrel Works Holloway B50 · Stock, 125 W' }));

    expect(server.moves).toEqual([{ cellId: 4, action: 'accept', note: undefined }]);
    expect((await screen.findByRole('status')).textContent).toContain(
      'Ostrel Works Holloway B50 · Stock, 125 W: Accepted.',
    );
  });

  it('when the roundup has left the bench, then nothing can be assigned', () => {
    const server = fakeServer();
    render(<MatrixBoard matrix={{ ...matrix, roundupState: 'writing' }} canAssign testers={testers} {...server} />, {
      wrapper: MemoryRouter,
    });
    expect(screen.queryByRole('button', { name: 'Assign chosen cells' })).toBeNull();
    expect(screen.getByText(/closed to changes/)).toBeTruthy();
  });
});
