import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { textFileContent } from '../../shared/domain/text-file-content';
import { AppError } from '../errors';
import { formatCatalogCsv } from '../lib/catalog-csv';
import { catalogEditors, planEditors, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  createPriceRequestSchema,
  createProductRequestSchema,
  priceListQuerySchema,
  priceListSchema,
  priceSchema,
  productDetailSchema,
  productListQuerySchema,
  productListSchema,
  productPriceParamsSchema,
  updateProductRequestSchema,
} from '../../shared/schemas/catalog';
import { catalogImportUploadLimit } from '../../shared/upload-limits';
import {
  catalogExportQuerySchema,
  catalogImportCommitRequestSchema,
  catalogImportPreviewRequestSchema,
  catalogImportPreviewSchema,
  catalogImportResultSchema,
} from '../../shared/schemas/catalog-import';

/** The CSV text from a multipart file (field `file`) or the JSON body's `csv`. */
function csvFrom(file: Express.Multer.File | undefined, body: { csv?: string }): string {
  const text = file ? textFileContent(file.buffer) : body.csv;
  if (text === null) {
    throw new AppError(
      'unsupported_file',
      415,
      'This is not a text file: save the catalog as “CSV UTF-8” and import it.',
      {
        file: 'Not a text file.',
      },
    );
  }
  if (text === undefined || text.trim() === '') {
    throw new AppError('validation_failed', 400, 'Send the CSV as a file (field “file”) or as text (field “csv”).', {
      csv: 'Choose a CSV file.',
    });
  }
  return text;
}

export function registerCatalogRoutes(api: ApiRegistry, { services }: AppContext) {
  const catalog = services.catalog;
  const importer = services.catalogImport;

  api.add({
    method: 'get',
    path: '/api/catalog/products',
    access: planningReaders,
    tag: 'Catalog',
    summary: 'Catalog products with search, filters, sort and the latest price per region.',
    query: productListQuerySchema,
    response: productListSchema,
    handler: ({ query }) => catalog.list(query),
  });

  api.add({
    method: 'post',
    path: '/api/catalog/products',
    access: catalogEditors,
    tag: 'Catalog',
    summary: 'Add a product to the catalog.',
    body: createProductRequestSchema,
    response: productDetailSchema,
    handler: ({ user, body }) => catalog.create(user, body),
  });

  api.add({
    method: 'get',
    path: '/api/catalog/products/:id',
    access: planningReaders,
    tag: 'Catalog',
    summary: 'One product with its price history and the roundups it is in.',
    params: idParamSchema,
    response: productDetailSchema,
    handler: ({ params }) => catalog.get(params.id),
  });

  api.add({
    method: 'patch',
    path: '/api/catalog/products/:id',
    access: catalogEditors,
    tag: 'Catalog',
    summary: 'Edit a product, or archive / restore it with { archived }.',
    params: idParamSchema,
    body: updateProductRequestSchema,
    response: productDetailSchema,
    handler: ({ user, params, body }) => catalog.update(user, params.id, body),
  });

  api.add({
    method: 'delete',
    path: '/api/catalog/products/:id',
    access: planEditors,
    tag: 'Catalog',
    summary: 'Delete a product that no roundup uses (409 product_in_use otherwise: archive it instead).',
    params: idParamSchema,
    successStatus: 204,
    handler: ({ user, params }) => catalog.remove(user, params.id),
  });

  api.add({
    method: 'get',
    path: '/api/catalog/products/:id/prices',
    access: planningReaders,
    tag: 'Catalog',
    summary: 'Price history of a product, newest first; optionally one region.',
    params: idParamSchema,
    query: priceListQuerySchema,
    response: priceListSchema,
    handler: async ({ params, query }) => ({ prices: await catalog.listPrices(params.id, query.region) }),
  });

  api.add({
    method: 'post',
    path: '/api/catalog/products/:id/prices',
    access: catalogEditors,
    tag: 'Catalog',
    summary: 'Record a price seen in a region (added to the history).',
    params: idParamSchema,
    body: createPriceRequestSchema,
    response: priceSchema,
    handler: ({ user, params, body }) => catalog.addPrice(user, params.id, body),
  });

  api.add({
    method: 'delete',
    path: '/api/catalog/products/:id/prices/:priceId',
    access: planEditors,
    tag: 'Catalog',
    summary: 'Remove a mistaken price entry (kept in the audit log).',
    params: productPriceParamsSchema,
    successStatus: 204,
    handler: ({ user, params }) => catalog.removePrice(user, params.id, params.priceId),
  });

  api.add({
    method: 'post',
    path: '/api/catalog/import/preview',
    access: catalogEditors,
    tag: 'Catalog',
    summary: 'Check a catalog CSV row by row and show what an import would do. Saves nothing.',
    body: catalogImportPreviewRequestSchema,
    multipart: { fields: { file: 'file' }, limit: catalogImportUploadLimit, orJson: true },
    response: catalogImportPreviewSchema,
    successStatus: 200,
    handler: ({ req, body }) => importer.preview(csvFrom(req.file, body)),
  });

  api.add({
    method: 'post',
    path: '/api/catalog/import/commit',
    access: catalogEditors,
    tag: 'Catalog',
    summary: 'Import a previewed CSV (same text + the preview checksum): all rows in one transaction, or none (422).',
    body: catalogImportCommitRequestSchema,
    multipart: { fields: { file: 'file', checksum: 'string' }, limit: catalogImportUploadLimit, orJson: true },
    response: catalogImportResultSchema,
    successStatus: 200,
    handler: ({ req, user, body }) => importer.commit(user, csvFrom(req.file, body), body.checksum),
  });

  api.add({
    method: 'get',
    path: '/api/catalog/export.csv',
    access: planningReaders,
    tag: 'Catalog',
    summary:
      'The catalog as CSV in the import format; priceRegion fills the price columns with the latest price there.',
    query: catalogExportQuerySchema,
    produces: 'text/csv',
    handler: async ({ query, res }) => {
      const list = await catalog.list({
        archived: query.archived,
        platform: query.platform,
        sort: 'maker',
        direction: 'asc',
        limit: Number.MAX_SAFE_INTEGER,
        offset: 0,
      });
      const csv = formatCatalogCsv(list.products, (product) =>
        query.priceRegion ? (product.latestPrices.find((p) => p.region === query.priceRegion) ?? null) : null,
      );
      const date = new Date().toISOString().slice(0, 10);
      res.setHeader('Content-Type', 'text/csv; charset=utf-8');
      res.setHeader('Content-Disposition', `attachment; filename="benchwire-catalog-${date}.csv"`);
      res.status(200).send(`\uFEFF${csv}\r\n`);
    },
  });
}
