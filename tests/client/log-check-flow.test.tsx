import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { requestFromDraft } from '../../src/features/log-check/components/mapping-draft';
import { useLogCheck } from '../../src/features/log-check/components/use-log-check';
import { logFileUploadLimit } from '../../shared/upload-limits';
import { installFakeUploadServer, type UploadHandler } from './support/fake-upload-server';
import { answerLogCheck, csvFile, firstOrderSoakCsv, soakWithBadCellCsv } from './support/log-check-server';

function renderLogCheck(handler: UploadHandler) {
  const server = installFakeUploadServer(handler);
  const queryClient = new QueryClient({ defaultOptions: { mutations: { retry: false } } });
  const wrapper = ({ children }: { children: ReactNode }) => (
    <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
  );
  const hook = renderHook(() => useLogCheck(), { wrapper });
  return { ...hook, server };
}

/** The request the mapping form would send for the draft as it stands. */
function confirmedRequest(check: ReturnType<typeof useLogCheck>) {
  if (!check.draft || !check.reading) throw new Error('No mapping to confirm yet.');
  const built = requestFromDraft(check.draft, check.reading.preview);
  if (!built.request) throw new Error(`The draft has errors: ${JSON.stringify(built.errors)}`);
  return built.request;
}

afterEach(() => vi.unstubAllGlobals());

describe('the log check flow', () => {
  it('when a tester chooses a soak, then it is read with a guessed mapping, analysed on confirmation, and the result goes stale when the form changes', async () => {
    const { result, server } = renderLogCheck(answerLogCheck);

    act(() => result.current.choose(csvFile('soak.csv', firstOrderSoakCsv())));
    expect(result.current.sending?.stage).toBe('reading');
    await waitFor(() => expect(result.current.reading).not.toBeNull());
    expect(result.current.sending).toBeNull();
    // The first look sends no settings: the server answers with its guess, which is never shown as a result.
    expect(server.sent[0].fields).toEqual({});
    expect(result.current.result).toBeNull();
    expect(result.current.draft?.time).toBe('Time [s]');
    expect(result.current.draft?.vrm).toEqual(['VRM 1 [°C]']);
    expect(result.current.reading?.guess).not.toBeNull();

    const request = confirmedRequest(result.current);
    act(() => result.current.analyse(request));
    expect(result.current.sending?.stage).toBe('analysing');
    await waitFor(() => expect(result.current.result).not.toBeNull());
    expect(JSON.parse(server.sent[1].fields.request)).toEqual(request);
    // First-order rise to 21.0 + 50 °C (see firstOrderSoakCsv): the peak is 71.0 °C, below the default 80 °C limit.
    expect(result.current.result?.outcome.analysis.peakC).toBeCloseTo(71.0, 1);
    expect(result.current.result?.outcome.analysis.verdict.code).toBe('comfortable');
    expect(result.current.resultOutdated).toBe(false);

    act(() => result.current.setDraft({ ...result.current.draft!, ambientTargetC: '23' }));
    expect(result.current.resultOutdated).toBe(true);
  });

  it('when a file has a typed-over cell, then the problem is listed by line and column and the tester’s options stay', async () => {
    const { result } = renderLogCheck(answerLogCheck);
    act(() => result.current.choose(csvFile('soak.csv', firstOrderSoakCsv())));
    await waitFor(() => expect(result.current.draft).not.toBeNull());
    act(() => result.current.setDraft({ ...result.current.draft!, ambientTargetC: '21.5' }));

    act(() => result.current.choose(csvFile('soak-typed-over.csv', soakWithBadCellCsv())));
    await waitFor(() => expect(result.current.failure).not.toBeNull());
    const failure = result.current.failure!;
    expect(failure.stage).toBe('reading');
    expect(failure.hasPreview).toBe(true);
    expect(failure.errors[0]).toMatchObject({ row: 32, column: 'VRM 1 [°C]' });
    expect(result.current.file?.name).toBe('soak-typed-over.csv');
    // Same header as the last file: the mapping and options the tester set are kept.
    expect(result.current.draft?.ambientTargetC).toBe('21.5');
    expect(result.current.result).toBeNull();
  });

  it('when a file is not a logger export or is over the limit, then it is refused before anything is sent', () => {
    const { result, server } = renderLogCheck(answerLogCheck);
    act(() => result.current.choose(csvFile('notes.pdf', 'x')));
    expect(result.current.fileError).toContain('is not a logger export');

    const huge = csvFile('huge.csv', 'x');
    Object.defineProperty(huge, 'size', { value: 30 * 1024 * 1024 });
    act(() => result.current.choose(huge));
    // 25 MiB: logFileUploadLimit in shared/upload-limits.ts.
    expect(result.current.fileError).toBe(
      `“huge.csv” is 30\u2009MB; the limit is 25\u2009MB. ${logFileUploadLimit.whenTooLarge}`,
    );
    expect(server.sent).toHaveLength(0);
    expect(result.current.file).toBeNull();
  });

  it('when the tester cancels an upload, then nothing is shown as failed and the same file can be sent again', async () => {
    let hold = true;
    const { result, server } = renderLogCheck(async (request) => (hold ? 'hold' : answerLogCheck(request)));
    act(() => result.current.choose(csvFile('soak.csv', firstOrderSoakCsv())));
    await waitFor(() => expect(server.sent).toHaveLength(1));
    act(() => server.sent[0].progress(1000));
    expect(result.current.sending?.progress).toMatchObject({ phase: 'uploading', loadedBytes: 1000 });

    act(() => result.current.cancel());
    expect(server.sent[0].aborted).toBe(true);
    expect(result.current.cancelled).toBe(true);
    expect(result.current.sending).toBeNull();
    expect(result.current.requestError).toBeNull();

    hold = false;
    act(() => result.current.retry());
    await waitFor(() => expect(result.current.reading).not.toBeNull());
    expect(result.current.cancelled).toBe(false);
    expect(server.sent).toHaveLength(2);
  });

  it('when the session has ended, then the tester is told so and offered sign-in, with the file still chosen', async () => {
    const { result } = renderLogCheck(async () => ({
      status: 401,
      body: { error: { code: 'unauthenticated', message: 'Sign in first.' } },
    }));
    act(() => result.current.choose(csvFile('soak.csv', firstOrderSoakCsv())));
    await waitFor(() => expect(result.current.requestError).not.toBeNull());
    expect(result.current.requestError).toEqual({
      message: 'Your session ended, so the file was not read.',
      signedOut: true,
    });
    expect(result.current.file?.name).toBe('soak.csv');
  });

  it('when the server refuses the file itself, then its message is shown beside the file input', async () => {
    const { result } = renderLogCheck(async () => ({
      status: 415,
      body: {
        error: {
          code: 'unsupported_file',
          message: 'This is not a text export: save the log as CSV or TSV.',
          fields: { file: 'Not a text file.' },
        },
      },
    }));
    act(() => result.current.choose(csvFile('soak.csv', firstOrderSoakCsv())));
    await waitFor(() => expect(result.current.fileError).not.toBeNull());
    expect(result.current.fileError).toBe('This is not a text export: save the log as CSV or TSV.');
    expect(result.current.requestError).toBeNull();
  });
});
