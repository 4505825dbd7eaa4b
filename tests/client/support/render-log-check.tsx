import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { LogCheckPage } from '../../../src/features/log-check/components/log-check-page';
import { installFakeUploadServer } from './fake-upload-server';
import { answerLogCheck } from './log-check-server';

/**
 * The log check page as the app mounts it (query client, router), its uploads answered by the real analysis.
 * Returns the fake upload server, which keeps what was sent.
 */
export function renderLogCheckPage() {
  const server = installFakeUploadServer(answerLogCheck);
  render(
    <QueryClientProvider client={new QueryClient()}>
      <MemoryRouter>
        <LogCheckPage signInPath="/sign-in" />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return server;
}
