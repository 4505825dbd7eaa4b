import { useId, type ReactNode } from 'react';
import { DataTable, type DataTableColumn } from '../../../components/ui/data-table';
import type { AnalysisResult } from '../../../../shared/schemas/analysis';
import { formatC, formatDuration, thinSpace } from './format-figures';
import type { ChartLine, ChartSeries } from './read-chart-series';

const width = 720;
const height = 300;
const margin = { top: 16, right: 20, bottom: 40, left: 52 };
const plotWidth = width - margin.left - margin.right;
const plotHeight = height - margin.top - margin.bottom;

// The hottest probe in the accent, further probes in ink with their own dash, ambient in slate: never colour alone.
const probeStyles = [
  { stroke: 'var(--color-copper)', dash: undefined, width: 2 },
  { stroke: 'var(--color-ink)', dash: '6 3', width: 1.5 },
  { stroke: 'var(--color-ink)', dash: '2 3', width: 1.5 },
  { stroke: 'var(--color-muted)', dash: '8 3 2 3', width: 1.5 },
];
const ambientStyle = { stroke: 'var(--color-slate)', dash: '3 4', width: 1.5 };

function niceStep(span: number, targetTicks: number): number {
  const raw = span / targetTicks;
  const power = 10 ** Math.floor(Math.log10(raw));
  const scaled = raw / power;
  return (scaled <= 1 ? 1 : scaled <= 2 ? 2 : scaled <= 5 ? 5 : 10) * power;
}

function ticks(min: number, max: number, step: number): number[] {
  const list: number[] = [];
  for (let value = Math.ceil(min / step) * step; value <= max + step / 1e6; value += step) list.push(value);
  return list;
}

function pathOf(line: ChartLine, x: (s: number) => number, y: (c: number) => number): string {
  let d = '';
  let pen = false;
  for (const [s, c] of line.points) {
    if (Number.isNaN(c)) {
      pen = false;
      continue;
    }
    d += `${pen ? 'L' : 'M'}${x(s).toFixed(1)},${y(c).toFixed(1)}`;
    pen = true;
  }
  return d;
}

export interface TemperatureChartProps {
  series: ChartSeries;
  analysis: AnalysisResult;
}

/**
 * The VRM probes and the ambient probe over the whole log, absolute °C, with the peak and any throttled stretch marked,
 * and the cool-down tail after the load shaded as left out of the analysis.
 */
export function TemperatureChart({ series, analysis }: TemperatureChartProps) {
  const hatchId = useId();
  const titleId = useId();
  const ordered = [...series.vrm].sort((a, b) =>
    a.column === analysis.peakChannel ? -1 : b.column === analysis.peakChannel ? 1 : 0,
  );
  const lines = [...ordered, ...(series.ambient ? [series.ambient] : [])];
  const values = lines.flatMap((line) => line.points.map(([, c]) => c)).filter((c) => !Number.isNaN(c));
  const low = Math.min(...values);
  const high = Math.max(...values, analysis.peakC);
  const yStep = niceStep(Math.max(high - low, 5), 5);
  const yMin = Math.floor(low / yStep) * yStep;
  const yMax = Math.ceil(high / yStep) * yStep;
  const endMinutes = series.endS / 60;
  const xStep = niceStep(endMinutes, 6);
  const x = (s: number) => margin.left + (s / series.endS) * plotWidth;
  const y = (c: number) => margin.top + (1 - (c - yMin) / (yMax - yMin)) * plotHeight;
  const style = (line: ChartLine, index: number) =>
    series.ambient && line === series.ambient ? ambientStyle : probeStyles[index % probeStyles.length];

  const peakX = x(analysis.peakAtS);
  const peakY = y(analysis.peakC);
  const labelOnLeft = peakX > margin.left + plotWidth * 0.75;

  return (
    <figure className="rounded-[3px] border border-rule bg-surface px-4 py-3">
      <figcaption id={titleId} className="text-sm font-semibold text-ink">
        VRM probes and ambient over this log · absolute °C
      </figcaption>
      <ul className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-[0.8125rem] text-ink">
        {lines.map((line, index) => {
          const lineStyle = style(line, index);
          return (
            <li key={line.column} className="flex items-center gap-1.5">
              <svg width="28" height="8" aria-hidden="true">
                <line
                  x1="0"
                  y1="4"
                  x2="28"
                  y2="4"
                  stroke={lineStyle.stroke}
                  strokeWidth={lineStyle.width + 0.5}
                  strokeDasharray={lineStyle.dash}
                />
              </svg>
              <span className="font-mono">{line.column}</span>
              {line === series.ambient && <span className="text-muted">(ambient)</span>}
            </li>
          );
        })}
      </ul>
      <div className="mt-2 overflow-x-auto">
        <svg
          viewBox={`0 0 ${width} ${height}`}
          role="img"
          aria-labelledby={titleId}
          aria-describedby={`${titleId}-summary`}
          className="block w-full min-w-[560px] font-mono text-[11px]"
        >
          <defs>
            <pattern id={hatchId} width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
              <rect width="6" height="6" fill="var(--color-surface)" />
              <line x1="0" y1="0" x2="0" y2="6" stroke="var(--color-red)" strokeWidth="2" />
            </pattern>
          </defs>
          {analysis.loadEndS !== null && analysis.loadEndS < series.endS && (
            <g>
              <rect
                x={x(analysis.loadEndS)}
                y={margin.top}
                width={Math.max(2, margin.left + plotWidth - x(analysis.loadEndS))}
                height={plotHeight}
                fill="var(--color-wash)"
                opacity="0.8"
              />
              <MarkerLine
                atX={x(analysis.loadEndS)}
                top={margin.top}
                bottom={margin.top + plotHeight}
                color="var(--color-muted)"
                side="after"
                className="font-sans"
              >
                after the load · left out
              </MarkerLine>
            </g>
          )}
          {analysis.throttle.episodes.map((episode) => (
            <g key={episode.startS}>
              <rect
                x={x(episode.startS)}
                y={margin.top}
                width={Math.max(2, x(episode.endS) - x(episode.startS))}
                height={plotHeight}
                fill={`url(#${hatchId})`}
                opacity="0.35"
              />
              <text x={x(episode.startS) + 3} y={margin.top + 11} fill="var(--color-red)">
                throttled
              </text>
            </g>
          ))}
          {analysis.throttle.source === 'manual' && analysis.throttle.firstAtS !== null && (
            <g>
              <MarkerLine
                atX={x(analysis.throttle.firstAtS)}
                top={margin.top}
                bottom={margin.top + plotHeight}
                color="var(--color-red)"
                side="before"
              >
                throttle noted
              </MarkerLine>
            </g>
          )}
          {ticks(yMin, yMax, yStep).map((value) => (
            <g key={`y${value}`}>
              <line
                x1={margin.left}
                x2={margin.left + plotWidth}
                y1={y(value)}
                y2={y(value)}
                stroke="var(--color-rule)"
              />
              <text x={margin.left - 6} y={y(value) + 4} textAnchor="end" fill="var(--color-muted)">
                {`${value}${thinSpace}°C`}
              </text>
            </g>
          ))}
          {ticks(0, endMinutes, xStep).map((minute) => (
            <g key={`x${minute}`}>
              <line
                x1={x(minute * 60)}
                x2={x(minute * 60)}
                y1={margin.top + plotHeight}
                y2={margin.top + plotHeight + 4}
                stroke="var(--color-edge)"
              />
              <text x={x(minute * 60)} y={margin.top + plotHeight + 17} textAnchor="middle" fill="var(--color-muted)">
                {minute}
              </text>
            </g>
          ))}
          <text
            x={margin.left + plotWidth / 2}
            y={height - 4}
            textAnchor="middle"
            fill="var(--color-muted)"
            className="font-sans"
          >
            minutes into the log
          </text>
          <line
            x1={margin.left}
            x2={margin.left + plotWidth}
            y1={margin.top + plotHeight}
            y2={margin.top + plotHeight}
            stroke="var(--color-edge)"
          />
          {[...lines].reverse().map((line) => {
            const index = lines.indexOf(line);
            const lineStyle = style(line, index);
            return (
              <path
                key={line.column}
                d={pathOf(line, x, y)}
                fill="none"
                stroke={lineStyle.stroke}
                strokeWidth={lineStyle.width}
                strokeDasharray={lineStyle.dash}
                strokeLinejoin="round"
              />
            );
          })}
          <circle cx={peakX} cy={peakY} r="4" fill="var(--color-surface)" stroke="var(--color-ink)" strokeWidth="1.5" />
          <text
            x={labelOnLeft ? peakX - 8 : peakX + 8}
            y={Math.max(margin.top + 10, peakY - 8)}
            textAnchor={labelOnLeft ? 'end' : 'start'}
            fill="var(--color-ink)"
          >
            {`peak ${formatC(analysis.peakC)}`}
          </text>
        </svg>
      </div>
      <p id={`${titleId}-summary`} className="mt-1 text-[0.8125rem] text-muted">
        Readings as logged, thinned to the lowest and highest of each short stretch so no peak is lost; the figures
        above come from the server’s analysis. Room mean {formatC(analysis.ambientMeanC)}, soak{' '}
        {formatDuration(analysis.soakS)}.
        {analysis.loadEndS !== null &&
          ` The shaded stretch from ${formatDuration(analysis.loadEndS)} is after the load ended: a cool-down, left out of the analysis.`}
      </p>
      <ChartTable lines={lines} endS={series.endS} ambient={series.ambient} />
    </figure>
  );
}

const minutesOf = (s: number) => (Number.isInteger(s / 60) ? String(s / 60) : (s / 60).toFixed(1));

/** The highest reading of the line within [fromS, toS), or null when it logged nothing there. */
/** A dashed line down the plot at one moment, its words near the foot, on the side away from what it bounds. */
function MarkerLine({
  atX,
  top,
  bottom,
  color,
  side,
  className,
  children,
}: {
  atX: number;
  top: number;
  bottom: number;
  color: string;
  side: 'before' | 'after';
  className?: string;
  children: ReactNode;
}) {
  return (
    <>
      <line x1={atX} x2={atX} y1={top} y2={bottom} stroke={color} strokeWidth="1.5" strokeDasharray="4 3" />
      <text
        x={side === 'after' ? atX + 4 : atX - 4}
        y={bottom - 6}
        textAnchor={side === 'after' ? undefined : 'end'}
        fill={color}
        className={className}
      >
        {children}
      </text>
    </>
  );
}

function highestIn(line: ChartLine, fromS: number, toS: number): number | null {
  let highest: number | null = null;
  for (const [s, c] of line.points) {
    if (s < fromS || s >= toS || Number.isNaN(c)) continue;
    if (highest === null || c > highest) highest = c;
  }
  return highest;
}

/**
 * The chart as a table for screen readers and for anyone who wants the numbers: the highest reading of each probe
 * per stretch of the log (at most 30 rows, whole minutes), folded away until opened.
 */
function ChartTable({ lines, endS, ambient }: { lines: ChartLine[]; endS: number; ambient: ChartLine | null }) {
  const stepS = Math.max(60, Math.ceil(endS / 30 / 60) * 60);
  const rows: number[] = [];
  for (let from = 0; from < endS; from += stepS) rows.push(from);
  const columns: DataTableColumn<number>[] = [
    {
      id: 'minutes',
      header: 'Minutes',
      rowHeader: true,
      className: 'numeric',
      cell: (from) => `${from / 60}–${minutesOf(Math.min(from + stepS, endS))}`,
    },
    ...lines.map((line): DataTableColumn<number> => ({
      id: line.column,
      header: `${line.column}${line === ambient ? ' (ambient)' : ''}`,
      verbatimHeader: true,
      numeric: true,
      cell: (from) => {
        const highest = highestIn(line, from, from + stepS);
        return highest === null ? '—' : formatC(highest);
      },
    })),
  ];
  return (
    <details className="mt-2 text-[0.8125rem]">
      <summary className="cursor-pointer text-copper">The chart as a table</summary>
      <div className="mt-2">
        <DataTable
          caption={`Highest reading per probe, every ${stepS / 60} minutes of the log`}
          rows={rows}
          columns={columns}
          rowKey={(from) => from}
        />
      </div>
    </details>
  );
}
