import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { CreateRoundupForm } from '../../src/features/roundups/components/create-roundup-form';
import { benchProfilesQueryOptions } from '../../src/features/roundups/api/bench-profiles';
import { loadConfigurationsQueryOptions } from '../../src/features/roundups/api/load-configurations';
import { catalogProductsQueryOptions } from '../../src/features/roundups/api/get-catalog-products';

/** A query client already holding what the form reads, so it renders without a server. */
function seededClient() {
  const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false } } });
  queryClient.setQueryData(benchProfilesQueryOptions().queryKey, []);
  queryClient.setQueryData(loadConfigurationsQueryOptions().queryKey, []);
  queryClient.setQueryData(catalogProductsQueryOptions({ limit: 1 }).queryKey, {
    products: [],
    total: 0,
    facets: { makers: [], platforms: [], sockets: [], chipsets: [], regions: [] },
  });
  return queryClient;
}

/** The form on its own, with what it reads already in the cache; the user who fills it in. */
function renderForm() {
  const user = userEvent.setup();
  render(
    <QueryClientProvider client={seededClient()}>
      <CreateRoundupForm onCreated={() => {}} onCancel={() => {}} />
    </QueryClientProvider>,
  );
  return user;
}

describe('New roundup form', () => {
  it('when an empty form is submitted, then every missing field is flagged in the same submit', async () => {
    const user = renderForm();
    await user.click(screen.getByRole('button', { name: 'Create roundup' }));

    const summary = await screen.findByRole('alert');
    for (const label of ['Title', 'Platform', 'Lowest price', 'Highest price', 'Region']) {
      expect(summary.textContent).toContain(`${label}:`);
    }
    expect(screen.getByLabelText(/^Title/).getAttribute('aria-invalid')).toBe('true');
  });

  it('when the target publish date has already passed, then the form says so beside the other problems', async () => {
    const user = renderForm();
    await user.type(screen.getByLabelText(/^Target publish date/), '2001-01-01');
    await user.click(screen.getByRole('button', { name: 'Create roundup' }));

    const summary = await screen.findByRole('alert');
    expect(summary.textContent).toContain('Target publish date: The target publish date has passed');
    expect(summary.textContent).toContain('Title:');
  });
});
