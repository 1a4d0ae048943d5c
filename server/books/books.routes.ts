import { Router, type NextFunction, type Request, type Response } from 'express';
import multer from 'multer';
import { z } from 'zod';
import type { AppDeps } from '../platform/deps';
import { monthString } from '../../src/shared/books';
import { badRequest, notFound, tooLarge } from '../platform/errors';
import { allow, uuidParam } from '../platform/http/middleware';
import { parse } from '../platform/http/validate';
import { closeMonth, reopenMonth } from './close.service';
import { cogsReport } from './cogs.service';
import * as counts from './counts.service';
import { sendCsv } from '../platform/csv';
import { COGS_COLUMNS, cogsCsv, cogsTrend, PURCHASES_COLUMNS, purchasesCsv, STOCK_COLUMNS, stockValuationCsv, supplierChart } from './exports.service';
import { listPeriods } from './periods.service';
import * as sales from './sales.service';
import * as waste from './waste.service';

const monthQuery = z.object({ month: monthString, siteId: z.uuid('Choose a site.').optional() });
const trendQuery = monthQuery.extend({ months: z.coerce.number().int().min(1).max(24).default(6) });
const periodBody = z.object({ reason: z.string().trim().max(500).nullish() });
const countIdQuery = z.object({ countId: z.uuid('Choose a count.') });
const siteQuery = z.object({ siteId: z.uuid().optional() });

const id = (p: unknown) => String(p);

/** A month in the URL (YYYY-MM); anything else is simply not found. */
function monthParam(_req: Request, _res: Response, next: NextFunction, value: string) {
  if (!monthString.safeParse(value).success) throw notFound('That month');
  next();
}

function reportsRoutes({ db }: AppDeps) {
  const r = Router();
  r.param('month', monthParam);

  r.get('/api/reports/cogs', allow('reports.read'), async (req, res) => {
    const q = parse(monthQuery, req.query);
    res.json(await cogsReport(db, req.user!.businessId, q.month, q.siteId ?? null));
  });
  r.get('/api/reports/cogs.csv', allow('reports.read'), async (req, res) => {
    const q = parse(monthQuery, req.query);
    const { filename, records } = await cogsCsv(db, req.user!.businessId, q.month, q.siteId ?? null);
    await sendCsv(res, filename, COGS_COLUMNS, records);
  });
  r.get('/api/reports/purchases.csv', allow('reports.read'), async (req, res) => {
    const q = parse(monthQuery, req.query);
    const { filename, records } = await purchasesCsv(db, req.user!.businessId, q.month, q.siteId ?? null);
    await sendCsv(res, filename, PURCHASES_COLUMNS, records);
  });
  r.get('/api/reports/stock-valuation.csv', allow('reports.read'), async (req, res) => {
    const q = parse(countIdQuery, req.query);
    const { filename, records } = await stockValuationCsv(db, req.user!.businessId, q.countId);
    await sendCsv(res, filename, STOCK_COLUMNS, records);
  });
  r.get('/api/reports/purchases-by-supplier', allow('reports.read'), async (req, res) => {
    const q = parse(monthQuery, req.query);
    res.json(await supplierChart(db, req.user!.businessId, q.month, q.siteId ?? null));
  });
  r.get('/api/reports/cogs-trend', allow('reports.read'), async (req, res) => {
    const q = parse(trendQuery, req.query);
    res.json(await cogsTrend(db, req.user!.businessId, q.month, q.siteId ?? null, q.months));
  });

  r.get('/api/periods', allow('reports.read'), async (req, res) => {
    res.json({ periods: await listPeriods(db, req.user!.businessId) });
  });
  r.post('/api/periods/:month/close', allow('periods.close'), async (req, res) => {
    const { reason } = parse(periodBody, req.body ?? {});
    res.json({ period: await closeMonth(db, req.user!.businessId, req.user!.id, id(req.params.month), reason ?? null) });
  });
  r.post('/api/periods/:month/reopen', allow('periods.reopen'), async (req, res) => {
    const { reason } = parse(periodBody, req.body ?? {});
    res.json({ period: await reopenMonth(db, req.user!.businessId, req.user!.id, id(req.params.month), reason ?? null) });
  });
  return r;
}

function countsRoutes({ db }: AppDeps) {
  const r = Router();
  r.param('id', uuidParam);
  r.param('packId', uuidParam);
  r.get('/api/stock-counts', allow('stock.read'), async (req, res) => {
    res.json(await counts.listCounts(db, req.user!.businessId, parse(counts.countListQuery, req.query)));
  });
  r.post('/api/stock-counts', allow('counts.write'), async (req, res) => {
    res.status(201).json(await counts.startCount(db, req.user!.businessId, req.user!.id, parse(counts.countInSchema, req.body)));
  });
  r.get('/api/stock-counts/:id', allow('stock.read'), async (req, res) => {
    res.json(await counts.getCountSheet(db, req.user!.businessId, id(req.params.id)));
  });
  r.put('/api/stock-counts/:id/lines/:packId', allow('counts.write'), async (req, res) => {
    const input = parse(counts.countLineSchema, req.body);
    res.json(await counts.saveCountLine(db, req.user!.businessId, req.user!.id, id(req.params.id), id(req.params.packId), input));
  });
  r.post('/api/stock-counts/:id/finish', allow('counts.write'), async (req, res) => {
    res.json(await counts.finishCount(db, req.user!.businessId, req.user!.id, id(req.params.id)));
  });
  r.delete('/api/stock-counts/:id', allow('counts.write'), async (req, res) => {
    await counts.deleteCount(db, req.user!.businessId, id(req.params.id));
    res.status(204).end();
  });
  return r;
}

function wasteRoutes({ db }: AppDeps) {
  const r = Router();
  r.param('id', uuidParam);
  r.get('/api/waste', allow('stock.read'), async (req, res) => {
    res.json(await waste.listWaste(db, req.user!.businessId, parse(waste.wasteListQuery, req.query)));
  });
  r.get('/api/waste/choices', allow('waste.write'), async (req, res) => {
    res.json(await waste.wasteChoices(db, req.user!.businessId));
  });
  r.post('/api/waste', allow('waste.write'), async (req, res) => {
    res.status(201).json(await waste.recordWaste(db, req.user!.businessId, req.user!.id, parse(waste.wasteInSchema, req.body)));
  });
  r.delete('/api/waste/:id', allow('waste.write'), async (req, res) => {
    await waste.deleteWaste(db, req.user!.businessId, id(req.params.id));
    res.status(204).end();
  });
  return r;
}

function salesRoutes({ db, config }: AppDeps) {
  const r = Router();
  r.param('id', uuidParam);
  const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: config.UPLOAD_MAX_BYTES, files: 1, fields: 5 } }).single('file');
  // multer's own errors become the API's: 413 for a file over the limit, 400 otherwise.
  const receiveFile = (req: Request, res: Response, next: NextFunction) =>
    upload(req, res, (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') return next(tooLarge(`The file is larger than ${Math.floor(config.UPLOAD_MAX_BYTES / 1024 / 1024)} MB.`));
      next(badRequest('bad_upload', err instanceof Error ? err.message : 'The upload could not be read.'));
    });

  r.get('/api/sales-imports', allow('sales.import'), async (req, res) => {
    res.json(await sales.listImports(db, req.user!.businessId, parse(siteQuery, req.query).siteId));
  });
  r.post('/api/sales-imports', allow('sales.import'), receiveFile, async (req, res) => {
    const { siteId } = parse(z.object({ siteId: z.uuid('Choose a site.') }), req.body ?? {});
    if (!req.file) throw badRequest('no_file', 'Choose the CSV file exported from the till.');
    res.status(201).json(await sales.uploadImport(db, req.user!.businessId, req.user!.id, siteId, req.file));
  });
  r.post('/api/sales-imports/:id/preview', allow('sales.import'), async (req, res) => {
    res.json(await sales.previewImport(db, req.user!.businessId, id(req.params.id), parse(sales.previewSchema, req.body).columns));
  });
  r.post('/api/sales-imports/:id/accept', allow('sales.import'), async (req, res) => {
    res.json(await sales.acceptImport(db, req.user!.businessId, req.user!.id, id(req.params.id), parse(sales.acceptSchema, req.body)));
  });
  r.delete('/api/sales-imports/:id', allow('sales.import'), async (req, res) => {
    await sales.discardImport(db, req.user!.businessId, id(req.params.id));
    res.status(204).end();
  });
  r.get('/api/sales/days', allow('sales.import'), async (req, res) => {
    res.json(await sales.salesDays(db, req.user!.businessId, parse(sales.salesDaysQuery, req.query)));
  });
  r.get('/api/sales/days/:soldOn', allow('sales.import'), async (req, res) => {
    res.json(await sales.manualDay(db, req.user!.businessId, parse(sales.salesDayQuery, { ...req.query, soldOn: req.params.soldOn })));
  });
  r.put('/api/sales/days', allow('sales.import'), async (req, res) => {
    res.json(await sales.saveManualDay(db, req.user!.businessId, parse(sales.manualDaySchema, req.body)));
  });
  return r;
}

/** The books domain: counts, waste, till sales, month end and the bookkeeper's reports. */
export function booksRouters(deps: AppDeps): Router[] {
  return [reportsRoutes(deps), countsRoutes(deps), wasteRoutes(deps), salesRoutes(deps)];
}
