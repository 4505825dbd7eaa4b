import { useState, type FormEvent } from 'react';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Checkbox } from '../../../components/ui/checkbox';
import { Panel } from '../../../components/ui/panel';
import { TextField } from '../../../components/ui/text-field';
import { useOpenDataSettings, useSetOpenDataSettings } from '../api/publishing';
import { useSubmitProblems } from './use-submit-problems';

/**
 * Editors and admins: whether readers may download this roundup's raw logger files, and the outlet's licence line
 * printed with every roundup's open data. Published pages follow as soon as it is saved.
 */
export function OpenDataPanel({ roundupId }: { roundupId: number }) {
  const settings = useOpenDataSettings(roundupId);
  const save = useSetOpenDataSettings();
  const [rawFilesAllowed, setRawFilesAllowed] = useState(settings.rawFilesAllowed);
  const [licence, setLicence] = useState(settings.licence);
  const { fields, message, clear, fail } = useSubmitProblems();
  const [saved, setSaved] = useState(false);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    clear();
    setSaved(false);
    save.mutate(
      { id: roundupId, settings: { rawFilesAllowed, licence } },
      { onSuccess: () => setSaved(true), onError: fail },
    );
  };

  return (
    <Panel
      title="Open data"
      description="Readers download the results (CSV) and the analysis parameters of every published roundup. Published pages follow these settings as soon as you save them."
    >
      <form onSubmit={submit} noValidate className="space-y-4">
        {message && (
          <Alert tone="danger" title="Not saved" announce>
            {message}
          </Alert>
        )}
        <Checkbox
          label="Readers may download the raw logger files"
          description={
            settings.rawFileCount === 0
              ? 'No run of record of this roundup has a logger file (runs entered by hand have none).'
              : `${settings.rawFileCount} logger file${settings.rawFileCount === 1 ? '' : 's'} of runs of record would be offered, byte for byte as recorded.`
          }
          checked={rawFilesAllowed}
          onChange={(e) => setRawFilesAllowed(e.target.checked)}
          error={fields.rawFilesAllowed}
        />
        <TextField
          label="Licence line"
          description="The outlet's licence for its open data; the same line is printed with every roundup."
          required
          maxLength={300}
          value={licence}
          onChange={(e) => setLicence(e.target.value)}
          error={fields.licence}
        />
        <div className="flex items-center gap-3">
          <Button type="submit" variant="primary" pending={save.isPending}>
            Save open data settings
          </Button>
          <span role="status" className="text-sm">
            {saved ? 'Saved. Published pages show it now.' : ''}
          </span>
        </div>
      </form>
    </Panel>
  );
}
