import { useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import { Alert } from '../../components/ui/alert';
import { Button } from '../../components/ui/button';
import { PageHeader } from '../../components/ui/page-header';
import { describeSubmitError } from '../../lib/form-errors';
import { paths } from '../../lib/paths';
import { sessionQueryOptions, useSession } from '../../features/auth/api/get-session';
import { roundupQueryOptions, useRoundup } from '../../features/roundups/api/get-roundup';
import {
  readinessQueryOptions,
  useCellExclusion,
  useReadiness,
  useRequestReview,
} from '../../features/editorial/api/readiness';
import { EditorialNav } from '../../features/editorial/components/editorial-nav';
import { ReadinessPanel } from '../../features/editorial/components/readiness-panel';
import { canOpen } from '../navigation';
import { RoleGate } from '../role-gate';
import { editorialDeciders, may } from '../../../shared/access/roles';
import { roundupStateLabels } from '../../../shared/domain/planning/roundup-states';

function roundupIdFrom(value: string | undefined): number {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  return id;
}

export function loader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const id = roundupIdFrom(params.id);
    const user = await queryClient.ensureQueryData(sessionQueryOptions());
    if (!user || !canOpen(paths.roundups, user.role)) return null;
    await Promise.all([
      queryClient.ensureQueryData(roundupQueryOptions(id)),
      queryClient.ensureQueryData(readinessQueryOptions(id)),
    ]);
    return null;
  };
}

export function Component() {
  return (
    <RoleGate path={paths.roundups} pageName="Ready to schedule?">
      <ReadinessPage />
    </RoleGate>
  );
}

function ReadinessPage() {
  const roundupId = roundupIdFrom(useParams().id);
  const user = useSession();
  const roundup = useRoundup(roundupId);
  const readiness = useReadiness(roundupId);
  const review = useRequestReview(roundupId);
  const exclusion = useCellExclusion(roundupId);
  const [reviewError, setReviewError] = useState<string>();
  if (!user) return null;
  return (
    <>
      <PageHeader
        eyebrow={roundup.title}
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
      />
      <EditorialNav roundupId={roundupId} />
      {reviewError && (
        <Alert tone="danger" announce className="mb-4">
          {reviewError}
        </Alert>
      )}
      <ReadinessPanel
        readiness={readiness}
        canExclude={
          may(user.role, editorialDeciders) && ['on-the-bench', 'writing', 'in-review'].includes(roundup.state)
        }
        onExclude={(cellId, reason) => exclusion.mutateAsync({ cellId, reason })}
        onInclude={(cellId) => exclusion.mutateAsync({ cellId, reason: null })}
      />
    </>
  );
}
