import type { DataSource } from 'typeorm';
import { EditorialVerdictEntity } from '../entities/editorial-verdict.entity';
import { AppError, notFound } from '../errors';
import { loadPeople, personOrNull } from '../mappers/people';
import { loadEditorialFacts, type EditorialFacts } from '../lib/editorial-facts';
import { lockRoundup } from '../lib/roundup-access';
import { recordPlanChange } from '../lib/roundup-audit';
import { verdictContradictions } from '../../shared/domain/editorial/verdict-contradiction';
import { editorialLabelNames } from '../../shared/domain/editorial/editorial-labels';
import { roundupStateLabels, type RoundupState } from '../../shared/domain/planning/roundup-states';
import type { CurrentUser } from '../../shared/schemas/auth';
import type { ParsedSetVerdictRequest, RoundupVerdicts, VerdictEvidenceDto } from '../../shared/schemas/verdicts';

/** States in which verdicts and charts are decided: once there are results, until the roundup is scheduled. */
export const editorialStates: readonly RoundupState[] = ['on-the-bench', 'writing', 'in-review'];

export function assertEditorialState(state: RoundupState) {
  if (!editorialStates.includes(state)) {
    throw new AppError(
      'editorial_locked',
      422,
      `The roundup is ${roundupStateLabels[state]}: verdicts and charts are decided while it is On the bench, Writing or In review.`,
    );
  }
}

/** The rubric verdicts of a tested entry's runs of record, one per load configuration of the plan. */
export function evidenceOf(facts: EditorialFacts, entryId: number): VerdictEvidenceDto[] {
  return facts.configurations.flatMap((configuration) => {
    const cell = facts.cells.find((c) => c.entryId === entryId && c.loadConfigurationId === configuration.id);
    if (!cell) return [];
    const run = facts.sources.runs.find((r) => r.entryId === entryId && r.loadConfigurationId === configuration.id);
    return [
      {
        loadConfigurationId: configuration.id,
        loadConfigurationName: configuration.name,
        settingsMode: configuration.settingsMode as VerdictEvidenceDto['settingsMode'],
        hasRunOfRecord: run !== undefined,
        runId: run?.runId ?? null,
        cellId: cell.id,
        verdictCode: run?.verdictCode ?? null,
        verdictStatus: run?.verdictStatus ?? null,
        verdictLabel: run?.verdictLabel ?? null,
        throttled: run?.throttled ?? false,
        peakC: run?.peakC ?? null,
      },
    ];
  });
}

/** The editor's verdicts: a label from Benchwire's list, "best for" and the price at publication, per product. */
export class VerdictsService {
  constructor(private readonly dataSource: DataSource) {}

  async list(roundupId: number): Promise<RoundupVerdicts> {
    const manager = this.dataSource.manager;
    const facts = await loadEditorialFacts(manager, roundupId);
    const people = await loadPeople(
      manager,
      [...facts.verdicts.values()].map((v) => v.updatedBy),
    );
    return {
      roundupId,
      currency: facts.roundup.currency,
      editable: editorialStates.includes(facts.roundup.state),
      products: facts.tested.map(({ entry, product, name }) => {
        const evidence = evidenceOf(facts, entry.id);
        const verdict = facts.verdicts.get(entry.id);
        return {
          entryId: entry.id,
          productId: product.id,
          productName: name,
          evidence,
          catalogPrice: facts.catalogPrices.get(entry.id) ?? null,
          verdict: verdict
            ? {
                label: verdict.label,
                bestFor: verdict.bestFor,
                price: { amountMinor: verdict.priceMinor, currency: verdict.priceCurrency },
                reason: verdict.reason,
                updatedBy: personOrNull(people, verdict.updatedBy),
                updatedAt: verdict.updatedAt.toISOString(),
              }
            : null,
          contradictions: verdict ? verdictContradictions(verdict.label, evidence) : [],
        };
      }),
    };
  }

  /**
   * Sets the editor's verdict on a tested product. A label that goes against the rubric verdicts of its runs of
   * record (shared/domain/editorial/verdict-contradiction) stands only with a written reason: 422 otherwise.
   */
  async set(
    actor: CurrentUser,
    roundupId: number,
    entryId: number,
    input: ParsedSetVerdictRequest,
  ): Promise<RoundupVerdicts> {
    await this.dataSource.transaction(async (manager) => {
      const roundup = await lockRoundup(manager, roundupId, 'pessimistic_read');
      assertEditorialState(roundup.state);
      const facts = await loadEditorialFacts(manager, roundupId);
      const tested = facts.tested.find((t) => t.entry.id === entryId);
      if (!tested) {
        if (facts.references.some((r) => r.entry.id === entryId)) {
          throw new AppError(
            'reference_entry',
            422,
            'A reference product shows earlier results; it gets no verdict here.',
          );
        }
        throw notFound('That product in this roundup');
      }
      const contradictions = verdictContradictions(input.label, evidenceOf(facts, entryId));
      if (contradictions.length > 0 && !input.reason) {
        throw new AppError(
          'reason_required',
          422,
          `${editorialLabelNames[input.label]} goes against the measurements: write why it stands.`,
          { reason: `Write why the label stands: ${contradictions.join(' ')}`.slice(0, 500) },
          { contradictions },
        );
      }
      const repo = manager.getRepository(EditorialVerdictEntity);
      const existing = await repo.findOneBy({ entryId });
      const values = {
        roundupId,
        entryId,
        label: input.label,
        bestFor: input.bestFor,
        priceMinor: input.price.amountMinor,
        priceCurrency: input.price.currency,
        reason: input.reason ?? null,
        contradictions: contradictions.length ? contradictions : null,
        updatedBy: actor.id,
      };
      if (existing) await repo.update({ id: existing.id }, values);
      else await repo.insert(values);
      await recordPlanChange(manager, actor, roundupId, 'verdict.set', {
        entryId,
        product: tested.name,
        label: input.label,
        bestFor: input.bestFor,
        price: input.price,
        reason: input.reason ?? null,
        contradictions,
        previous: existing
          ? { label: existing.label, price: { amountMinor: existing.priceMinor, currency: existing.priceCurrency } }
          : null,
      });
    });
    return this.list(roundupId);
  }
}
