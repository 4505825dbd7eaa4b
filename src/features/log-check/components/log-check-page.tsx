import { useEffect, useRef } from 'react';
import { PageHeader } from '../../../components/ui/page-header';
import { AnalysisResults } from './analysis-results';
import { ColumnMappingForm } from './column-mapping-form';
import { LogFilePanel } from './log-file-panel';
import { LogPreviewPanel } from './log-preview';
import { requestFromDraft } from './mapping-draft';
import { ParseErrorTable } from './parse-error-table';
import { TemperatureChart } from './temperature-chart';
import { useLogCheck, type LogResult } from './use-log-check';

export interface LogCheckPageProps {
  /** Where to sign in again when the session ends during an upload. */
  signInPath: string;
}

/** Keyboard and screen-reader users land on a new result; everyone sees it scrolled into view. */
function useShowResult(result: LogResult | null) {
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    const element = heading.current;
    if (!result || !element) return;
    const reduceMotion = window.matchMedia?.('(prefers-reduced-motion: reduce)').matches ?? false;
    element.scrollIntoView?.({ behavior: reduceMotion ? 'auto' : 'smooth', block: 'start' });
    element.focus({ preventScroll: true });
  }, [result]);
  return heading;
}

/**
 * Log check: choose a logger file, see how Benchwire reads it, confirm the column mapping and options, and get the
 * analysis. Nothing is stored; the chosen file stays in memory so the mapping can be changed and the file sent again.
 */
export function LogCheckPage({ signInPath }: LogCheckPageProps) {
  const check = useLogCheck();
  const { file, reading, draft, failure, result, sending } = check;
  const resultHeading = useShowResult(result);

  return (
    <>
      <PageHeader
        eyebrow="Bench"
        title="Log check"
        description="Upload a logger file from a soak to see how Benchwire reads it, confirm which column is which, and get the peak, steady state, throttle, QA flags and verdict. Nothing is saved."
      />

      <div className="space-y-6">
        <LogFilePanel check={check} signInPath={signInPath} />

        {failure?.stage === 'reading' && (
          <ParseErrorTable
            errors={failure.errors}
            message={failure.message}
            stage="reading"
            hasPreview={failure.hasPreview}
          />
        )}

        {file && reading && draft && (
          <>
            <LogPreviewPanel preview={reading.preview} fileName={file.name} />
            <div>
              <h2 className="mb-3 text-lg font-semibold text-ink">2 · Mapping and options</h2>
              <ColumnMappingForm
                preview={reading.preview}
                draft={draft}
                guess={reading.guess}
                onChange={check.setDraft}
                pending={sending?.stage === 'analysing'}
                disabled={sending?.stage === 'reading'}
                onAnalyse={check.analyse}
              />
            </div>
          </>
        )}

        {failure?.stage === 'analysing' && (
          <ParseErrorTable
            errors={failure.errors}
            message={failure.message}
            stage="analysing"
            hasPreview={failure.hasPreview}
          />
        )}

        {file && result && (
          <AnalysisResults
            analysis={result.outcome.analysis}
            fileName={file.name}
            outdated={check.resultOutdated}
            headingRef={resultHeading}
            onConfirmDeadProbe={
              reading && draft
                ? (column) => {
                    const next = { ...draft, confirmedDeadProbes: [...draft.confirmedDeadProbes, column] };
                    check.setDraft(next);
                    const built = requestFromDraft(next, reading.preview);
                    if (built.request) check.analyse(built.request);
                  }
                : undefined
            }
            chart={
              check.chartSeries ? (
                <TemperatureChart series={check.chartSeries} analysis={result.outcome.analysis} />
              ) : null
            }
          />
        )}
      </div>
    </>
  );
}
