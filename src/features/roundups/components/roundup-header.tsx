import { useState } from 'react';
import { Alert, ListAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { PageHeader } from '../../../components/ui/page-header';
import { describeSubmitError } from '../../../lib/form-errors';
import { roundupStateLabels } from '../../../../shared/domain/planning/roundup-states';
import type { RoundupDetail } from '../../../../shared/schemas/roundups';
import { useChangeRoundupState } from '../api/change-roundup-state';
import { formatCalendarDate } from '../../../lib/format-time';
import { formatBand } from './planning-format';
import { ProgressMeter } from '../../../components/ui/progress-meter';
import { RoundupStateBadge } from '../../../components/ui/roundup-state-badge';

export interface RoundupHeaderProps {
  roundup: RoundupDetail;
  /** Editors move the roundup forward. */
  canChangeState: boolean;
}

const moveExplanations: Partial<Record<string, string>> = {
  'on-the-bench': 'Testers can start runs once the roundup is On the bench. The plan can still change.',
  writing:
    'The matrix closes: no more runs or plan changes. Writers start on the results. A roundup does not move back.',
};

/** Title, state and the facts of the plan, the move to the next state, and the overclocking caution. */
export function RoundupHeader({ roundup, canChangeState }: RoundupHeaderProps) {
  const changeState = useChangeRoundupState();
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | undefined>();
  const [moved, setMoved] = useState<string | null>(null);
  const next = roundup.nextState;

  const confirm = () => {
    if (!next) return;
    setError(undefined);
    changeState.mutate(
      { id: roundup.id, to: next.to },
      {
        onSuccess: (updated) => {
          setConfirming(false);
          setMoved(`The roundup is now ${roundupStateLabels[updated.state]}.`);
        },
        onError: (failure) => setError(describeSubmitError(failure).message),
      },
    );
  };

  return (
    <>
      <PageHeader
        eyebrow="Roundup"
        title={roundup.title}
        description={
          <div className="space-y-1.5">
            <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-ink">
              <RoundupStateBadge state={roundup.state} />
              <span>{roundup.platform}</span>
              <span className="numeric">{formatBand(roundup.priceBand)}</span>
            </div>
            <p>
              Target publish date:{' '}
              <strong className="font-semibold text-ink">
                {roundup.targetPublishDate ? formatCalendarDate(roundup.targetPublishDate) : 'not set'}
              </strong>{' '}
              · Time zone {roundup.timeZone}
            </p>
            <ProgressMeter progress={roundup.progress} words="below" />
          </div>
        }
        actions={
          canChangeState && next ? (
            <Button
              variant={next.allowed ? 'primary' : 'secondary'}
              onClick={() => {
                setError(undefined);
                setMoved(null);
                setConfirming(true);
              }}
            >
              Move to {roundupStateLabels[next.to]}
            </Button>
          ) : undefined
        }
      />

      {moved && (
        <Alert tone="success" announce className="mb-4">
          {moved}
        </Alert>
      )}
      {canChangeState && next && !next.allowed && (
        <ListAlert
          tone="info"
          title={`Before it can move to ${roundupStateLabels[next.to]}`}
          className="mb-4"
          items={next.problems}
          listClassName="list-disc space-y-0.5 pl-4"
        />
      )}

      <Alert tone="caution" title="Overclocking caution" className="mb-5">
        Overclocking and raised voltages can shorten component life and void warranties. Results come from one open test
        system in a controlled room and may not match a closed case in a warm room.
      </Alert>

      {next && (
        <ConfirmDialog
          open={confirming}
          title={`Move to ${roundupStateLabels[next.to]}?`}
          confirmLabel={`Move to ${roundupStateLabels[next.to]}`}
          tone="primary"
          pending={changeState.isPending}
          error={error}
          onConfirm={confirm}
          onCancel={() => setConfirming(false)}
        >
          <p>{moveExplanations[next.to] ?? 'The roundup moves one step forward.'}</p>
          {!next.allowed && (
            <ul className="list-disc space-y-0.5 pl-4 text-muted">
              {next.problems.map((problem) => (
                <li key={problem}>{problem}</li>
              ))}
            </ul>
          )}
        </ConfirmDialog>
      )}
    </>
  );
}
