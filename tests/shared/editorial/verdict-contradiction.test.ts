import { describe, expect, it } from 'vitest';
import { verdictContradictions, type VerdictEvidence } from '../../../shared/domain/editorial/verdict-contradiction';

const stock = (over: Partial<VerdictEvidence> = {}): VerdictEvidence => ({
  loadConfigurationName: 'Stock all-core',
  settingsMode: 'stock',
  hasRunOfRecord: true,
  verdictCode: 'comfortable',
  verdictStatus: 'final',
  throttled: false,
  ...over,
});
const overclocked = (over: Partial<VerdictEvidence> = {}): VerdictEvidence =>
  stock({ loadConfigurationName: 'Fixed 5.2 GHz', settingsMode: 'fixed', ...over });

describe('an editor’s label against the rubric verdicts', () => {
  it('recommending a board whose runs of record all held comfortably or warm needs no reason', () => {
    const evidence = [stock(), overclocked({ verdictCode: 'warm' })];
    expect(verdictContradictions('bench-pick', evidence)).toEqual([]);
    expect(verdictContradictions('recommended', evidence)).toEqual([]);
  });

  it('recommending a board that throttled contradicts the evidence', () => {
    const problems = verdictContradictions('recommended', [
      stock(),
      overclocked({ verdictCode: 'throttled', throttled: true }),
    ]);
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(/Fixed 5\.2 GHz.*throttled/);
  });

  it('withheld and provisional verdicts and a missing run of record cannot carry a recommendation', () => {
    expect(verdictContradictions('bench-pick', [stock({ verdictCode: null, verdictStatus: 'withheld' })])[0]).toMatch(
      /withheld/,
    );
    expect(verdictContradictions('bench-pick', [stock({ verdictStatus: 'provisional' })])[0]).toMatch(/provisional/);
    expect(
      verdictContradictions('recommended', [
        stock({ hasRunOfRecord: false, verdictCode: null, verdictStatus: null }),
      ])[0],
    ).toMatch(/no run of record/);
  });

  it('Hot but held contradicts a recommendation only under an overclocking load', () => {
    expect(verdictContradictions('recommended', [stock({ verdictCode: 'hot-but-held' })])).toEqual([]);
    expect(verdictContradictions('recommended', [overclocked({ verdictCode: 'hot-but-held' })])[0]).toMatch(
      /hot but held/,
    );
  });

  it('Fine at stock looks at the stock loads only; Skip for overclocking contradicts nothing', () => {
    const evidence = [stock(), overclocked({ verdictCode: 'throttled', throttled: true })];
    expect(verdictContradictions('fine-at-stock', evidence)).toEqual([]);
    expect(verdictContradictions('fine-at-stock', [stock({ throttled: true, verdictCode: 'throttled' })])).toHaveLength(
      1,
    );
    expect(
      verdictContradictions('skip-for-overclocking', [stock({ throttled: true, verdictCode: 'throttled' })]),
    ).toEqual([]);
  });
});
