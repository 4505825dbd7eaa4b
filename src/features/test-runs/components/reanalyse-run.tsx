import { useEffect, useMemo, useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { describeSubmitError } from '../../../lib/form-errors';
import { columnMappingSchema, type AnalysisRequestInput } from '../../../../shared/schemas/analysis';
import type { TestRun } from '../../../../shared/schemas/test-runs';
import { formatBytes } from '../../log-check/components/format-figures';
import { LogCheckSteps } from '../../log-check/components/log-check-steps';
import { useAppliedMapping } from '../../log-check/components/use-applied-mapping';
import { useLogCheck } from '../../log-check/components/use-log-check';
import { useReanalyseRun } from '../api/test-runs-api';

export interface ReanalyseRunProps {
  run: TestRun;
  /** The new analysis is stored (the run's query is refreshed) or the staff member closed the panel. */
  onClose: (stored: boolean) => void;
}

/**
 * Analyse a run's stored logger file again with another column mapping or other options: the same mapping form as
 * recording, filled in with the mapping and options of the analysis that counts now. The analysis is shown before
 * anything is stored; storing adds it beside the earlier ones and changes neither the file nor an earlier analysis.
 */
export function ReanalyseRun({ run, onClose }: ReanalyseRunProps) {
  const check = useLogCheck();
  const { choose, result } = check;
  const reanalyse = useReanalyseRun();
  const [fetchError, setFetchError] = useState<string | null>(null);
  const [attempt, setAttempt] = useState(0);
  const stored = run.loggerFile;
  const parameters = run.analysis.parameters as { mapping?: unknown; options?: unknown };
  const mapping = useMemo(() => {
    const parsed = columnMappingSchema.safeParse(parameters.mapping);
    return parsed.success ? parsed.data : null;
  }, [parameters.mapping]);
  const applied = useAppliedMapping(check, mapping, parameters.options);

  // The stored file, fetched again on each attempt and read by the same log check as a chosen file.
  const downloadUrl = stored?.downloadUrl;
  const fileName = stored?.originalName ?? 'stored.csv';
  useEffect(() => {
    if (!downloadUrl) return;
    const controller = new AbortController();
    fetch(downloadUrl, { signal: controller.signal, credentials: 'same-origin' })
      .then(async (response) => {
        if (!response.ok) throw new Error(String(response.status));
        const blob = await response.blob();
        if (!controller.signal.aborted) choose(new File([blob], fileName, { type: 'text/plain' }));
      })
      .catch(() => {
        if (!controller.signal.aborted) setFetchError('The stored file could not be fetched.');
      });
    return () => controller.abort();
  }, [downloadUrl, fileName, attempt, choose]);

  const store = () => {
    if (!result) return;
    const request = JSON.parse(result.requestJson) as AnalysisRequestInput;
    reanalyse.mutate(
      { runId: run.id, request: { mapping: request.mapping, options: request.options } },
      { onSuccess: () => onClose(true) },
    );
  };

  if (!stored) return null;
  return (
    <Panel
      title="Analyse the stored file again"
      description="Choose another column mapping or other options. The load configuration’s soak, the bench profile’s room target and the roundup’s verdict rubric still apply, as when the run was recorded."
    >
      <div className="space-y-6">
        <p className="text-sm">
          1 · The stored file: {stored.originalName} ({formatBytes(stored.byteSize)}), read again byte for byte.
        </p>
        {!check.reading && !fetchError && !check.failure && !check.requestError && (
          <p role="status" className="text-sm text-muted">
            Reading the stored file…
          </p>
        )}
        {(fetchError ?? check.requestError) && (
          <Alert tone="danger" announce>
            {fetchError ?? check.requestError?.message}{' '}
            <Button
              size="sm"
              variant="secondary"
              className="ml-1"
              onClick={() => {
                setFetchError(null);
                if (check.requestError) check.retry();
                else setAttempt((count) => count + 1);
              }}
            >
              Try again
            </Button>
          </Alert>
        )}
        <LogCheckSteps
          check={check}
          headingLevel={3}
          filledFrom={
            applied
              ? 'Filled in with the mapping and options of the analysis that counts now. Change them, then press Analyse.'
              : null
          }
        />
        {result && !check.resultOutdated && (
          <div className="space-y-3">
            <p className="text-sm">
              3 · Storing keeps this analysis beside the earlier ones; the newest analysis is the one that counts for
              the run. The file and earlier analyses stay as they are.
            </p>
            {reanalyse.isError && (
              <Alert tone="danger" announce>
                {describeSubmitError(reanalyse.error).message}
              </Alert>
            )}
            <div className="flex flex-wrap gap-2">
              <Button variant="primary" pending={reanalyse.isPending} onClick={store}>
                Store as a new analysis
              </Button>
              <Button variant="quiet" onClick={() => onClose(false)}>
                Close without storing
              </Button>
            </div>
          </div>
        )}
        {!(result && !check.resultOutdated) && (
          <Button variant="quiet" onClick={() => onClose(false)}>
            Close without storing
          </Button>
        )}
      </div>
    </Panel>
  );
}
