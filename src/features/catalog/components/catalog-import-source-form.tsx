import { useId, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { Panel } from '../../../components/ui/panel';
import { TextArea } from '../../../components/ui/text-area';
import { UploadProgress } from '../../../components/ui/upload-progress';
import { FileField } from '../../../components/ui/file-field';
import { RadioGroup } from '../../../components/ui/radio-group';
import { acceptAttribute, formatBytes } from '../../../lib/upload-size';
import { catalogImportUploadLimit } from '../../../../shared/upload-limits';
import type { CatalogImportFlow } from './use-catalog-import';

const sourceModes = [
  ['file', 'A file'],
  ['paste', 'Pasted text'],
] as const;

/** Step 1: a CSV file or pasted text, checked by the server without saving anything. */
export function CatalogImportSourceForm({ flow }: { flow: CatalogImportFlow }) {
  const fileInputId = useId();
  const { mode, file, sourceError, sending } = flow;
  const busy = sending !== null;

  const submit = (event: FormEvent) => {
    event.preventDefault();
    void flow.check();
  };

  return (
    <Panel title="1 · Choose the file" description="Checking saves nothing; you see every row first.">
      <form noValidate onSubmit={submit} className="space-y-4">
        <RadioGroup
          legend="Where the CSV comes from"
          name="csv-source"
          choices={sourceModes}
          value={mode}
          onChange={flow.setMode}
          inline
        />

        <div hidden={mode !== 'file'}>
          <FileField
            key={flow.fileInputKey}
            id={fileInputId}
            label="CSV file"
            accept={`${acceptAttribute(catalogImportUploadLimit)},text/csv`}
            error={sourceError ?? undefined}
            description={
              <>
                {file ? `${file.name}, ${formatBytes(file.size)}.` : 'Nothing chosen yet.'} An exported catalog file
                imports back as it is.
              </>
            }
            onChange={(event) => flow.chooseFile(event.target.files?.[0] ?? null)}
            inputClassName="block w-full text-sm file:mr-3 file:min-h-9 file:rounded-[3px] file:border file:border-edge file:bg-surface file:px-3.5 file:font-medium file:text-ink hover:file:bg-wash"
          />
        </div>
        {mode === 'paste' && (
          <TextArea
            label="CSV text"
            rows={8}
            value={flow.pasted}
            error={sourceError ?? undefined}
            spellCheck={false}
            textAreaClassName="font-mono text-[0.8125rem] whitespace-pre"
            description="Paste the rows with the header row first. You can fix rows here and check again."
            onChange={(event) => flow.setPasted(event.target.value)}
          />
        )}

        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" variant="primary" pending={sending?.step === 'preview'} disabled={busy}>
            Check the file
          </Button>
          {mode === 'file' && file && (
            <Button onClick={() => void flow.editFileAsText()} disabled={busy}>
              Edit it as text here
            </Button>
          )}
        </div>
        {sending?.step === 'preview' && (
          <UploadProgress
            progress={sending.progress}
            label="Checking the file"
            processingText="Uploaded. Checking every row against the catalog…"
          />
        )}
      </form>
    </Panel>
  );
}
