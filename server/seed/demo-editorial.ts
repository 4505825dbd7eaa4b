import type { DataSource } from 'typeorm';
import { RoundupEntity } from '../entities/roundup.entity';
import { UserEntity } from '../entities/user.entity';
import { ChartsService } from '../services/charts.service';
import { evidenceOf, VerdictsService } from '../services/verdicts.service';
import { loadEditorialFacts } from '../lib/editorial-facts';
import type { FileStore } from '../storage/file-store';
import { verdictContradictions } from '../../shared/domain/editorial/verdict-contradiction';
import type { EditorialLabel } from '../../shared/domain/editorial/editorial-labels';
import type { CurrentUser } from '../../shared/schemas/auth';

/** The flagship roundup's invented verdicts, in its product order. */
const demoVerdicts: { label: EditorialLabel; bestFor: string; reason: string }[] = [
  {
    label: 'bench-pick',
    bestFor: 'All-core overclocks that run for hours',
    reason: 'The coolest board at both loads; its one warm reading sits well inside the rubric.',
  },
  {
    label: 'recommended',
    bestFor: 'Stock builds that want room to grow',
    reason: 'Warm at the fixed clock, but it held without a throttle and costs less than the pick.',
  },
  {
    label: 'fine-at-stock',
    bestFor: 'Quiet stock builds in a well-aired case',
    reason: 'At stock it stays comfortable; the fixed clock asks more than its heatsinks give.',
  },
];

/**
 * Verdicts and approved charts for the demo's flagship roundup (the one in Writing with every cell accepted), through
 * the same services the app uses, so its charts have stored PNGs. A reason is written only where the label goes
 * against the measurements.
 */
export async function seedDemoEditorial(dataSource: DataSource, files: FileStore): Promise<number> {
  const editorRow = await dataSource.getRepository(UserEntity).findOneBy({ role: 'editor' });
  const flagship = await dataSource.getRepository(RoundupEntity).findOneBy({ title: 'Helix-1700 flagship boards' });
  if (!editorRow || !flagship) return 0;
  const editor: CurrentUser = {
    id: editorRow.id,
    email: editorRow.email,
    displayName: editorRow.displayName,
    role: editorRow.role,
  };
  const verdicts = new VerdictsService(dataSource);
  const charts = new ChartsService(dataSource, files);
  const facts = await loadEditorialFacts(dataSource.manager, flagship.id);
  for (const [index, { entry }] of facts.tested.entries()) {
    const demo = demoVerdicts[index % demoVerdicts.length];
    const price = facts.catalogPrices.get(entry.id) ?? {
      amountMinor: flagship.priceMaxMinor,
      currency: flagship.currency,
    };
    const contradicted = verdictContradictions(demo.label, evidenceOf(facts, entry.id)).length > 0;
    await verdicts.set(editor, flagship.id, entry.id, {
      label: demo.label,
      bestFor: demo.bestFor,
      price,
      reason: contradicted ? demo.reason : null,
    });
  }
  let approved = 0;
  for (const chart of (await charts.list(flagship.id)).charts) {
    if (chart.status === 'empty') continue;
    await charts.approve(editor, flagship.id, chart.key, chart.snapshotHash);
    approved++;
  }
  return approved;
}
