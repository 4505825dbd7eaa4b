import { useState } from 'react';
import { AnnouncedAlert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { describeSubmitError } from '../../lib/form-errors';
import { useRoundup } from '../../features/roundups/api/get-roundup';
import {
  readinessQueryOptions,
  useCellExclusion,
  useReadiness,
  useRequestReview,
} from '../../features/editorial/api/readiness';
import { ReadinessPanel } from '../../features/editorial/components/readiness-panel';
import { editorialDeciders, may } from '../../../shared/access/roles';
import { roundupRoute, type RoundupPageProps } from '../page-route';
import { EditorialPage } from '../editorial-page';
import { roundupStateLabels } from '../../../shared/domain/planning/roundup-states';

export const { loader, Component } = roundupRoute(
  { pageName: 'Ready to schedule?' },
  readinessQueryOptions,
  ReadinessPage,
);

function ReadinessPage({ user, roundupId }: RoundupPageProps) {
  const roundup = useRoundup(roundupId);
  const readiness = useReadiness(roundupId);
  const review = useRequestReview(roundupId);
  const exclusion = useCellExclusion(roundupId);
  const [reviewError, setReviewError] = useState<string>();
  return (
    <EditorialPage
      roundupId={roundupId}
      title="Ready to schedule?"
      description={`The roundup is ${roundupStateLabels[roundup.state]}. It is ready to schedule once it is in review and nothing below blocks it.`}
      actions={
        readiness.canRequestReview ? (
          <Button
            variant="primary"
            pending={review.isPending}
            onClick={async () => {
              setReviewError(undefined);
              try {
                await review.mutateAsync();
              } catch (failure) {
                setReviewError(describeSubmitError(failure).message);
              }
            }}
          >
            Send to review
          </Button>
        ) : undefined
      }
    >
      <AnnouncedAlert tone="danger" message={reviewError} className="mb-4" />
      <ReadinessPanel
        readiness={readiness}
        canExclude={
          may(user.role, editorialDeciders) && ['on-the-bench', 'writing', 'in-review'].includes(roundup.state)
        }
        onExclude={(cellId, reason) => exclusion.mutateAsync({ cellId, reason })}
        onInclude={(cellId) => exclusion.mutateAsync({ cellId, reason: null })}
      />
    </EditorialPage>
  );
}
