import { render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { describe, expect, it } from 'vitest';
import { ColumnMappingForm } from '../../src/features/log-check/components/column-mapping-form';
import { draftFromPreview } from '../../src/features/log-check/components/mapping-draft';
import { previewLog } from '../../shared/domain/analysis/analyse-log';
import type { AnalysisRequestInput, LogPreview } from '../../shared/schemas/analysis';
import { firstOrderSoakCsv } from './support/log-check-server';

function previewOf(csv: string): LogPreview {
  const outcome = previewLog(csv);
  if (!outcome.ok) throw new Error('The test log should read.');
  return outcome.preview;
}

/** The page holds the draft; this stands in for it. */
function MappingFormOn({ preview, sent }: { preview: LogPreview; sent: AnalysisRequestInput[] }) {
  const [draft, setDraft] = useState(() => draftFromPreview(preview, null));
  return (
    <ColumnMappingForm
      preview={preview}
      draft={draft}
      guess={draftFromPreview(preview, null)}
      onChange={setDraft}
      onAnalyse={(request) => sent.push(request)}
      pending={false}
    />
  );
}

describe('the column mapping form', () => {
  it('when several fields are wrong, then all are listed in one pass and nothing is sent; fixed, it sends what was typed', async () => {
    const sent: AnalysisRequestInput[] = [];
    const user = userEvent.setup();
    render(<MappingFormOn preview={previewOf(firstOrderSoakCsv())} sent={sent} />);

    await user.clear(screen.getByLabelText(/^Required soak/));
    await user.clear(screen.getByLabelText(/^Room target/));
    await user.type(screen.getByLabelText(/^Room target/), 'warm');
    await user.click(screen.getByRole('button', { name: 'Analyse' }));

    const summary = screen.getByRole('alert');
    expect(within(summary).getByText(/Required soak/)).toBeTruthy();
    expect(within(summary).getByText(/Room target/)).toBeTruthy();
    expect(sent).toHaveLength(0);
    // What was typed stays.
    expect(screen.getByLabelText<HTMLInputElement>(/^Room target/).value).toBe('warm');

    await user.type(screen.getByLabelText(/^Required soak/), '30');
    await user.clear(screen.getByLabelText(/^Room target/));
    await user.type(screen.getByLabelText(/^Room target/), '21,5');
    await user.click(screen.getByRole('button', { name: 'Analyse' }));

    expect(sent).toHaveLength(1);
    expect(sent[0].mapping).toMatchObject({ time: 'Time [s]', vrm: ['VRM 1 [°C]'], clock: 'CPU clock [MHz]' });
    // A decimal comma is read as a decimal point; the throttle share is typed in percent and sent as a fraction.
    expect(sent[0].options).toMatchObject({ soakMinutes: 30, ambientTargetC: 21.5, throttleFraction: 0.85 });
  });

  it('when a clock column is mapped, then the manual throttle minute is off and sent as unset; without one it is sent', async () => {
    const sent: AnalysisRequestInput[] = [];
    const user = userEvent.setup();
    render(<MappingFormOn preview={previewOf(firstOrderSoakCsv())} sent={sent} />);

    const manual = screen.getByLabelText<HTMLInputElement>(/^Throttled at minute/);
    expect(manual.disabled).toBe(true);
    await user.click(screen.getByRole('button', { name: 'Analyse' }));
    expect(sent[0].options?.manualThrottleMinute).toBeNull();

    await user.selectOptions(screen.getByLabelText(/^Clock column/), '');
    expect(manual.disabled).toBe(false);
    await user.type(manual, '12');
    await user.click(screen.getByRole('button', { name: 'Analyse' }));
    expect(sent[1].options?.manualThrottleMinute).toBe(12);
    expect(sent[1].mapping?.clock).toBeNull();
  });
});
