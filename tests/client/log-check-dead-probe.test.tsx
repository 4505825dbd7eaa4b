import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { syntheticLoggerLog } from '../../shared/generators/synthetic-logger-log';
import { deadThirdProbeSpec } from '../support/soak-logs';
import { csvFile } from './support/log-check-server';
import { renderLogCheckPage } from './support/render-log-check';

afterEach(() => vi.unstubAllGlobals());

function renderPage() {
  vi.spyOn(Element.prototype, 'scrollIntoView').mockImplementation(() => undefined);
  return renderLogCheckPage();
}

const deadThirdProbe = syntheticLoggerLog(deadThirdProbeSpec());

describe('a dead probe on the log check page', () => {
  it(
    'withholds the verdict until the tester confirms the probe dead, then judges without it and keeps the choice in the options',
    { timeout: 60_000 },
    async () => {
      const server = renderPage();
      const user = userEvent.setup();
      await user.upload(screen.getByLabelText('Logger file'), csvFile('dead-probe.csv', deadThirdProbe));
      await screen.findByText('Guessed from the header names — check it');

      await user.click(screen.getByRole('button', { name: 'Analyse' }));
      await screen.findByRole('heading', { name: 'Result' });
      expect(screen.getByText('Verdict withheld')).toBeTruthy();
      const confirm = screen.getByRole('button', { name: 'VRM 3 [°C] is dead: judge without it' });

      await user.click(confirm);
      await waitFor(() => expect(screen.queryByText('Verdict withheld')).toBeNull());
      // The second analysis was asked for with the probe confirmed dead, and the form shows the choice so it can be undone.
      const sent = JSON.parse(server.sent[server.sent.length - 1].fields.request);
      expect(sent.options.confirmedDeadProbes).toEqual(['VRM 3 [°C]']);
      expect(screen.getByText('Verdict')).toBeTruthy();
      expect(screen.queryByRole('button', { name: /is dead: judge without it/ })).toBeNull();
      const option = screen.getByLabelText('VRM 3 [°C] is a dead probe: judge the run without it');
      expect((option as HTMLInputElement).checked).toBe(true);
    },
  );
});

describe('the read panel before any analysis', () => {
  it('says when whole-second stamps repeat and will be spread', { timeout: 30_000 }, async () => {
    renderPage();
    const lines = ['Time,VRM 1 [°C]'];
    // 2 Hz with whole-second clock stamps, as some loggers write: two rows per stamp.
    for (let i = 0; i < 600; i++) {
      const second = Math.floor(i / 2);
      lines.push(
        `12:${String(Math.floor(second / 60)).padStart(2, '0')}:${String(second % 60).padStart(2, '0')},${40 + i / 100}`,
      );
    }
    const user = userEvent.setup();
    await user.upload(screen.getByLabelText('Logger file'), csvFile('two-hertz.csv', `${lines.join('\n')}\n`));
    const panel = (await screen.findByRole('heading', { name: 'How Benchwire read the file' })).closest('section')!;
    expect(within(panel).getByText(/The time stamps repeat: about 2 rows share each stamp/)).toBeTruthy();
  });
});
