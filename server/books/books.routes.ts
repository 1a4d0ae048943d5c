import { Router, type NextFunction, type Request, type Response } from 'express';
import multer from 'multer';
import { z } from 'zod';
import * as books from '../../src/shared/contract/books';
import { id } from '../../src/shared/schemas/fields';
import { zodFieldErrors } from '../../src/shared/schemas/field-errors';
import type { AppDeps } from '../platform/deps';
import { badRequest, invalidInput, tooLarge } from '../platform/errors';
import { endpointsOf } from '../platform/http/mount';
import { sendCsv } from '../platform/csv';
import { closeMonth, reopenMonth } from './close.service';
import { cogsReport } from './cogs.service';
import * as counts from './counts.service';
import { COGS_COLUMNS, cogsCsv, cogsTrend, PURCHASES_COLUMNS, purchasesCsv, STOCK_COLUMNS, stockValuationCsv, supplierChart } from './exports.service';
import { listPeriods } from './periods.service';
import * as sales from './sales.service';
import * as waste from './waste.service';

/** The multipart fields of an upload besides the file. */
const uploadFields = z.object({ siteId: id('site') });

/** The books domain: counts, waste, till sales, month end and the bookkeeper's reports. */
export function booksRouters(deps: AppDeps): Router[] {
  const r = Router();
  const on = endpointsOf(r, deps);

  on(books.cogsReport, ({ user, query }) => cogsReport(deps.db, user.businessId, query.month, query.siteId ?? null));
  on(books.cogsCsv, async ({ user, query, res }) => {
    const { filename, records } = await cogsCsv(deps.db, user.businessId, query.month, query.siteId ?? null);
    await sendCsv(res, filename, COGS_COLUMNS, records);
  });
  on(books.purchasesCsv, async ({ user, query, res }) => {
    const { filename, records } = await purchasesCsv(deps.db, user.businessId, query.month, query.siteId ?? null);
    await sendCsv(res, filename, PURCHASES_COLUMNS, records);
  });
  on(books.stockValuationCsv, async ({ user, query, res }) => {
    const { filename, records } = await stockValuationCsv(deps.db, user.businessId, query.countId);
    await sendCsv(res, filename, STOCK_COLUMNS, records);
  });
  on(books.purchasesBySupplier, ({ user, query }) => supplierChart(deps.db, user.businessId, query.month, query.siteId ?? null));
  on(books.cogsTrend, ({ user, query }) => cogsTrend(deps.db, user.businessId, query.month, query.siteId ?? null, query.months));

  on(books.listPeriods, async ({ user }) => ({ periods: await listPeriods(deps.db, user.businessId) }));
  on(books.closePeriod, async ({ user, params, body }) => ({ period: await closeMonth(deps, user.businessId, user.id, params.month, body.reason ?? null) }));
  on(books.reopenPeriod, async ({ user, params, body }) => ({ period: await reopenMonth(deps, user.businessId, user.id, params.month, body.reason ?? null) }));

  on(books.listCounts, ({ user, query }) => counts.listCounts(deps, user, query.siteId));
  on(books.startCount, async ({ user, body }) => ({ count: await counts.startCount(deps, user, body) }));
  on(books.getCountSheet, ({ user, params }) => counts.getCountSheet(deps, user, params.id));
  on(books.saveCountLine, async ({ user, params, body }) => ({ line: await counts.saveCountLine(deps, user, params.id, params.packId, body) }));
  on(books.finishCount, async ({ user, params }) => ({ count: await counts.finishCount(deps, user, params.id) }));
  on(books.deleteCount, ({ user, params }) => counts.deleteCount(deps, user.businessId, params.id));

  on(books.listWaste, ({ user, query }) => waste.listWaste(deps, user, query));
  on(books.wasteChoices, async ({ user }) => ({ choices: await waste.wasteChoices(deps, user.businessId) }));
  on(books.recordWaste, async ({ user, body }) => ({ entry: await waste.recordWaste(deps, user.businessId, user.id, body) }));
  on(books.deleteWaste, ({ user, params }) => waste.deleteWaste(deps, user.businessId, params.id));

  on(books.listImports, async ({ user, query }) => ({ imports: await sales.listImports(deps, user.businessId, query.siteId) }));
  on(
    books.uploadImport,
    async ({ user, req }) => {
      const fields = uploadFields.safeParse(req.body ?? {});
      if (!fields.success) throw invalidInput(zodFieldErrors(fields.error));
      if (!req.file) throw invalidInput({ file: 'Choose the CSV file exported from the till.' });
      return sales.uploadImport(deps, user.businessId, user.id, fields.data.siteId, req.file);
    },
    { before: [receiveFile(deps)] },
  );
  on(books.previewImport, async ({ user, params, body, res }) => {
    // The answer is written as JSON in the worker thread that read the file (and checked there
    // against the contract when responses are checked), so it is sent as it comes.
    const json = await sales.previewImport(deps, user.businessId, params.id, body.columns);
    res.status(200).type('application/json').send(json);
    return answeredAbove<books.ImportPreview>();
  });
  on(books.acceptImport, async ({ user, params, body }) => ({ import: await sales.acceptImport(deps, user.businessId, params.id, body) }));
  on(books.discardImport, ({ user, params }) => sales.discardImport(deps, user.businessId, params.id));
  on(books.salesDays, ({ user, query }) => sales.salesDays(deps, user.businessId, query));
  on(books.salesDay, ({ user, params, query }) => sales.manualDay(deps, user.businessId, query.siteId, params.soldOn));
  on(books.saveSalesDay, ({ user, body }) => sales.saveManualDay(deps, user.businessId, body));
  return [r];
}

/** For a handler that wrote the response itself (the mount then sends nothing more). */
const answeredAbove = <T>(): T => undefined as T;

/**
 * The till file, in memory (it is kept in the database until accepted), one file and a few
 * fields at most; names are read as UTF-8. multer's own errors become the API's: 413 for a
 * file over the limit, 400 otherwise.
 */
function receiveFile({ config }: AppDeps) {
  const upload = multer({ storage: multer.memoryStorage(), defParamCharset: 'utf8', limits: { fileSize: config.UPLOAD_MAX_BYTES, files: 1, fields: 5, fieldSize: 1024 } }).single('file');
  return (req: Request, res: Response, next: NextFunction) =>
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') return next(tooLarge(`The file is larger than ${Math.floor(config.UPLOAD_MAX_BYTES / 1024 / 1024)} MB.`));
      if (err instanceof multer.MulterError && err.field) return next(invalidInput({ [err.field]: err.message }));
      next(badRequest('bad_upload', err instanceof Error ? err.message : 'The upload could not be read.'));
    });
}
