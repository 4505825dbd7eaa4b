import { useState } from 'react';
import { Alert } from '../../../components/ui/alert';
import { TextField } from '../../../components/ui/text-field';
import { cellTransitionRequestSchema } from '../../../../shared/schemas/matrix';
import { FormDialog } from '../../../components/ui/form-dialog';

export interface SendBackDialogProps {
  open: boolean;
  /** "Product · configuration", for the title. */
  cellName: string;
  pending: boolean;
  error?: string;
  onSend: (note: string) => void;
  onClose: () => void;
}

/** The editor's reason for a retest: the tester sees it in their queue. */
export function SendBackDialog({ open, cellName, pending, error, onSend, onClose }: SendBackDialogProps) {
  const [note, setNote] = useState('');
  const [problem, setProblem] = useState<string | undefined>();

  const submit = () => {
    const parsed = cellTransitionRequestSchema.safeParse({ action: 'send-back', note });
    if (!parsed.success) {
      setProblem(parsed.error.issues[0]?.message);
      return;
    }
    setProblem(undefined);
    onSend(parsed.data.note ?? '');
  };

  return (
    <FormDialog
      open={open}
      onClose={onClose}
      size="sm"
      title="Send back for retest"
      description={cellName}
      submitLabel="Send back"
      submitVariant="danger"
      pending={pending}
      onSubmit={submit}
      className="space-y-3"
    >
      <TextField
        label="Why it needs a retest"
        value={note}
        onChange={(event) => {
          setNote(event.target.value);
          setProblem(undefined);
        }}
        error={problem}
        maxLength={500}
        autoComplete="off"
        description="e.g. room drifted past the tolerance during the soak."
      />
      {error && (
        <Alert tone="danger" announce>
          {error}
        </Alert>
      )}
    </FormDialog>
  );
}
