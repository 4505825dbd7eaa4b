import type { ReactNode, Ref } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { cx } from '../../../lib/class-names';
import { benchSafetyCaution } from '../../../lib/role-guide';
import type { AnalysisResult, Throttle, VerdictConcern } from '../../../../shared/schemas/analysis';
import { ChannelTable } from './channel-table';
import {
  formatC,
  formatCount,
  formatDeltaC,
  formatDuration,
  formatHertz,
  formatPercent,
  withUnit,
} from './format-figures';
import { QaFlagList } from './qa-flag-list';
import { VerdictMark } from './verdict-mark';

function Figure({ term, children, note }: { term: string; children: ReactNode; note?: ReactNode }) {
  return (
    <div className="border-b border-rule py-1.5 last:border-b-0">
      <div className="flex items-baseline justify-between gap-4">
        <dt className="text-sm text-muted">{term}</dt>
        <dd className="numeric text-right whitespace-nowrap text-ink">{children}</dd>
      </div>
      {note && <p className="mt-0.5 text-[0.8125rem] text-muted">{note}</p>}
    </div>
  );
}

/** A yes or no with its mark: ✓ when it is the good answer, ! when it needs a look, ✕ when it fails the run. */
function YesNo({ value, good = true, failing = false }: { value: boolean; good?: boolean; failing?: boolean }) {
  const fine = value === good;
  const style = fine ? 'text-teal' : failing ? 'text-red' : 'text-amber';
  return (
    <span className={style}>
      <span aria-hidden="true">{fine ? '✓ ' : failing ? '✕ ' : '! '}</span>
      {value ? 'yes' : 'no'}
    </span>
  );
}

const throttleSources: Record<Throttle['source'], string> = {
  clock: 'CPU clock',
  power: 'package power',
  manual: 'your note',
  none: 'nothing logged',
};

const concernEffects: Record<VerdictConcern['effect'], { words: string; glyph: string; style: string }> = {
  withholds: { words: 'withholds the verdict', glyph: '✕', style: 'text-red' },
  'makes-provisional': { words: 'makes it provisional', glyph: '!', style: 'text-amber' },
  'read-with': { words: 'read the verdict with it', glyph: 'i', style: 'text-muted' },
};

function throttleUnit(source: Throttle['source']): string {
  return source === 'power' ? 'W' : 'MHz';
}

export interface AnalysisResultsProps {
  analysis: AnalysisResult;
  fileName: string;
  /** True when the mapping or options changed after this analysis: the figures no longer match the form. */
  outdated: boolean;
  headingRef?: Ref<HTMLHeadingElement>;
  /** The chart of the log, when the file could be drawn. */
  chart?: ReactNode;
  /** Confirms a VRM column with no reading as a dead probe and analyses again without it. */
  onConfirmDeadProbe?: (column: string) => void;
}

/** The analysis of one soak, in the order a tester checks it: verdict, peak, steady state, room, log, throttle, QA. */
export function AnalysisResults({
  analysis,
  fileName,
  outdated,
  headingRef,
  chart,
  onConfirmDeadProbe,
}: AnalysisResultsProps) {
  const { verdict, prediction, throttle, uncertainty } = analysis;
  const soakShort = analysis.flags.some((flag) => flag.code === 'soak-too-short');
  const unconfirmedDead = analysis.flags.flatMap((flag) =>
    flag.code === 'probe-dead' && flag.severity === 'warning' && flag.channel ? [flag.channel] : [],
  );
  const missingSamples = analysis.gaps.reduce((sum, gap) => sum + gap.missingSamples, 0);

  return (
    <section aria-labelledby="log-check-results" className="space-y-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2 border-b border-rule pb-2">
        <h2 id="log-check-results" ref={headingRef} tabIndex={-1} className="text-xl font-semibold text-ink">
          Result
        </h2>
        <p className="font-mono text-[0.8125rem] break-all text-muted">{fileName}</p>
      </div>

      {outdated && (
        <Alert tone="warning" announce>
          The mapping or the options changed since this result. Press Analyse to see the figures for what the form says
          now.
        </Alert>
      )}

      <div className="rounded-[3px] border border-rule bg-surface px-5 py-4">
        <p className="text-xs font-semibold tracking-wide text-muted uppercase">
          {verdict.status === 'withheld'
            ? 'Verdict withheld'
            : verdict.status === 'provisional'
              ? 'Provisional verdict'
              : 'Verdict'}
        </p>
        <p className="mt-1">
          <VerdictMark code={verdict.code} label={verdict.label} status={verdict.status} size="lg" />
        </p>
        <p className="mt-2 max-w-[70ch] text-sm text-ink">{verdict.rule}</p>
        {verdict.judgedC !== null && (
          <p className="mt-1 text-[0.8125rem] text-muted">
            Judged on the {verdict.basis === 'normalized' ? 'normalised' : 'absolute'}{' '}
            {verdict.judgedFrom === 'predicted-steady-state' ? 'predicted steady state' : 'peak'},{' '}
            <span className="numeric">{formatC(verdict.judgedC)}</span>.
          </p>
        )}
        {verdict.concerns.length > 0 && (
          <div className="mt-3 border-t border-rule pt-2">
            <p className="text-sm font-semibold text-ink">QA flags that bear on this verdict</p>
            <ul className="mt-1 space-y-0.5 text-sm">
              {verdict.concerns.map((concern) => {
                const effect = concernEffects[concern.effect];
                return (
                  <li key={concern.code} className="flex gap-2">
                    <span aria-hidden="true" className={cx('w-3 shrink-0 font-mono font-bold', effect.style)}>
                      {effect.glyph}
                    </span>
                    <span className="text-ink">
                      {concern.label} <span className="text-muted">— {effect.words}</span>
                    </span>
                  </li>
                );
              })}
            </ul>
            <p className="mt-1 text-[0.8125rem] text-muted">Each is explained under QA flags below.</p>
          </div>
        )}
        {onConfirmDeadProbe && unconfirmedDead.length > 0 && (
          <div className="mt-3 flex flex-wrap gap-2">
            {unconfirmedDead.map((column) => (
              <Button key={column} size="sm" onClick={() => onConfirmDeadProbe(column)}>
                {column} is dead: judge without it
              </Button>
            ))}
          </div>
        )}
      </div>

      <Alert tone="caution" title="Before you quote or touch anything">
        <ul className="mt-1 list-disc space-y-0.5 pl-4">
          {benchSafetyCaution.map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </Alert>

      <div className="grid gap-5 lg:grid-cols-2">
        <Panel title="Peak">
          <dl>
            <Figure term="Peak">
              {formatC(analysis.peakC)}
              {uncertainty.peakToleranceC !== null && <> ±{withUnit(uncertainty.peakToleranceC.toFixed(1), '°C')}</>}
            </Figure>
            <Figure term="Reached at">{formatDuration(analysis.peakAtS)}</Figure>
            <Figure term="Hottest probe">
              <span className="font-mono">{analysis.peakChannel}</span>
            </Figure>
            <Figure term="Delta over ambient">{formatDeltaC(analysis.deltaOverAmbientC)}</Figure>
            <Figure
              term="Normalised peak"
              note={`The delta over ambient added to a ${formatC(analysis.referenceRoomC)} reference room.`}
            >
              {formatC(analysis.normalizedPeakC)}
            </Figure>
          </dl>
          <p className="mt-2 text-[0.8125rem] text-muted">
            {uncertainty.peakToleranceC !== null
              ? `± is the thermocouple tolerance at the peak, ${uncertainty.standard}.`
              : (uncertainty.note ?? `No tolerance band: the peak is outside ${uncertainty.standard}.`)}
          </p>
        </Panel>

        <Panel title="Steady state">
          <dl>
            <Figure term="Mean over the final window">{formatC(analysis.steadyStateMeanC)}</Figure>
            <Figure term="Steady state reached">
              <YesNo value={analysis.reachedSteadyState} />
            </Figure>
          </dl>
          <p className="mt-1 text-[0.8125rem] text-muted">{analysis.steadyStateRule}</p>
          <h3 className="mt-3 text-sm font-semibold text-ink">Prediction from a first-order rise</h3>
          {prediction ? (
            <dl className="mt-1">
              <Figure term="Time constant τ">{formatDuration(prediction.tauS)}</Figure>
              <Figure term="Predicted steady state">{formatC(prediction.predictedSteadyC)}</Figure>
              <Figure term="Loaded soak at least 5 τ">
                <YesNo value={prediction.soakAtLeastFiveTau} />
              </Figure>
              <Figure term="Fit residual (RMS)">{formatDeltaC(prediction.rmsResidualC)}</Figure>
              <Figure term="Good enough to judge by" note={analysis.predictionNote ?? undefined}>
                <YesNo value={prediction.goodFit} />
              </Figure>
            </dl>
          ) : (
            <p className="mt-1 text-sm text-ink">{analysis.predictionNote ?? 'No prediction for this log.'}</p>
          )}
          {prediction && <p className="mt-1 text-[0.8125rem] text-muted">{prediction.fitRule}</p>}
        </Panel>

        <Panel title="Room (ambient probe)">
          {analysis.ambientMeanC === null ? (
            <p className="text-sm text-ink">No ambient column was mapped, so there is no delta over ambient.</p>
          ) : (
            <dl>
              <Figure term="Mean">{formatC(analysis.ambientMeanC)}</Figure>
              <Figure term="Lowest">{formatC(analysis.ambientMinC)}</Figure>
              <Figure term="Highest">{formatC(analysis.ambientMaxC)}</Figure>
              <Figure term="Drift over the run">{formatDeltaC(analysis.ambientDriftC, true)}</Figure>
              <Figure term="Mean over the final window">{formatC(analysis.ambientFinalWindowMeanC)}</Figure>
            </dl>
          )}
        </Panel>

        <Panel title="Log">
          <dl>
            <Figure term="Soak logged" note={soakShort ? 'Shorter than the load configuration asks for.' : undefined}>
              <span className={soakShort ? 'text-amber' : undefined}>
                {soakShort && <span aria-hidden="true">! </span>}
                {formatDuration(analysis.soakS)} of {formatDuration(analysis.requiredSoakS)}
              </span>
            </Figure>
            <Figure term="Logged">{formatDuration(analysis.loggedS)}</Figure>
            <Figure term="Load started at">{formatDuration(analysis.loadStartS)}</Figure>
            <Figure
              term="Load ended at"
              note={
                analysis.loadEndS === null
                  ? undefined
                  : `${analysis.loadEndSource === 'manual' ? 'Set by you' : 'Package power and the clock fell to idle together'}: the cool-down tail after it is left out of every figure.`
              }
            >
              {analysis.loadEndS === null ? 'at the end of the log' : formatDuration(analysis.loadEndS)}
            </Figure>
            <Figure term="Sample rate">
              {formatHertz(analysis.sampleRateHz)} · every {formatDuration(analysis.sampleIntervalS)}
            </Figure>
            <Figure term="Samples">{formatCount(analysis.sampleCount)}</Figure>
            {analysis.readNotes.map((note) => (
              <Figure key={note} term="Time stamps" note={note}>
                spread evenly
              </Figure>
            ))}
            <Figure term="Gaps in the time column">
              {analysis.gaps.length === 0
                ? 'none'
                : `${analysis.gaps.length} (${formatCount(missingSamples)} samples missing)`}
            </Figure>
            <Figure term="Probe dropouts">{analysis.dropouts.length === 0 ? 'none' : analysis.dropouts.length}</Figure>
            <Figure term="Spikes removed">{analysis.spikes.length === 0 ? 'none' : analysis.spikes.length}</Figure>
          </dl>
        </Panel>

        <Panel title="Throttle">
          <dl>
            <Figure term="Throttled">
              <YesNo value={throttle.detected} good={false} failing />
            </Figure>
            <Figure term="Judged from">{throttleSources[throttle.source]}</Figure>
            <Figure term="First at">{throttle.firstAtS === null ? '—' : formatDuration(throttle.firstAtS)}</Figure>
            <Figure term="Share of the loaded soak">{formatPercent(throttle.shareThrottled)}</Figure>
            {throttle.loadedMedian !== null && throttle.threshold !== null && (
              <Figure term="Loaded median · threshold">
                {withUnit(Math.round(throttle.loadedMedian).toString(), throttleUnit(throttle.source))} ·{' '}
                {withUnit(Math.round(throttle.threshold).toString(), throttleUnit(throttle.source))}
              </Figure>
            )}
          </dl>
        </Panel>

        <Panel title="QA flags" description="What to check or mention before the run is used.">
          <QaFlagList flags={analysis.flags} />
        </Panel>
      </div>

      {chart}

      <Panel title="Per probe">
        <ChannelTable channels={analysis.channels} peakChannel={analysis.peakChannel} />
      </Panel>
    </section>
  );
}
