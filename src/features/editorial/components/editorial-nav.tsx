import { NavLink } from 'react-router';
import { cx } from '../../../lib/class-names';
import { paths } from '../../../lib/paths';

/** Links between a roundup and its editorial screens. */
export function EditorialNav({ roundupId, readyLabel }: { roundupId: number; readyLabel?: string }) {
  const links = [
    { to: paths.roundup(roundupId), label: 'Roundup', end: true },
    { to: paths.roundupVerdicts(roundupId), label: 'Verdicts', end: false },
    { to: paths.roundupCharts(roundupId), label: 'Charts', end: false },
    { to: paths.roundupReadiness(roundupId), label: readyLabel ?? 'Ready to schedule?', end: false },
  ];
  return (
    <nav aria-label="Editorial" className="mb-4 flex flex-wrap gap-x-4 gap-y-1 text-sm">
      {links.map((link) => (
        <NavLink
          key={link.to}
          to={link.to}
          end={link.end}
          className={({ isActive }) =>
            cx('underline-offset-2 hover:underline', isActive ? 'font-semibold text-ink' : 'text-copper')
          }
        >
          {link.label}
        </NavLink>
      ))}
    </nav>
  );
}
