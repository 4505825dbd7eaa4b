import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { CatalogImport } from '../../src/features/catalog/components/catalog-import';
import type { CatalogImportPreview, ImportRowPreview } from '../../shared/schemas/catalog-import';
import { catalogImportUploadLimit } from '../../shared/upload-limits';
import { installFakeUploadServer, type SentUpload } from './support/fake-upload-server';

const header = 'maker,model,platform,socket,chipset,form_factor';
const rowCalm = 'Tidewell,TW Calm,Helix-1700,HX4,HX-B50,atx';
const rowLoud = (formFactor: string) => `Tidewell,TW Loud,Helix-1700,HX4,HX-B50,${formFactor}`;
const checksum = 'a'.repeat(64);

function row(rowNumber: number, model: string, errors: ImportRowPreview['errors'] = []): ImportRowPreview {
  return {
    rowNumber,
    maker: 'Tidewell',
    model,
    action: 'create',
    productId: null,
    changedFields: [],
    price: null,
    errors,
  };
}

/**
 * Stands in for the catalog import routes: a preview lists a row whose form factor is unknown, the way the server
 * does (row 1 is the header); commit accepts only the checksum of the text it previewed.
 */
async function answerImport(request: SentUpload) {
  const text = (await request.file?.text()) ?? '';
  if (request.url.endsWith('/preview')) {
    const bad = text.includes('wide-atx');
    const errors = bad ? [{ rowNumber: 3, column: 'form_factor', message: 'Unknown form factor “wide-atx”.' }] : [];
    const preview: CatalogImportPreview = {
      checksum,
      rowCount: 2,
      validRowCount: bad ? 1 : 2,
      errors,
      ignoredColumns: [],
      rows: [row(2, 'TW Calm'), row(3, 'TW Loud', errors)],
      canCommit: !bad,
    };
    return { status: 200, body: preview };
  }
  if (request.fields.checksum !== checksum || text.includes('wide-atx')) {
    return { status: 409, body: { error: { code: 'import_changed', message: 'Check the file again.' } } };
  }
  return { status: 200, body: { created: 2, updated: 0, unchanged: 0, pricesAdded: 0, productIds: [1, 2] } };
}

function renderImport() {
  render(
    <QueryClientProvider client={new QueryClient()}>
      <MemoryRouter>
        <CatalogImport />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

afterEach(() => vi.unstubAllGlobals());

describe('the catalog import flow', () => {
  it('when a file has a row error, then nothing can be confirmed; fixed as text and checked again, it imports', async () => {
    const server = installFakeUploadServer(answerImport);
    const user = userEvent.setup();
    renderImport();
    const csv = [header, rowCalm, rowLoud('wide-atx')].join('\n');

    await user.upload(screen.getByLabelText('CSV file'), new File([csv], 'boards.csv', { type: 'text/csv' }));
    await user.click(screen.getByRole('button', { name: 'Check the file' }));
    const saved = await screen.findByText('Nothing has been saved');
    expect(saved.closest('[role="alert"]')?.textContent).toContain('1 problem in 1 row');
    const problem = within(screen.getByRole('region', { name: 'Problems found in the file' })).getAllByRole('row')[1];
    expect(
      within(problem)
        .getAllByRole('cell')
        .map((cell) => cell.textContent),
    ).toEqual(['3', 'form_factor', 'Unknown form factor “wide-atx”.']);
    expect(screen.queryByRole('button', { name: /Confirm import/ })).toBeNull();
    await waitFor(() => expect(document.activeElement).toBe(screen.getByRole('heading', { name: /2 · Check/ })));

    // Fix the row in the text box: the old check is set aside at once.
    await user.click(screen.getByRole('button', { name: 'Edit it as text here' }));
    const text = await screen.findByLabelText('CSV text');
    expect(screen.queryByText('Nothing has been saved')).toBeNull();
    await user.clear(text);
    await user.click(text);
    await user.paste(csv.replace('wide-atx', 'micro-atx'));
    await user.click(screen.getByRole('button', { name: 'Check the file' }));
    await user.click(await screen.findByRole('button', { name: 'Confirm import of 2 rows' }));

    const imported = await screen.findByText('Imported');
    expect(imported.closest('[role="status"]')?.textContent).toContain('2 products added');
    // The commit sent the very text that was checked, with the checksum of that check.
    const [, preview, commit] = server.sent;
    expect(await preview.file?.text()).toBe(await commit.file?.text());
    expect(commit.fields.checksum).toBe(checksum);
    expect(commit.url).toBe('/api/catalog/import/commit');
  });

  it('when the file is over the limit, then it is refused beside the input and nothing is sent', async () => {
    const server = installFakeUploadServer(answerImport);
    const user = userEvent.setup();
    renderImport();
    const big = new File(['x'], 'big.csv', { type: 'text/csv' });
    Object.defineProperty(big, 'size', { value: 2_000_000 });
    await user.upload(screen.getByLabelText('CSV file'), big);
    await user.click(screen.getByRole('button', { name: 'Check the file' }));
    // 2,000,000 B = 1.9 MiB; 900,000 B (catalogImportUploadLimit) = 879 KiB. The matcher folds thin spaces to spaces.
    expect(
      await screen.findByText(`“big.csv” is 1.9 MB; the limit is 879 KB. ${catalogImportUploadLimit.whenTooLarge}`),
    ).toBeTruthy();
    expect(server.sent).toHaveLength(0);
  });
});
