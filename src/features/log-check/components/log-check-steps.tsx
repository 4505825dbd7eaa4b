import type { Ref } from 'react';
import { AnalysisResults } from './analysis-results';
import { ColumnMappingForm } from './column-mapping-form';
import { LogPreviewPanel } from './log-preview';
import { requestFromDraft } from './mapping-draft';
import { ParseErrorTable } from './parse-error-table';
import { TemperatureChart } from './temperature-chart';
import type { LogCheck } from './use-log-check';

export interface LogCheckStepsProps {
  check: LogCheck;
  /** The level of the "Mapping and options" heading in its page. */
  headingLevel: 2 | 3;
  /**
   * Where the mapping was filled in from when it is not the server's guess (a mapping used before), said above the
   * form; with it, no field is marked as guessed.
   */
  filledFrom?: string | null;
  /** Focused when a new result arrives. */
  resultHeadingRef?: Ref<HTMLHeadingElement>;
}

/**
 * The steps after a logger file is chosen, the same wherever a file is analysed (Log check, recording a run,
 * analysing a stored run again): how the file reads, the mapping and options, what could not be read, and the
 * analysis with its chart. A dead probe confirmed from the result is analysed again at once.
 */
export function LogCheckSteps({ check, headingLevel, filledFrom, resultHeadingRef }: LogCheckStepsProps) {
  const { file, reading, draft, failure, result, sending } = check;
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  // What could not be read shows where it failed: above the mapping when reading, below it when analysing.
  const failureAt = (stage: 'reading' | 'analysing') =>
    failure?.stage === stage && (
      <ParseErrorTable
        errors={failure.errors}
        message={failure.message}
        stage={stage}
        hasPreview={failure.hasPreview}
      />
    );
  return (
    <>
      {failureAt('reading')}

      {file && reading && draft && (
        <>
          <LogPreviewPanel preview={reading.preview} fileName={file.name} />
          <div>
            <Heading className="mb-3 text-lg font-semibold text-ink">2 · Mapping and options</Heading>
            {filledFrom && (
              <p role="status" className="mb-3 text-sm text-ink">
                <span aria-hidden="true" className="mr-1.5 font-mono text-teal">
                  ↺
                </span>
                {filledFrom}
              </p>
            )}
            <ColumnMappingForm
              preview={reading.preview}
              draft={draft}
              guess={filledFrom ? null : reading.guess}
              onChange={check.setDraft}
              pending={sending?.stage === 'analysing'}
              disabled={sending?.stage === 'reading'}
              onAnalyse={check.analyse}
            />
          </div>
        </>
      )}

      {failureAt('analysing')}

      {file && result && (
        <AnalysisResults
          analysis={result.outcome.analysis}
          fileName={file.name}
          outdated={check.resultOutdated}
          headingRef={resultHeadingRef}
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
    </>
  );
}
