import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { DataTable } from '../../src/components/ui/data-table';
import { buttonColumn, dateColumn, numericColumn, textColumn } from '../../src/components/ui/data-table-columns';

interface Probe {
  id: number;
  name: string;
  peakC: number | null;
}

// Invented rows; the order a reader expects is plain alphabetical and numeric order.
const probes: Probe[] = [
  { id: 1, name: 'VRM rear', peakC: 71.5 },
  { id: 2, name: 'VRM front', peakC: null },
  { id: 3, name: 'Choke', peakC: 64 },
];

const columns = [
  textColumn<Probe>('name', 'Probe', (probe) => probe.name, { rowHeader: true }),
  numericColumn<Probe, number | null>(
    'peak',
    'Peak',
    (probe) => probe.peakC,
    (peak) => peak ?? '—',
  ),
];

interface Visit {
  id: number;
  day: string | null;
  at: string | null;
}

const rowHeaders = () => screen.getAllByRole('rowheader').map((cell) => cell.textContent);

describe('DataTable', () => {
  it('when the initial sort is a column id, then the rows open sorted by it ascending, keyed by their id', () => {
    render(<DataTable caption="Probes" rows={probes} columns={columns} initialSort="name" />);
    expect(rowHeaders()).toEqual(['Choke', 'VRM front', 'VRM rear']);
    expect(screen.getByRole('columnheader', { name: /Probe/ }).getAttribute('aria-sort')).toBe('ascending');
  });

  it('when a figure column is sorted, then rows without a value go last and the figure is shown formatted', async () => {
    render(<DataTable caption="Probes" rows={probes} columns={columns} />);
    await userEvent.click(screen.getByRole('button', { name: /Peak/ }));
    expect(rowHeaders()).toEqual(['Choke', 'VRM rear', 'VRM front']);
    expect(screen.getAllByRole('cell').map((cell) => cell.textContent)).toEqual(['64', '71.5', '—']);
  });

  it('when no filter is asked for, or the table is no longer than `aboveRows`, then there is no filter box; a placeholder alone gets the label from the noun', () => {
    const { rerender } = render(<DataTable caption="Probes" rows={probes} columns={columns} />);
    expect(screen.queryByRole('searchbox')).toBeNull();
    rerender(<DataTable caption="Probes" rows={probes} columns={columns} filter={{ label: 'Filter', aboveRows: 3 }} />);
    expect(screen.queryByRole('searchbox')).toBeNull();
    rerender(<DataTable caption="Probes" rows={probes} columns={columns} filter={{ label: 'Filter', aboveRows: 2 }} />);
    expect(screen.getByRole('searchbox', { name: 'Filter' })).toBeTruthy();
    rerender(
      <DataTable caption="Probes" rows={probes} columns={columns} filter="Probe name" noun={['probe', 'probes']} />,
    );
    expect(screen.getByRole('searchbox', { name: 'Filter probes' }).getAttribute('placeholder')).toBe('Probe name');
  });

  it('when the table shrinks to no more than `aboveRows` while a filter is typed, then the box goes and every row shows again', async () => {
    const filter = { label: 'Filter', aboveRows: 2 };
    const { rerender } = render(<DataTable caption="Probes" rows={probes} columns={columns} filter={filter} />);
    await userEvent.type(screen.getByRole('searchbox', { name: 'Filter' }), 'VRM');
    expect(rowHeaders()).toEqual(['VRM rear', 'VRM front']);
    const twoLeft = probes.slice(1);
    rerender(<DataTable caption="Probes" rows={twoLeft} columns={columns} filter={filter} />);
    expect(screen.queryByRole('searchbox')).toBeNull();
    expect(rowHeaders()).toEqual(['VRM front', 'Choke']);
  });

  it('when a column is left out, then it is skipped; a button column names its row', async () => {
    const onEdit = vi.fn();
    const withActions = (canEdit: boolean) => [
      ...columns,
      canEdit && buttonColumn<Probe>({ label: 'Edit', name: (probe) => `Edit ${probe.name}`, onClick: onEdit }),
    ];
    const { rerender } = render(<DataTable caption="Probes" rows={probes} columns={withActions(false)} />);
    expect(screen.queryByRole('columnheader', { name: 'Actions' })).toBeNull();
    rerender(<DataTable caption="Probes" rows={probes} columns={withActions(true)} />);
    const table = screen.getByRole('table', { name: 'Probes' });
    expect(within(table).getByRole('columnheader', { name: 'Actions' })).toBeTruthy();
    await userEvent.click(within(table).getByRole('button', { name: 'Edit Choke' }));
    expect(onEdit).toHaveBeenCalledWith(probes[2]);
  });

  it('when a date column is sorted, then calendar days and instants go in time order and none shows its empty text', async () => {
    // Invented dates; the ISO 8601 order of days and instants is that of the calendar.
    const visits: Visit[] = [
      { id: 1, day: '2026-03-01', at: '2026-03-01T08:00:00Z' },
      { id: 2, day: null, at: null },
      { id: 3, day: '2025-12-31', at: '2026-02-28T23:30:00Z' },
    ];
    render(
      <DataTable
        caption="Visits"
        rows={visits}
        columns={[
          textColumn<Visit>('id', 'Visit', (visit) => `Visit ${visit.id}`, { rowHeader: true }),
          dateColumn<Visit>('day', 'Day', (visit) => visit.day, { empty: 'Not set' }),
          dateColumn<Visit>('at', 'Signed in', (visit) => visit.at, {
            instant: true,
            empty: 'Never',
          }),
        ]}
        initialSort="day"
      />,
    );
    expect(rowHeaders()).toEqual(['Visit 3', 'Visit 1', 'Visit 2']);
    expect(screen.getByText('Not set')).toBeTruthy();
    await userEvent.click(screen.getByRole('button', { name: /Signed in/ }));
    expect(rowHeaders()).toEqual(['Visit 3', 'Visit 1', 'Visit 2']);
    expect(screen.getByText('Never')).toBeTruthy();
    await userEvent.click(screen.getByRole('button', { name: /Signed in/ }));
    expect(rowHeaders()).toEqual(['Visit 1', 'Visit 3', 'Visit 2']);
  });
});
