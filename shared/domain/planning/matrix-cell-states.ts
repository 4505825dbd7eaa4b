// A matrix cell is one product × one load configuration of a roundup. Its life, and who moves it:
//
//   not-started ──assign (editor)──▶ assigned ──start (its tester)──▶ running ──record (its tester)──▶ recorded
//                                       ▲  ◀──pause (its tester)──────┘                                  │
//                                       │                                                  accept (editor)
//   needs-retest ◀──send-back (editor, with a reason)── recorded / accepted                           ▼
//        └──start (its tester)──▶ running                                                         accepted
//
// Editors assign, unassign, accept and send back; a tester starts, pauses and records only cells assigned
// to them. Nothing reaches accepted except from recorded, so no cell jumps from not started to accepted.

export const cellStates = ['not-started', 'assigned', 'running', 'recorded', 'needs-retest', 'accepted'] as const;
export type CellState = (typeof cellStates)[number];

export const cellStateLabels: Record<CellState, string> = {
  'not-started': 'Not started',
  assigned: 'Assigned',
  running: 'Running',
  recorded: 'Recorded',
  'needs-retest': 'Needs retest',
  accepted: 'Accepted',
};

export const cellActions = ['start', 'pause', 'record', 'accept', 'send-back', 'unassign'] as const;
export type CellAction = (typeof cellActions)[number];

type Actor = 'assigned-tester' | 'editor';

interface ActionRule {
  from: readonly CellState[];
  to: CellState;
  by: Actor;
  label: string;
}

export const cellActionRules: Record<CellAction, ActionRule> = {
  start: { from: ['assigned', 'needs-retest'], to: 'running', by: 'assigned-tester', label: 'Start run' },
  pause: { from: ['running'], to: 'assigned', by: 'assigned-tester', label: 'Back to queue' },
  record: { from: ['running'], to: 'recorded', by: 'assigned-tester', label: 'Mark recorded' },
  accept: { from: ['recorded'], to: 'accepted', by: 'editor', label: 'Accept' },
  'send-back': { from: ['recorded', 'accepted'], to: 'needs-retest', by: 'editor', label: 'Send back for retest' },
  unassign: { from: ['assigned'], to: 'not-started', by: 'editor', label: 'Unassign' },
};

/** States from which an editor may (re)assign a cell; assigning keeps needs-retest so the tester sees why. */
export const assignableStates: readonly CellState[] = ['not-started', 'assigned', 'needs-retest'];

/** States that count as work a tester still has to do, in their queue. */
export const queueStates: readonly CellState[] = ['assigned', 'running', 'needs-retest'];

/** States in which a cell's bench time can be booked. */
export const bookableStates: readonly CellState[] = ['assigned', 'running', 'needs-retest'];

/** States past which a cell holds (or is about to hold) results, so its product or configuration stays. */
export const statesWithWork: readonly CellState[] = ['running', 'recorded', 'needs-retest', 'accepted'];

export function stateAfterAssignment(state: CellState): CellState | null {
  if (!assignableStates.includes(state)) return null;
  return state === 'needs-retest' ? 'needs-retest' : 'assigned';
}

export interface CellFacts {
  state: CellState;
  testerId: number | null;
}

export interface ActingUser {
  id: number;
  role: string;
}

export type TransitionVerdict =
  { ok: true; to: CellState } | { ok: false; reason: 'wrong-role' | 'not-your-cell' | 'wrong-state'; message: string };

/** Decides whether the user may apply the action to the cell, and the state it leads to. */
export function decideCellTransition(cell: CellFacts, action: CellAction, user: ActingUser): TransitionVerdict {
  const rule = cellActionRules[action];
  if (rule.by === 'editor' && user.role !== 'editor') {
    return { ok: false, reason: 'wrong-role', message: `Only an editor may ${rule.label.toLowerCase()} a cell.` };
  }
  if (rule.by === 'assigned-tester') {
    if (user.role !== 'tester') {
      return { ok: false, reason: 'wrong-role', message: `Only the assigned tester may ${rule.label.toLowerCase()}.` };
    }
    if (cell.testerId !== user.id) {
      return { ok: false, reason: 'not-your-cell', message: 'This cell is assigned to another tester.' };
    }
  }
  if (!rule.from.includes(cell.state)) {
    const allowed = rule.from.map((s) => cellStateLabels[s]).join(' or ');
    return {
      ok: false,
      reason: 'wrong-state',
      message: `“${rule.label}” needs a cell that is ${allowed}; this one is ${cellStateLabels[cell.state]}.`,
    };
  }
  return { ok: true, to: rule.to };
}

/** The actions the user could take on the cell now (for buttons). */
export function availableCellActions(cell: CellFacts, user: ActingUser): CellAction[] {
  return cellActions.filter((action) => decideCellTransition(cell, action, user).ok);
}
