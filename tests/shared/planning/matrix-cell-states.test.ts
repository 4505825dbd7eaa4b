import { describe, expect, it } from 'vitest';
import {
  availableCellActions,
  cellActions,
  cellStates,
  decideCellTransition,
  stateAfterAssignment,
  type CellAction,
  type CellState,
} from '../../../shared/domain/planning/matrix-cell-states';

const tester = { id: 7, role: 'tester' };
const otherTester = { id: 8, role: 'tester' };
const editor = { id: 1, role: 'editor' };

// The workflow Benchwire defines (first principles of the product rules, no external source).
describe('matrix cell transitions and who may make them', () => {
  it.each<[CellState, CellAction, typeof tester, CellState]>([
    ['assigned', 'start', tester, 'running'],
    ['needs-retest', 'start', tester, 'running'],
    ['running', 'pause', tester, 'assigned'],
    ['running', 'record', tester, 'recorded'],
    ['recorded', 'accept', editor, 'accepted'],
    ['recorded', 'send-back', editor, 'needs-retest'],
    ['accepted', 'send-back', editor, 'needs-retest'],
    ['assigned', 'unassign', editor, 'not-started'],
  ])('%s --%s--> allowed for the right person, leads to %s', (state, action, user, to) => {
    expect(decideCellTransition({ state, testerId: tester.id }, action, user)).toEqual({ ok: true, to });
  });

  it('nobody reaches accepted except from recorded', () => {
    for (const state of cellStates.filter((s) => s !== 'recorded')) {
      for (const user of [tester, editor]) {
        expect(
          decideCellTransition({ state, testerId: tester.id }, 'accept', user).ok,
          `${state} by ${user.role}`,
        ).toBe(false);
      }
    }
  });

  it('a tester moves only cells assigned to them, and never accepts', () => {
    expect(decideCellTransition({ state: 'assigned', testerId: tester.id }, 'start', otherTester)).toMatchObject({
      ok: false,
      reason: 'not-your-cell',
    });
    expect(decideCellTransition({ state: 'recorded', testerId: tester.id }, 'accept', tester)).toMatchObject({
      ok: false,
      reason: 'wrong-role',
    });
    expect(decideCellTransition({ state: 'assigned', testerId: tester.id }, 'start', editor)).toMatchObject({
      ok: false,
      reason: 'wrong-role',
    });
  });

  it('every action refuses states it does not start from, with the states it needs in the message', () => {
    const verdict = decideCellTransition({ state: 'not-started', testerId: null }, 'record', tester);
    expect(verdict).toMatchObject({ ok: false });
    const refused = decideCellTransition({ state: 'running', testerId: tester.id }, 'accept', editor);
    expect(refused).toEqual({
      ok: false,
      reason: 'wrong-state',
      message: '“Accept” needs a cell that is Recorded; this one is Running.',
    });
  });

  it('lists what each person can do with a cell', () => {
    expect(availableCellActions({ state: 'running', testerId: tester.id }, tester)).toEqual(['pause', 'record']);
    expect(availableCellActions({ state: 'recorded', testerId: tester.id }, editor)).toEqual(['accept', 'send-back']);
    expect(availableCellActions({ state: 'not-started', testerId: null }, editor)).toEqual([]);
    expect(cellActions).toHaveLength(6);
  });

  it('assignment: not started becomes assigned; needs retest keeps its state; running and beyond are not assignable', () => {
    expect(stateAfterAssignment('not-started')).toBe('assigned');
    expect(stateAfterAssignment('assigned')).toBe('assigned');
    expect(stateAfterAssignment('needs-retest')).toBe('needs-retest');
    expect(stateAfterAssignment('running')).toBeNull();
    expect(stateAfterAssignment('recorded')).toBeNull();
    expect(stateAfterAssignment('accepted')).toBeNull();
  });
});
