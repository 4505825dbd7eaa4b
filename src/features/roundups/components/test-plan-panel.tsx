import { useId, useMemo, useState } from 'react';
import { AnnouncedAlert, ListAlert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { Panel } from '../../../components/ui/panel';
import { describeSubmitError } from '../../../lib/form-errors';
import type { RoundupDetail } from '../../../../shared/schemas/roundups';
import { useBenchProfiles } from '../api/bench-profiles';
import { useLoadConfigurations } from '../api/load-configurations';
import { useSetLoadConfigurations } from '../api/set-load-configurations';
import { useUpdateRoundup } from '../api/update-roundup';
import { BenchProfilePicker } from './bench-profile-picker';
import { BenchProfileSummary } from './bench-profile-summary';
import { uniqueById, usePlanDialogs } from './plan-dialogs';
import { describeConfiguration, LoadConfigurationPlan } from './load-configuration-plan';

export interface TestPlanPanelProps {
  roundup: RoundupDetail;
  /** Editors change the plan while the roundup is Planning or On the bench. */
  canEdit: boolean;
}

/** The bench profile and the ordered load configurations; editors change them here. */
export function TestPlanPanel({ roundup, canEdit }: TestPlanPanelProps) {
  const [editing, setEditing] = useState(false);
  const [saved, setSaved] = useState<string | null>(null);
  const editable = canEdit && roundup.planEditable;

  return (
    <div className="space-y-5">
      {roundup.planWarnings.length > 0 && (
        <ListAlert
          tone="warning"
          title="Worth a second look"
          items={roundup.planWarnings}
          listClassName="list-disc space-y-0.5 pl-4"
        />
      )}
      <AnnouncedAlert tone="success" message={saved} />
      {editing ? (
        <TestPlanEditor
          roundup={roundup}
          onDone={(message) => {
            setEditing(false);
            setSaved(message);
          }}
          onCancel={() => setEditing(false)}
        />
      ) : (
        <div className="grid gap-5 lg:grid-cols-2">
          <Panel
            title="Bench profile"
            actions={
              editable ? (
                <Button
                  size="sm"
                  onClick={() => {
                    setSaved(null);
                    setEditing(true);
                  }}
                >
                  Change test plan
                </Button>
              ) : undefined
            }
          >
            {roundup.benchProfile ? (
              <>
                <p className="mb-2 font-semibold">{roundup.benchProfile.name}</p>
                <BenchProfileSummary profile={roundup.benchProfile} />
              </>
            ) : (
              <EmptyState title="No bench profile yet">A roundup needs one before it goes On the bench.</EmptyState>
            )}
          </Panel>
          <Panel title="Load configurations" description="In test order; each is a column of the matrix.">
            {roundup.loadConfigurations.length === 0 ? (
              <EmptyState title="No load configurations yet" />
            ) : (
              <ol className="space-y-2 text-sm">
                {roundup.loadConfigurations.map((configuration, index) => (
                  <li key={configuration.id} className="flex gap-2">
                    <span className="numeric w-5 shrink-0 text-right text-muted">{index + 1}</span>
                    <span>
                      <span className="font-medium">{configuration.name}</span>
                      <span className="block text-[0.8125rem] text-muted">{describeConfiguration(configuration)}</span>
                    </span>
                  </li>
                ))}
              </ol>
            )}
          </Panel>
        </div>
      )}
    </div>
  );
}

interface TestPlanEditorProps {
  roundup: RoundupDetail;
  onDone: (message: string) => void;
  onCancel: () => void;
}

function TestPlanEditor({ roundup, onDone, onCancel }: TestPlanEditorProps) {
  const profileFieldId = useId();
  const profiles = useBenchProfiles();
  const savedConfigurations = useLoadConfigurations();
  const updateRoundup = useUpdateRoundup();
  const setConfigurations = useSetLoadConfigurations();
  const [profileId, setProfileId] = useState(roundup.benchProfileId ? String(roundup.benchProfileId) : '');
  const [ids, setIds] = useState<number[]>(roundup.loadConfigurations.map((c) => c.id));
  const [error, setError] = useState<string | undefined>();
  const plan = usePlanDialogs({
    onProfile: (profile) => setProfileId(String(profile.id)),
    onConfiguration: (configuration) => setIds((current) => [...current, configuration.id]),
  });
  const { madeProfiles, madeConfigurations } = plan;

  // The roundup's own (possibly archived) choices stay listed next to the saved ones.
  const allProfiles = useMemo(
    () => uniqueById(profiles, madeProfiles, roundup.benchProfile ? [roundup.benchProfile] : []),
    [profiles, madeProfiles, roundup.benchProfile],
  );
  const allConfigurations = useMemo(
    () => uniqueById(savedConfigurations, madeConfigurations, roundup.loadConfigurations),
    [savedConfigurations, madeConfigurations, roundup.loadConfigurations],
  );
  const chosenProfile = allProfiles.find((p) => String(p.id) === profileId);
  const pending = updateRoundup.isPending || setConfigurations.isPending;

  const save = async () => {
    setError(undefined);
    const nextProfileId = profileId ? Number(profileId) : null;
    const profileChanged = nextProfileId !== roundup.benchProfileId;
    const before = roundup.loadConfigurations.map((c) => c.id);
    const configurationsChanged = JSON.stringify(before) !== JSON.stringify(ids);
    try {
      if (profileChanged)
        await updateRoundup.mutateAsync({ id: roundup.id, changes: { benchProfileId: nextProfileId } });
      if (configurationsChanged) await setConfigurations.mutateAsync({ id: roundup.id, loadConfigurationIds: ids });
      onDone(profileChanged || configurationsChanged ? 'The test plan was saved.' : 'Nothing changed.');
    } catch (failure) {
      setError(describeSubmitError(failure).message);
    }
  };

  return (
    <Panel title="Change the test plan">
      <div className="space-y-6">
        <AnnouncedAlert tone="danger" title="The test plan was not saved" message={error} />
        <BenchProfilePicker
          id={profileFieldId}
          profiles={allProfiles}
          value={profileId}
          onChange={setProfileId}
          onCreateNew={plan.newProfile}
        />
        <LoadConfigurationPlan
          configurations={allConfigurations}
          value={ids}
          onChange={setIds}
          onCreateNew={plan.newConfiguration}
          requiredSoakMinutes={chosenProfile?.requiredSoakMinutes}
        />
        <p className="text-[0.8125rem] text-muted">
          Removing a configuration removes its matrix column; one whose cells are running or have results cannot be
          removed.
        </p>
        <div className="flex flex-wrap gap-2">
          <Button variant="primary" onClick={() => void save()} pending={pending}>
            Save test plan
          </Button>
          <Button onClick={onCancel}>Cancel</Button>
        </div>
      </div>
      {plan.dialogs}
    </Panel>
  );
}
