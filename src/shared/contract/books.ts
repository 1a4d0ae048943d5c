import { z } from 'zod';
import { rules } from '../checks';
import { decimal, id, isoDate, isoMonth, optionalText, text } from '../schemas/fields';
import { UNIT_CODES } from '../units';
import { endpoint, raw } from './endpoint';

/**
 * The books: stock counts, waste, till sales, the month's cost of goods and month end.
 * Money and quantities travel as decimal strings, days as YYYY-MM-DD, months as YYYY-MM.
 *
 * Who sees money: counts and waste are read by every role, but a figure of cost (a pack's
 * price, a count's or a waste entry's value, a month's waste total) is sent only to roles
 * that read costs (`costs.read`); a barista's answers leave those fields out altogether.
 */

const money = z.string();
const quantity = z.string();
const day = z.string();
const instant = z.string();

// ——— Cost of goods ———————————————————————————————————————————————————————————————

/** One ingredient category's figures for a month, each rounded to the currency. */
export const cogsRowSchema = z.object({
  category: z.string(),
  opening: money,
  purchases: money,
  closing: money,
  /** opening + purchases − closing */
  actual: money,
  /** Σ cups sold × the recipe cost on the day of sale */
  theoretical: money,
  /** actual − theoretical */
  variance: money,
  /** variance ÷ theoretical × 100; null when theoretical is 0. */
  variancePct: z.string().nullable(),
  waste: money,
});
export type CogsRow = z.output<typeof cogsRowSchema>;

export const cogsTotalsSchema = cogsRowSchema.omit({ category: true }).extend({
  netSales: money,
  /** actual ÷ net sales × 100; null without sales. */
  cogsPctOfSales: z.string().nullable(),
});
export type CogsTotals = z.output<typeof cogsTotalsSchema>;

export const countRefSchema = z.object({ siteId: z.uuid(), countId: z.uuid(), countDate: day });
export type CountRef = z.output<typeof countRefSchema>;

/** The month's cost of goods: the one type of it, for the server, the client and the snapshot kept at close. */
export const cogsReportSchema = z.object({
  month: z.string(),
  siteId: z.uuid().nullable(),
  closed: z.boolean(),
  currency: z.string(),
  rows: z.array(cogsRowSchema),
  totals: cogsTotalsSchema,
  /** The counts used as opening and closing stock, one per site that has one. */
  counts: z.object({ opening: z.array(countRefSchema), closing: z.array(countRefSchema) }),
  /** Cups sold in the month, and those that could not be costed (no build or no price). */
  cups: quantity,
  uncostedCups: quantity,
  /** What the reader should know before trusting the figures (a missing count, an unpriced pack…). */
  notes: z.array(z.string()),
});
export type CogsReport = z.output<typeof cogsReportSchema>;

const monthQuery = z.object({ month: isoMonth, siteId: id('site').optional() });

export const cogsReport = endpoint({
  method: 'GET', path: '/api/reports/cogs', access: 'reports.read',
  summary: "A month's cost of goods by ingredient category, at one site or all (a closed month's as frozen at close).",
  query: monthQuery, response: cogsReportSchema,
});

export const cogsCsv = endpoint({
  method: 'GET', path: '/api/reports/cogs.csv', access: 'reports.read',
  summary: 'The cost-of-goods report as CSV: one row per category, then the totals.',
  query: monthQuery, response: raw('text/csv'),
});

export const purchasesCsv = endpoint({
  method: 'GET', path: '/api/reports/purchases.csv', access: 'reports.read',
  summary: 'The purchases ledger of a month as CSV: one row per delivery received.',
  query: monthQuery, response: raw('text/csv'),
});

export const stockValuationCsv = endpoint({
  method: 'GET', path: '/api/reports/stock-valuation.csv', access: 'reports.read',
  summary: "A count's stock valuation as CSV: each pack counted × its price, then the total.",
  query: z.object({ countId: id('count') }), response: raw('text/csv'),
});

export const purchasesBySupplier = endpoint({
  method: 'GET', path: '/api/reports/purchases-by-supplier', access: 'reports.read',
  summary: "A month's purchases received, net of tax, by supplier.",
  query: monthQuery,
  response: z.object({ month: z.string(), siteId: z.uuid().nullable(), currency: z.string(), suppliers: z.array(z.object({ supplier: z.string(), net: money })) }),
});

export const trendMonthSchema = z.object({
  month: z.string(),
  closed: z.boolean(),
  actual: money,
  theoretical: money,
  netSales: money,
  cogsPctOfSales: z.string().nullable(),
});
export type TrendMonth = z.output<typeof trendMonthSchema>;

export const cogsTrend = endpoint({
  method: 'GET', path: '/api/reports/cogs-trend', access: 'reports.read',
  summary: 'Cost of goods against net sales for the months up to one (6 unless `months` says, at most 24).',
  query: monthQuery.extend({ months: z.coerce.number({ error: 'Give a number of months from 1 to 24.' }).int('Give a number of months from 1 to 24.').min(1, 'Give a number of months from 1 to 24.').max(24, 'Give a number of months from 1 to 24.').default(6) }),
  response: z.object({ siteId: z.uuid().nullable(), currency: z.string(), months: z.array(trendMonthSchema) }),
});

// ——— Month end ——————————————————————————————————————————————————————————————————

export const periodSchema = z.object({
  month: z.string(),
  status: z.enum(['open', 'closed']),
  closedAt: instant.nullable(),
  closedBy: z.string().nullable(),
  events: z.array(z.object({ action: z.enum(['close', 'reopen']), at: instant, by: z.string().nullable(), reason: z.string().nullable() })),
});
export type Period = z.output<typeof periodSchema>;

export const periodActionSchema = z.object({ reason: optionalText(500) });
const monthParams = z.object({ month: isoMonth });

export const listPeriods = endpoint({
  method: 'GET', path: '/api/periods', access: 'reports.read',
  summary: 'Every month closed or reopened, newest first, with who did what and when.',
  response: z.object({ periods: z.array(periodSchema) }),
});

export const closePeriod = endpoint({
  method: 'POST', path: '/api/periods/:month/close', access: 'periods.close',
  summary: "Closes a month that has ended: its counts, deliveries, sales and waste become read-only and its report is frozen.",
  params: monthParams, body: periodActionSchema, response: z.object({ period: periodSchema }),
  errors: { 409: '`already_closed`; `month_not_over`: the month has not ended yet' },
});

export const reopenPeriod = endpoint({
  method: 'POST', path: '/api/periods/:month/reopen', access: 'periods.reopen',
  summary: 'Reopens a closed month, recorded with who, when and why.',
  params: monthParams, body: periodActionSchema, response: z.object({ period: periodSchema }),
  errors: { 409: '`not_closed`' },
});

// ——— Stock counts ——————————————————————————————————————————————————————————————

export const stockCountSchema = z.object({
  id: z.uuid(),
  siteId: z.uuid(),
  siteName: z.string(),
  countDate: day,
  status: z.enum(['open', 'finished']),
  finishedAt: instant.nullable(),
  startedBy: z.string().nullable(),
  finishedBy: z.string().nullable(),
  lineCount: z.number().int(),
  /** Packs × the pack price in force on the count date. Only for roles that read costs. */
  value: money.optional(),
});
export type StockCount = z.output<typeof stockCountSchema>;

export const sheetItemSchema = z.object({
  packId: z.uuid(),
  ingredient: z.string(),
  category: z.string(),
  description: z.string(),
  pack: z.object({ count: quantity, quantity, unit: z.string() }),
  baseUnit: z.enum(['g', 'ml', 'each']),
  /** Packs counted so far (whole packs and the open pack's fraction); null until counted. */
  packs: quantity.nullable(),
  /** The pack's price in force on the count date (or frozen at close). Only for roles that read costs. */
  price: money.nullable().optional(),
  /** packs × price. Only for roles that read costs. */
  value: money.nullable().optional(),
});
export type SheetItem = z.output<typeof sheetItemSchema>;

export const countSheetSchema = z.object({
  count: stockCountSchema,
  currency: z.string(),
  areas: z.array(z.object({ id: z.uuid().nullable(), name: z.string(), items: z.array(sheetItemSchema) })),
});
export type CountSheet = z.output<typeof countSheetSchema>;

export const countInSchema = z.object({ siteId: id('site'), countDate: isoDate });

/**
 * One pack's count: whole packs with the open pack's fraction (3.4), an amount on hand in a
 * unit (4500 ml, turned into packs of the pack's size), or both (3 packs and 450 ml open).
 */
export const countLineSchema = z
  .object({
    packs: decimal('packs', rules.nonNegative).optional(),
    quantity: decimal('quantity', rules.nonNegative).optional(),
    unit: z.enum(UNIT_CODES, { error: 'Choose a unit.' }).optional(),
  })
  .superRefine((v, ctx) => {
    if (v.quantity !== undefined && v.unit === undefined) ctx.addIssue({ code: 'custom', path: ['unit'], message: 'Choose the unit of the amount.' });
    if (v.unit !== undefined && v.quantity === undefined) ctx.addIssue({ code: 'custom', path: ['quantity'], message: 'Give the amount on hand.' });
    if (v.packs === undefined && v.quantity === undefined && v.unit === undefined) ctx.addIssue({ code: 'custom', path: ['packs'], message: 'Give the packs counted or the amount on hand.' });
  });
export type CountLineIn = z.input<typeof countLineSchema>;

const one = z.object({ count: stockCountSchema });

export const listCounts = endpoint({
  method: 'GET', path: '/api/stock-counts', access: 'stock.read',
  summary: "The counts of a site (or every site), newest first; each count's value only for roles that read costs.",
  query: z.object({ siteId: id('site').optional() }),
  response: z.object({ counts: z.array(stockCountSchema), currency: z.string() }),
});

export const startCount = endpoint({
  method: 'POST', path: '/api/stock-counts', access: 'counts.write',
  summary: 'Starts a count of a site on a date.',
  body: countInSchema, response: one, status: 201,
  errors: { 409: '`month_closed`' },
});

export const getCountSheet = endpoint({
  method: 'GET', path: '/api/stock-counts/:id', access: 'stock.read',
  summary: "The count sheet: the site's stocked packs by storage area (every live pack when it stocks none yet), with what is counted so far.",
  response: countSheetSchema,
});

export const saveCountLine = endpoint({
  method: 'PUT', path: '/api/stock-counts/:id/lines/:packId', access: 'counts.write',
  summary: "Saves one pack's count (saved as you go).",
  body: countLineSchema, response: z.object({ line: z.object({ packId: z.uuid(), packs: quantity }) }),
  errors: { 409: '`count_finished`; `month_closed`' },
});

export const finishCount = endpoint({
  method: 'POST', path: '/api/stock-counts/:id/finish', access: 'counts.write',
  summary: 'Finishes a count: its lines can no longer change.',
  response: one,
  errors: { 409: '`count_finished`; `month_closed`' },
});

export const deleteCount = endpoint({
  method: 'DELETE', path: '/api/stock-counts/:id', access: 'counts.write',
  summary: 'Deletes a count of an open month.',
  response: null,
  errors: { 409: '`month_closed`' },
});

// ——— Waste ———————————————————————————————————————————————————————————————————————

export const WASTE_KINDS = ['ingredient', 'preparation', 'drinkSize'] as const;

export const wasteEntrySchema = z.object({
  id: z.uuid(),
  siteId: z.uuid(),
  occurredOn: day,
  item: z.object({ kind: z.enum(WASTE_KINDS), id: z.uuid(), name: z.string() }),
  quantity,
  /** A standard unit; null for a drink (cups). */
  unit: z.string().nullable(),
  reason: z.string(),
  recordedBy: z.string().nullable(),
  /** At cost on the day. Only for roles that read costs; null when it cannot be costed. */
  value: money.nullable().optional(),
  /** Why it could not be costed. Only for roles that read costs. */
  problem: z.string().nullable().optional(),
});
export type WasteEntry = z.output<typeof wasteEntrySchema>;

export const wasteChoiceSchema = z.object({
  kind: z.enum(WASTE_KINDS),
  id: z.uuid(),
  name: z.string(),
  baseUnit: z.enum(['g', 'ml', 'each']).optional(),
});
export type WasteChoice = z.output<typeof wasteChoiceSchema>;

export const wasteInSchema = z.object({
  siteId: id('site'),
  occurredOn: isoDate,
  item: z.object({ kind: z.enum(WASTE_KINDS, { error: 'Choose what was wasted.' }), id: id('thing that was wasted') }),
  quantity: decimal('quantity', rules.positive),
  /** A standard unit for an ingredient or preparation; cups (null) for a drink. */
  unit: z.enum(UNIT_CODES, { error: 'Choose a unit.' }).nullish(),
  reason: text({ what: 'reason', min: 1, max: 200 }),
});
export type WasteIn = z.input<typeof wasteInSchema>;

export const listWaste = endpoint({
  method: 'GET', path: '/api/waste', access: 'stock.read',
  summary: "A month's waste at a site (or every site); values and the month's total only for roles that read costs.",
  query: z.object({ month: isoMonth, siteId: id('site').optional() }),
  response: z.object({ month: z.string(), currency: z.string(), entries: z.array(wasteEntrySchema), total: money.optional() }),
});

export const wasteChoices = endpoint({
  method: 'GET', path: '/api/waste/choices', access: 'waste.write',
  summary: 'What waste can be recorded against (ingredients, preparations, drink sizes), with no cost.',
  response: z.object({ choices: z.array(wasteChoiceSchema) }),
});

export const recordWaste = endpoint({
  method: 'POST', path: '/api/waste', access: 'waste.write',
  summary: 'Records waste: an ingredient or preparation in a unit, or cups of a drink size.',
  body: wasteInSchema, response: z.object({ entry: z.object({ id: z.uuid(), occurredOn: day }) }), status: 201,
  errors: { 409: '`month_closed`' },
});

export const deleteWaste = endpoint({
  method: 'DELETE', path: '/api/waste/:id', access: 'waste.write',
  summary: 'Takes back a waste entry of an open month.',
  response: null,
  errors: { 409: '`month_closed`' },
});

// ——— Till sales ———————————————————————————————————————————————————————————————————

export const DATE_FORMATS = ['YYYY-MM-DD', 'DD/MM/YYYY', 'MM/DD/YYYY'] as const;
export type DateFormat = (typeof DATE_FORMATS)[number];

const column = (what: string) => text({ min: 1, max: 200 }).pipe(z.string().min(1, `Choose the ${what} column.`));
const optionalColumn = text({ max: 200 }).transform((s) => (s === '' ? null : s)).nullish();

/** Which column of the till's file holds what. */
export const columnMappingSchema = z.object({
  date: column('date'),
  item: column('item'),
  size: optionalColumn,
  quantity: column('quantity'),
  netSales: column('net sales'),
  tax: optionalColumn,
  dateFormat: z.enum(DATE_FORMATS, { error: 'Choose how the dates are written.' }).default('YYYY-MM-DD'),
});
export type ColumnMapping = z.output<typeof columnMappingSchema>;
export type ColumnMappingIn = z.input<typeof columnMappingSchema>;

export const salesImportSchema = z.object({
  id: z.uuid(),
  siteId: z.uuid(),
  filename: z.string(),
  sha256: z.string(),
  status: z.enum(['pending', 'accepted', 'discarded']),
  rowCount: z.number().int(),
  firstDay: day.nullable(),
  lastDay: day.nullable(),
  createdAt: instant,
  acceptedAt: instant.nullable(),
  createdBy: z.string().nullable(),
});
export type SalesImport = z.output<typeof salesImportSchema>;

export const uploadResultSchema = z.object({
  import: salesImportSchema,
  headers: z.array(z.string()),
  sample: z.array(z.array(z.string())),
  /** The mapping remembered from the last file (when this one has those columns), else a guess. */
  columns: columnMappingSchema.partial(),
  columnsRemembered: z.boolean(),
});
export type UploadResult = z.output<typeof uploadResultSchema>;

export const previewItemSchema = z.object({
  tillItem: z.string(),
  tillSize: z.string(),
  rows: z.number().int(),
  quantity,
  netSales: money,
  drinkSizeId: z.uuid().nullable(),
  remembered: z.boolean(),
  suggestions: z.array(z.object({ drinkSizeId: z.uuid(), label: z.string(), score: z.number() })),
});

export const importPreviewSchema = z.object({
  rowCount: z.number().int(),
  errorCount: z.number().int(),
  errors: z.array(z.object({ line: z.number().int(), message: z.string() })),
  firstDay: day.nullable(),
  lastDay: day.nullable(),
  netSales: money,
  currency: z.string(),
  items: z.array(previewItemSchema),
  drinkSizes: z.array(z.object({ id: z.uuid(), label: z.string() })),
});
export type ImportPreview = z.output<typeof importPreviewSchema>;

export const acceptImportSchema = z.object({
  columns: columnMappingSchema,
  items: z
    .array(z.object({ tillItem: text({ min: 1, max: 200 }), tillSize: text({ max: 200 }).default(''), drinkSizeId: id('drink and size') }))
    .max(20_000, 'At most 20,000 till items in one file.'),
});
export type AcceptImportIn = z.input<typeof acceptImportSchema>;

const siteQuery = z.object({ siteId: id('site') });

export const listImports = endpoint({
  method: 'GET', path: '/api/sales-imports', access: 'sales.import',
  summary: 'The till files of a site (or every site), newest first.',
  query: z.object({ siteId: id('site').optional() }),
  response: z.object({ imports: z.array(salesImportSchema) }),
});

export const uploadImport = endpoint({
  method: 'POST', path: '/api/sales-imports', access: 'sales.import',
  summary: "Receives a till's CSV file (multipart: `siteId`, `file`) and keeps it pending; saves no sales.",
  body: 'multipart', response: uploadResultSchema, status: 201,
  errors: { 409: '`already_imported`: the same rows are already in an accepted file of the site', 413: '`too_large`' },
});

export const previewImport = endpoint({
  method: 'POST', path: '/api/sales-imports/:id/preview', access: 'sales.import',
  summary: "Reads a pending file with a column mapping: errors by line, totals and the till's items with their suggested drinks. Saves nothing.",
  body: z.object({ columns: columnMappingSchema }), response: importPreviewSchema,
  errors: { 409: '`already_imported`; `import_not_pending`' },
});

export const acceptImport = endpoint({
  method: 'POST', path: '/api/sales-imports/:id/accept', access: 'sales.import',
  summary: 'Saves every line of a pending file in one transaction and remembers the mappings.',
  body: acceptImportSchema, response: z.object({ import: salesImportSchema }),
  errors: { 409: '`already_imported`; `month_closed`; `import_not_pending`' },
});

export const discardImport = endpoint({
  method: 'DELETE', path: '/api/sales-imports/:id', access: 'sales.import',
  summary: 'Discards a pending file, or takes back an accepted one (its sales go) while its months are open.',
  response: null,
  errors: { 409: '`month_closed`' },
});

export const salesDaySchema = z.object({ day, cups: quantity, netSales: money, manualLines: z.number().int(), importedLines: z.number().int() });
export type SalesDay = z.output<typeof salesDaySchema>;

export const salesDays = endpoint({
  method: 'GET', path: '/api/sales/days', access: 'sales.import',
  summary: 'Each day of a month at a site: cups and net sales, from till files and typed in.',
  query: siteQuery.extend({ month: isoMonth }),
  response: z.object({ month: z.string(), currency: z.string(), days: z.array(salesDaySchema) }),
});

export const manualDaySchema = z.object({
  siteId: z.uuid(),
  soldOn: day,
  /** Its month is closed: saving is refused. */
  closed: z.boolean(),
  currency: z.string(),
  /** The lines typed in by hand, in the order they were saved. */
  lines: z.array(z.object({ drinkSizeId: z.uuid(), label: z.string(), quantity, netSales: money, tax: money.nullable() })),
  /** Lines from till files that day (saving by hand leaves them as they are). */
  importedLines: z.number().int(),
});
export type ManualDay = z.output<typeof manualDaySchema>;

export const salesDay = endpoint({
  method: 'GET', path: '/api/sales/days/:soldOn', access: 'sales.import',
  summary: "One day's hand-entered lines at a site, as the hand-entry form loads them.",
  params: z.object({ soldOn: isoDate }), query: siteQuery,
  response: manualDaySchema,
});

export const manualDayInSchema = z.object({
  siteId: id('site'),
  soldOn: isoDate,
  lines: z
    .array(z.object({
      drinkSizeId: id('drink and size'),
      quantity: decimal('quantity', rules.nonNegative),
      netSales: decimal('money', rules.nonNegative),
      tax: decimal('money', rules.nonNegative).nullish(),
    }))
    .max(500, 'At most 500 lines a day.'),
});
export type ManualDayIn = z.input<typeof manualDayInSchema>;

export const saveSalesDay = endpoint({
  method: 'PUT', path: '/api/sales/days', access: 'sales.import',
  summary: "Replaces a day's hand-entered lines at a site (lines from till files stay); `lines: []` clears them.",
  body: manualDayInSchema, response: manualDaySchema.extend({ replaced: z.number().int() }),
  errors: { 409: '`month_closed`' },
});
