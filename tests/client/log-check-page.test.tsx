import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { csvFile, firstOrderSoakCsv } from './support/log-check-server';
import { renderLogCheckPage } from './support/render-log-check';

afterEach(() => vi.unstubAllGlobals());

describe('the log check page', () => {
  it('after pressing Analyse, the result scrolls into view with focus on its heading', async () => {
    const scrolled: Element[] = [];
    // The DOM implementation has no layout; record the call at that boundary.
    vi.spyOn(Element.prototype, 'scrollIntoView').mockImplementation(function (this: Element) {
      scrolled.push(this);
    });
    const user = userEvent.setup();
    renderLogCheckPage();

    await user.upload(screen.getByLabelText('Logger file'), csvFile('soak.csv', firstOrderSoakCsv()));
    await screen.findByText('Guessed from the header names — check it');
    expect(screen.queryByRole('heading', { name: 'Result' })).toBeNull();

    await user.click(screen.getByRole('button', { name: 'Analyse' }));
    const heading = await screen.findByRole('heading', { name: 'Result' });
    await waitFor(() => expect(document.activeElement).toBe(heading));
    expect(scrolled).toContain(heading);
  });
});
