import { useEffect, useRef } from 'react';
import { PageHeader } from '../../../components/ui/page-header';
import { LogCheckSteps } from './log-check-steps';
import { LogFilePanel } from './log-file-panel';
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
  const resultHeading = useShowResult(check.result);

  return (
    <>
      <PageHeader
        eyebrow="Bench"
        title="Log check"
        description="Upload a logger file from a soak to see how Benchwire reads it, confirm which column is which, and get the peak, steady state, throttle, QA flags and verdict. Nothing is saved."
      />

      <div className="space-y-6">
        <LogFilePanel check={check} signInPath={signInPath} />

        <LogCheckSteps check={check} headingLevel={2} resultHeadingRef={resultHeading} />
      </div>
    </>
  );
}
