import { roundupStateLabels, type RoundupState } from '../planning/roundup-states';

// When a roundup's write-up exists and may change. It opens when testing is done (Writing) and stays editable while
// the roundup is in review; once scheduled it is read-only until a later update reopens it.

export const writeUpEditableStates: readonly RoundupState[] = ['writing', 'in-review'];
export const writeUpReadableStates: readonly RoundupState[] = ['writing', 'in-review', 'scheduled', 'live', 'updated'];

/** Null when the write-up may be edited in this roundup state, else why not. */
export function writeUpLockedReason(state: RoundupState): string | null {
  if (writeUpEditableStates.includes(state)) return null;
  if (!writeUpReadableStates.includes(state)) {
    return `The write-up opens when the roundup reaches Writing; it is ${roundupStateLabels[state]}.`;
  }
  return `The roundup is ${roundupStateLabels[state]}: its write-up can no longer change.`;
}
