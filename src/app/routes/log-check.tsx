import { paths } from '../../lib/paths';
import { LogCheckPage } from '../../features/log-check/components/log-check-page';
import { gatedPage, pageLoader } from '../page-route';

/** The page loads nothing up front: the tester's file is the data. */
export const loader = pageLoader(paths.logCheck);

export const Component = gatedPage({ path: paths.logCheck, pageName: 'Log check' }, () => (
  <LogCheckPage signInPath={paths.signIn(paths.logCheck)} />
));
