import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { Alert } from '../../../components/ui/alert';
import { PageHeader } from '../../../components/ui/page-header';
import { Panel } from '../../../components/ui/panel';
import { benchSafetyCaution, roleGuides } from '../../../lib/role-guide';
import { roleLabels } from '../../../../shared/schemas/common';
import type { CurrentUser } from '../../../../shared/schemas/auth';

export interface RoleWelcomeProps {
  user: CurrentUser;
  /** The places this role can open, from the app's navigation. */
  places: readonly { to: string; label: string; description: string }[];
  /** The role's work (from the dashboard API), between the greeting and the guide. */
  children?: ReactNode;
}

/** The dashboard frame: who you are here, your role's work, then what the role does and where to go. */
export function RoleWelcome({ user, places, children }: RoleWelcomeProps) {
  const guide = roleGuides[user.role];
  return (
    <>
      <PageHeader
        eyebrow="Dashboard"
        documentTitle="Dashboard"
        title={`Welcome, ${user.displayName}`}
        description={
          <>
            You are signed in as <strong className="font-semibold text-ink">{roleLabels[user.role]}</strong>.
          </>
        }
      />

      {user.role === 'tester' && (
        <Alert tone="caution" title="Bench safety" className="mb-6">
          <ul className="mt-1 list-disc space-y-0.5 pl-4">
            {benchSafetyCaution.map((line) => (
              <li key={line}>{line}</li>
            ))}
          </ul>
        </Alert>
      )}

      {children && <div className="mb-6">{children}</div>}

      <div className="grid grid-cols-1 gap-5 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <Panel title={`What a${/^[aeiou]/i.test(roleLabels[user.role]) ? 'n' : ''} ${roleLabels[user.role]} does`}>
          <p className="max-w-[70ch] text-sm">{guide.summary}</p>
          <ul className="mt-3 max-w-[70ch] space-y-1.5 text-sm">
            {guide.tasks.map((task) => (
              <li key={task} className="flex gap-2">
                <span aria-hidden="true" className="numeric text-copper">
                  —
                </span>
                <span>{task}</span>
              </li>
            ))}
          </ul>
        </Panel>

        <Panel title="Open now">
          <ul className="divide-y divide-rule text-sm">
            {places.map((place) => (
              <li key={place.to} className="py-2 first:pt-0 last:pb-0">
                <Link to={place.to} className="font-semibold text-copper underline-offset-2 hover:underline">
                  {place.label}
                </Link>
                <p className="text-muted">{place.description}</p>
              </li>
            ))}
          </ul>
        </Panel>
      </div>
    </>
  );
}
