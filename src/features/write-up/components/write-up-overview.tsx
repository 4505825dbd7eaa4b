import { Link } from 'react-router';
import { Alert, ListAlert } from '../../../components/ui/alert';
import { buttonStyles } from '../../../components/ui/button';
import { DateTime } from '../../../components/ui/date-time';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { RoundupStateBadge } from '../../../components/ui/roundup-state-badge';
import { paths } from '../../../lib/paths';
import { countOf } from '../../../lib/plural';
import { sectionKindLabels } from '../../../../shared/domain/editorial/section-states';
import { useWriteUp } from '../api/get-write-up';
import { SectionStateBadge } from './section-state-badge';

/** The roundup's write-up at a glance: its sections in order, their review state, and what is still blocking. */
export function WriteUpOverview({ roundupId }: { roundupId: number }) {
  const writeUp = useWriteUp(roundupId);
  const signedOff = writeUp.sections.filter((s) => s.reviewState === 'signed-off').length;
  return (
    <>
      <p className="mb-2 text-sm">
        <Link to={paths.roundup(roundupId)} className="text-copper underline-offset-2 hover:underline">
          ← {writeUp.roundupTitle}
        </Link>
      </p>
      <PageHeader
        eyebrow="Write-up"
        title={writeUp.roundupTitle}
        documentTitle={`Write-up: ${writeUp.roundupTitle}`}
        description={
          <span className="inline-flex flex-wrap items-center gap-2">
            <RoundupStateBadge state={writeUp.roundupState} />
            {writeUp.sections.length > 0 && (
              <span>
                {signedOff} of {countOf(writeUp.sections.length, 'section', 'sections')} signed off
              </span>
            )}
          </span>
        }
        actions={
          writeUp.sections.length > 0 && (
            <a
              href={paths.writeUpPreview(roundupId)}
              target="_blank"
              rel="noopener"
              className={buttonStyles('secondary')}
            >
              Preview the public page <span className="sr-only">(opens in a new tab)</span>
            </a>
          )
        }
      />
      {writeUp.lockedReason && (
        <Alert tone="info" className="mb-4">
          {writeUp.lockedReason}
        </Alert>
      )}
      {writeUp.blocking.length > 0 && writeUp.sections.length > 0 && (
        <ListAlert
          tone="warning"
          title="Not ready yet"
          className="mb-4"
          items={writeUp.blocking}
          listClassName="list-disc pl-5"
        />
      )}
      {writeUp.sections.length > 0 && writeUp.blocking.length === 0 && (
        <Alert tone="success" className="mb-4">
          Every section is signed off and no comment thread is open.
        </Alert>
      )}
      {writeUp.sections.length > 0 && (
        <Panel title="Sections">
          <ol className="divide-y divide-rule">
            {writeUp.sections.map((section) => (
              <li key={section.id} className="flex flex-wrap items-center justify-between gap-2 py-2.5">
                <div className="min-w-0">
                  <Link
                    to={paths.writeUpSection(roundupId, section.id)}
                    className="font-semibold text-ink underline-offset-2 hover:underline"
                  >
                    {section.title}
                  </Link>
                  <p className="text-xs text-muted">
                    {section.kind === 'product' ? 'Product section' : sectionKindLabels[section.kind]} · version{' '}
                    <span className="numeric">{section.version}</span>
                    {section.updatedBy && (
                      <>
                        {' '}
                        · last saved by {section.updatedBy.displayName}, <DateTime value={section.updatedAt} />
                      </>
                    )}
                  </p>
                </div>
                <div className="flex items-center gap-2">
                  {section.openThreadCount > 0 && (
                    <span className="text-xs font-semibold text-amber">
                      {countOf(section.openThreadCount, 'open thread', 'open threads')}
                    </span>
                  )}
                  <SectionStateBadge state={section.reviewState} />
                </div>
              </li>
            ))}
          </ol>
        </Panel>
      )}
    </>
  );
}
