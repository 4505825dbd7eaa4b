/**
 * Worker thread entry: the Log check pipeline (decode → read → map → analyse) off the server's event loop. Runs in
 * the pool of server/lib/log-analysis-pool.ts; what it returns is cloned back to the server thread.
 */
import type { AnalysisRequestInput } from '../../shared/schemas/analysis';
import { analyseLogFile, type AnalyseLogFileOutcome } from '../../shared/domain/analysis/analyse-log';

export interface AnalyseLogTask {
  bytes: Uint8Array;
  request: AnalysisRequestInput;
}

export default function analyseLogTask({ bytes, request }: AnalyseLogTask): AnalyseLogFileOutcome {
  return analyseLogFile(bytes, request);
}
