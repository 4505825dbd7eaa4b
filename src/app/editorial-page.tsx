import { useEffect, type ReactNode } from 'react';
import { useLocation } from 'react-router';
import { PageHeader } from '../components/ui/page-header';
import { useRoundup } from '../features/roundups/api/get-roundup';
import { EditorialNav } from '../features/editorial/components/editorial-nav';

export interface EditorialPageProps {
  roundupId: number;
  title: string;
  description: string;
  actions?: ReactNode;
  children: ReactNode;
}

/** A roundup's editorial page (charts, verdicts, readiness): the roundup's title above the page's, then the tabs. */
export function EditorialPage({ roundupId, title, description, actions, children }: EditorialPageProps) {
  const roundup = useRoundup(roundupId);
  return (
    <>
      <PageHeader eyebrow={roundup.title} title={title} description={description} actions={actions} />
      <EditorialNav roundupId={roundupId} />
      {children}
    </>
  );
}

/** Brings the element named by the address's #hash into view: the readiness list links to one chart or verdict. */
export function useScrollToHash() {
  const { hash } = useLocation();
  useEffect(() => {
    if (hash) document.getElementById(hash.slice(1))?.scrollIntoView();
  }, [hash]);
}
