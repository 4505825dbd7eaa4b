import type { BenchProfile } from '../../../../shared/schemas/bench-profiles';
import { withUnit } from './planning-format';

/** The profile's facts as a compact definition list. */
export function BenchProfileSummary({ profile }: { profile: BenchProfile }) {
  const facts: [string, string][] = [
    ['Case and fans', profile.caseAndFans],
    ['Cooler', profile.cooler],
    ['Power supply', profile.psu],
    ['Memory', profile.memory],
    ['Room', `${withUnit(profile.roomTempTargetC, '°C', 1)} ± ${withUnit(profile.roomTempToleranceC, '°C', 1)}`],
    ['Probe', profile.probeType],
    ['Probe placement', profile.probePlacement],
    ['Required soak', `${profile.requiredSoakMinutes}\u2009min`],
  ];
  if (profile.notes) facts.push(['Notes', profile.notes]);
  return (
    <dl className="grid grid-cols-1 gap-x-6 gap-y-1.5 text-sm sm:grid-cols-[max-content_minmax(0,1fr)]">
      {facts.map(([term, value]) => (
        <div key={term} className="contents">
          <dt className="font-semibold text-muted">{term}</dt>
          <dd className="mb-1 sm:mb-0">{value}</dd>
        </div>
      ))}
    </dl>
  );
}
