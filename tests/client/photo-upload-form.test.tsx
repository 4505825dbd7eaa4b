import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { PhotoUploadForm } from '../../src/features/photos/components/photo-upload-form';
import type { Photo } from '../../shared/schemas/photos';
import { photoUploadLimit } from '../../shared/upload-limits';
import { installFakeUploadServer, type UploadHandler } from './support/fake-upload-server';

afterEach(() => vi.unstubAllGlobals());

function renderForm(handler: UploadHandler) {
  const server = installFakeUploadServer(handler);
  const queryClient = new QueryClient({ defaultOptions: { mutations: { retry: false } } });
  render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter>
        <PhotoUploadForm roundupId={3} entryId={5} signInPath="/sign-in" />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return { server, user: userEvent.setup({ applyAccept: false }) };
}

const photoFile = (name: string, bytes = 2048) => new File([new Uint8Array(bytes)], name, { type: 'image/jpeg' });

const savedPhoto: Photo = {
  id: 11,
  roundupId: 3,
  entryId: 5,
  kind: 'overview',
  caption: 'The whole board',
  altText: 'A board seen from above',
  position: 1,
  width: 1600,
  height: 1200,
  sizes: [{ width: 480, height: 360, format: 'jpeg', url: '/api/photos/11/files/480.jpeg' }],
  uploadedBy: { id: 2, displayName: 'Tester' },
  createdAt: '2026-12-03T09:00:00.000Z',
};

async function fillFields(user: ReturnType<typeof userEvent.setup>) {
  await user.selectOptions(screen.getByLabelText('What it shows'), 'overview');
  await user.type(screen.getByLabelText(/^Caption/), 'The whole board');
  await user.type(screen.getByLabelText('Alt text'), 'A board seen from above');
}

describe('adding a photo', () => {
  it('when the file is not a photo type or too large, then it is said beside the input, nothing is sent and nothing typed is lost', async () => {
    const { server, user } = renderForm(async () => ({ status: 201, body: savedPhoto }));
    await fillFields(user);
    await user.upload(screen.getByLabelText('Photo file'), photoFile('board.gif'));
    expect(screen.getByText(/“board.gif” is not a photo Benchwire takes/)).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Add the photo' }));
    // A file one byte over the limit (shared/upload-limits) is refused before a byte goes out.
    await user.upload(screen.getByLabelText('Photo file'), photoFile('huge.jpg', photoUploadLimit.maxFileBytes + 1));
    await user.click(screen.getByRole('button', { name: 'Add the photo' }));
    expect(screen.getByText(/“huge.jpg” is .*; the limit is/)).toBeTruthy();
    expect(server.sent).toHaveLength(0);
    expect(screen.getByLabelText<HTMLInputElement>(/^Caption/).value).toBe('The whole board');
    expect(screen.getByLabelText<HTMLInputElement>('Alt text').value).toBe('A board seen from above');
  });

  it('when alt text is missing, then the field says so and nothing is sent', async () => {
    const { server, user } = renderForm(async () => ({ status: 201, body: savedPhoto }));
    await user.upload(screen.getByLabelText('Photo file'), photoFile('board.jpg'));
    await user.click(screen.getByRole('button', { name: 'Add the photo' }));
    expect(screen.getByLabelText('Alt text').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByLabelText('What it shows').getAttribute('aria-invalid')).toBe('true');
    expect(server.sent).toHaveLength(0);
  });

  it('when the server refuses the content, then its message stands beside the file input and the fields stay', async () => {
    const { user } = renderForm(async () => ({
      status: 415,
      body: { error: { code: 'unsupported_image', message: 'This file is not a JPEG, PNG or WebP image.' } },
    }));
    await fillFields(user);
    await user.upload(screen.getByLabelText('Photo file'), photoFile('renamed.jpg'));
    await user.click(screen.getByRole('button', { name: 'Add the photo' }));
    await waitFor(() => expect(screen.getByText('This file is not a JPEG, PNG or WebP image.')).toBeTruthy());
    expect(screen.getByLabelText('Photo file').getAttribute('aria-invalid')).toBe('true');
    expect(screen.getByLabelText<HTMLInputElement>('Alt text').value).toBe('A board seen from above');
  });

  it('shows progress while the photo goes out; a cancel keeps everything; a saved photo empties the form', async () => {
    const { server, user } = renderForm(async () => 'hold');
    await fillFields(user);
    await user.upload(screen.getByLabelText('Photo file'), photoFile('board.jpg', 4096));
    await user.click(screen.getByRole('button', { name: 'Add the photo' }));
    await waitFor(() => expect(server.sent).toHaveLength(1));
    expect(server.sent[0].url).toBe('/api/roundups/3/entries/5/photos');
    expect(server.sent[0].fields).toEqual({
      kind: 'overview',
      caption: 'The whole board',
      altText: 'A board seen from above',
    });
    server.sent[0].progress(2048);
    await waitFor(() =>
      expect(screen.getByRole('progressbar', { name: 'Uploading the photo' }).getAttribute('aria-valuenow')).toBe('50'),
    );
    await user.click(screen.getByRole('button', { name: 'Cancel upload' }));
    await waitFor(() => expect(screen.getByText(/Upload cancelled/)).toBeTruthy());
    expect(server.sent[0].aborted).toBe(true);
    expect(screen.getByLabelText<HTMLInputElement>('Alt text').value).toBe('A board seen from above');

    await user.click(screen.getByRole('button', { name: 'Add the photo' }));
    await waitFor(() => expect(server.sent).toHaveLength(2));
    server.sent[1].respond(201, savedPhoto);
    await waitFor(() => expect(screen.getByText('Photo added as number 1.')).toBeTruthy());
    expect(screen.getByLabelText<HTMLInputElement>('Alt text').value).toBe('');
  });
});
