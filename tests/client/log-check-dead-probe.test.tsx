import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { LogCheckPage } from '../../src/features/log-check/components/log-check-page';
import { syntheticLoggerLog } from '../../shared/generators/synthetic-logger-log';
import { installFakeUploadServer } from './support/fake-upload-server';
import { answerLogCheck, csvFile } from './support/log-check-server';

afterEach(() => vi.unstubAllGlobals());

function renderPage() {
  const server = installFakeUploadServer(answerLogCheck);
  vi.spyOn(Element.prototype, 'scrollIntoView').mockImplementation(() => undefined);
  render(
    <QueryClientProvider client={new QueryClient()}>
      <MemoryRouter>
        <LogCheckPage signInPath="/sign-in" />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return server;
}

/** An hour at 1 Hz with three VRM probes; VRM 3 reads OPEN from the first sample to the last (a dead probe). */
const deadThirdProbe = syntheticLoggerLog({
  durationS: 3600,
  sampleHz: 1,
  seed: 9,
  probes: [
    { name: 'VRM 1', startC: 30, riseC: 45, tauS: 420 },
    { name: 'VRM 2', startC: 30, riseC: 40, tauS: 400 },
    { name: 'VRM 3', startC: 30, riseC: 40, tauS: 400, dropouts: [{ fromS: 0, toS: 3600, marker: 'OPEN' }] },
  ],
  ambient: { name: 'Ambient', startC: 21 },
  clock: { name: 'CPU clock [MHz]', mhz: 4600 },
});

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
