import { useState } from 'react';
import { describeSubmitError } from '../../../lib/form-errors';

/**
 * What went wrong with the last request of a panel form: the server's field errors shown beside their fields and
 * its message above the form. `clear` before sending again, `fail` with the rejection.
 */
export function useSubmitProblems() {
  const [fields, setFields] = useState<Partial<Record<string, string>>>({});
  const [message, setMessage] = useState<string | null>(null);
  const clear = () => {
    setFields({});
    setMessage(null);
  };
  const fail = (error: unknown) => {
    const described = describeSubmitError(error);
    setFields(described.fields);
    setMessage(described.message);
  };
  return { fields, message, clear, fail };
}
