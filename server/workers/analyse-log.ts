/**
 * Worker thread entry: the Log check pipeline (decode → read → map → analyse) off the server's event loop. Runs in
 * the pool of server/lib/worker-pool.ts; what it returns is cloned back to the server thread.
 */
import { setPriority } from 'node:os';
import type { AnalysisRequestInput } from '../../shared/schemas/analysis';
import { analyseLogFile, type AnalyseLogFileOutcome } from '../../shared/domain/analysis/analyse-log';

// The lowest scheduling priority for this thread: on a machine short of cores the server's event loop (and anything
// else) runs first and the analysis takes what is left. On Linux a priority belongs to a thread, so this lowers the
// worker thread alone, never the server's (pid 0: the calling thread). Where the system refuses, the analysis runs at
// the normal priority.
try {
  setPriority(19);
} catch {
  // Not permitted here: nothing else to do.
}

export interface AnalyseLogTask {
  bytes: Uint8Array;
  request: AnalysisRequestInput;
}

export default function analyseLogTask({ bytes, request }: AnalyseLogTask): AnalyseLogFileOutcome {
  return analyseLogFile(bytes, request);
}
