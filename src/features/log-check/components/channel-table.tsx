import { useMemo } from 'react';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import { numericColumn, textColumn } from '../../../components/ui/data-table-columns';
import type { ChannelFigures } from '../../../../shared/schemas/analysis';
import { formatC, formatDeltaC, formatDuration, unitLabel } from './format-figures';

/** One row per VRM probe: its own peak, minimum, steady-state mean and change, gaps and spikes. */
export function ChannelTable({ channels, peakChannel }: { channels: readonly ChannelFigures[]; peakChannel: string }) {
  const columns = useMemo<DataTableColumn<ChannelFigures>[]>(
    () => [
      textColumn('column', 'Probe', (channel) => channel.column, {
        rowHeader: true,
        cell: (channel) => (
          <span className="font-mono text-[0.8125rem]">
            {channel.column}
            {channel.column === peakChannel && <span className="ml-1.5 font-sans text-xs text-copper">hottest</span>}
          </span>
        ),
      }),
      { id: 'unit', header: 'Logged in', cell: (channel) => unitLabel(channel.unit), hideBelow: 'md' },
      numericColumn('peak', 'Peak', (c) => c.peakC, formatC),
      numericColumn('peakAt', 'Peak at', (c) => c.peakAtS, formatDuration, { hideBelow: 'sm' }),
      { id: 'min', header: 'Lowest', numeric: true, cell: (c) => formatC(c.minC), hideBelow: 'md' },
      numericColumn('steady', 'Final mean', (c) => c.steadyStateMeanC, formatC),
      {
        id: 'change',
        header: 'Final change',
        numeric: true,
        cell: (c) => formatDeltaC(c.steadyStateChangeC, true),
        hideBelow: 'sm',
      },
      {
        id: 'reached',
        header: 'Steady',
        cell: (c) =>
          c.dead ? (
            <span className="text-red">
              <span aria-hidden="true">✕ </span>No readings
            </span>
          ) : c.reachedSteadyState ? (
            <span className="text-teal">
              <span aria-hidden="true">✓ </span>Yes
            </span>
          ) : (
            <span className="text-amber">
              <span aria-hidden="true">! </span>No
            </span>
          ),
      },
      {
        id: 'predicted',
        header: 'Predicted steady',
        numeric: true,
        cell: (c) => formatC(c.predictedSteadyC),
        hideBelow: 'md',
      },
      { id: 'gaps', header: 'Gaps', numeric: true, cell: (c) => c.gapSamples, hideBelow: 'md' },
      { id: 'spikes', header: 'Spikes', numeric: true, cell: (c) => c.spikeCount, hideBelow: 'md' },
    ],
    [peakChannel],
  );
  return (
    <DataTable
      caption="Figures per VRM probe"
      rows={channels}
      columns={columns}
      rowKey={(channel) => channel.column}
      noun={['probe', 'probes']}
      footnote="Final mean and change are over the final window of the soak; predicted steady is the plateau of a first-order fit good enough to judge by; gaps and spikes count samples."
    />
  );
}
