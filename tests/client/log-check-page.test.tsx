import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { LogCheckPage } from '../../src/features/log-check/components/log-check-page';
import { installFakeUploadServer } from './support/fake-upload-server';
import { answerLogCheck, csvFile, firstOrderSoakCsv } from './support/log-check-server';

afterEach(() => vi.unstubAllGlobals());

describe('the log check page', () => {
  it('after pressing Analyse, the result scrolls into view with focus on its heading', async () => {
    installFakeUploadServer(answerLogCheck);
    const scrolled: Element[] = [];
    // The DOM implementation has no layout; record the call at that boundary.
    vi.spyOn(Element.prototype, 'scrollIntoView').mockImplementation(function (this: Element) {
      scrolled.push(this);
    });
    const user = userEvent.setup();
    render(
      <QueryClientProvider client={new QueryClient()}>
        <MemoryRouter>
          <LogCheckPage signInPath="/sign-in" />
        </MemoryRouter>
      </QueryClientProvider>,
    );

    await user.upload(screen.getByLabelText('Logger file'), csvFile('soak.csv', firstOrderSoakCsv()));
    await screen.findByText('Guessed from the header names — check it');
    expect(screen.queryByRole('heading', { name: 'Result' })).toBeNull();

    await user.click(screen.getByRole('button', { name: 'Analyse' }));
    const heading = await screen.findByRole('heading', { name: 'Result' });
    await waitFor(() => expect(document.activeElement).toBe(heading));
    expect(scrolled).toContain(heading);
  });
});
