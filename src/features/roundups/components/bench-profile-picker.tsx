import { Button } from '../../../components/ui/button';
import { Select } from '../../../components/ui/select';
import type { BenchProfile } from '../../../../shared/schemas/bench-profiles';
import { BenchProfileSummary } from './bench-profile-summary';

export interface BenchProfilePickerProps {
  id: string;
  profiles: readonly BenchProfile[];
  /** The chosen profile's id as a string, '' for none. */
  value: string;
  onChange: (value: string) => void;
  onCreateNew: () => void;
  error?: string;
}

/** Choose a saved bench profile (or make a new one) and see what it fixes. */
export function BenchProfilePicker({ id, profiles, value, onChange, onCreateNew, error }: BenchProfilePickerProps) {
  const chosen = profiles.find((profile) => String(profile.id) === value) ?? null;
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-start gap-3">
        <Select
          id={id}
          label="Bench profile"
          options={profiles.map((profile) => ({
            value: String(profile.id),
            label: `${profile.name} (${profile.roomTempTargetC.toFixed(1)} °C, soak ${profile.requiredSoakMinutes} min)`,
          }))}
          placeholder={profiles.length ? 'No profile yet' : 'No saved profiles yet'}
          optional
          value={value}
          onChange={(event) => onChange(event.target.value)}
          error={error}
          description="A roundup needs a profile before it goes On the bench."
          className="min-w-0 flex-1 sm:min-w-72"
        />
        <Button onClick={onCreateNew} className="sm:mt-6">
          New bench profile…
        </Button>
      </div>
      {chosen && (
        <div className="rounded-[3px] border border-rule bg-paper/60 px-3 py-2.5">
          <BenchProfileSummary profile={chosen} />
        </div>
      )}
    </div>
  );
}
