import { Link } from 'react-router';
import { buttonStyles } from './button';
import { PageHeader } from './page-header';

export interface ForbiddenStateProps {
  /** The page the user tried to open, e.g. "Users". */
  pageName: string;
  /** The user's role, as shown to people ("Bench tester"). */
  roleLabel: string;
  /** Where to go instead. */
  homePath?: string;
}

/** The whole-page answer when a role may not open a page (the server refuses the data too). */
export function ForbiddenState({ pageName, roleLabel, homePath = '/' }: ForbiddenStateProps) {
  return (
    <>
      <PageHeader title={pageName} />
      <div role="alert" className="rounded-[3px] border border-l-4 border-rule border-l-amber bg-surface px-5 py-5">
        <p className="font-semibold text-ink">Your role cannot open this page</p>
        <p className="mt-1 text-sm text-ink">
          {pageName} is not part of the {roleLabel} role. If you need it for your work, ask an admin of your outlet.
        </p>
        <div className="mt-4">
          <Link to={homePath} className={buttonStyles('secondary')}>
            Go to the dashboard
          </Link>
        </div>
      </div>
    </>
  );
}
