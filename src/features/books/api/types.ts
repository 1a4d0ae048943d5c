// Shapes of the books API's bodies as the client reads them (money and quantities as decimal strings).

export interface CogsRow {
  category: string;
  opening: string;
  purchases: string;
  closing: string;
  actual: string;
  theoretical: string;
  variance: string;
  variancePct: string | null;
  waste: string;
}

export interface CogsTotals extends Omit<CogsRow, 'category'> {
  netSales: string;
  cogsPctOfSales: string | null;
}

export interface CountRef {
  siteId: string;
  countId: string;
  countDate: string;
}

export interface CogsReport {
  month: string;
  siteId: string | null;
  closed: boolean;
  currency: string;
  rows: CogsRow[];
  totals: CogsTotals;
  counts: { opening: CountRef[]; closing: CountRef[] };
  cups: string;
  uncostedCups: string;
  notes: string[];
}

export interface TrendMonth {
  month: string;
  closed: boolean;
  actual: string;
  theoretical: string;
  netSales: string;
  cogsPctOfSales: string | null;
}

export interface Period {
  month: string;
  status: 'open' | 'closed';
  closedAt: string | null;
  closedBy: string | null;
  events: { action: 'close' | 'reopen'; at: string; by: string | null; reason: string | null }[];
}

export interface StockCount {
  id: string;
  siteId: string;
  siteName: string;
  countDate: string;
  status: 'open' | 'finished';
  finishedAt: string | null;
  startedBy: string | null;
  finishedBy: string | null;
  lineCount: number;
  value: string | null;
}

export interface SheetItem {
  packId: string;
  ingredient: string;
  category: string;
  description: string;
  pack: { count: string; quantity: string; unit: string };
  baseUnit: 'g' | 'ml' | 'each';
  price: string | null;
  packs: string | null;
  value: string | null;
}

export interface CountSheet {
  count: StockCount;
  currency: string;
  areas: { id: string | null; name: string; items: SheetItem[] }[];
}

export interface WasteEntry {
  id: string;
  siteId: string;
  occurredOn: string;
  item: { kind: 'ingredient' | 'preparation' | 'drinkSize'; id: string; name: string };
  quantity: string;
  unit: string | null;
  reason: string;
  value: string | null;
  problem: string | null;
  recordedBy: string | null;
}

export interface SalesImport {
  id: string;
  siteId: string;
  filename: string;
  status: 'pending' | 'accepted' | 'discarded';
  rowCount: number;
  firstDay: string | null;
  lastDay: string | null;
  createdAt: string;
  acceptedAt: string | null;
  createdBy: string | null;
}

export type DateFormat = 'YYYY-MM-DD' | 'DD/MM/YYYY' | 'MM/DD/YYYY';

export interface ColumnMapping {
  date: string;
  item: string;
  size?: string | null;
  quantity: string;
  netSales: string;
  tax?: string | null;
  dateFormat: DateFormat;
}

export interface UploadResult {
  import: SalesImport;
  headers: string[];
  sample: string[][];
  columns: Partial<ColumnMapping>;
  columnsRemembered: boolean;
}

export interface ImportPreview {
  rowCount: number;
  errorCount: number;
  errors: { line: number; message: string }[];
  firstDay: string | null;
  lastDay: string | null;
  netSales: string;
  currency: string;
  items: {
    tillItem: string;
    tillSize: string;
    rows: number;
    quantity: string;
    netSales: string;
    drinkSizeId: string | null;
    remembered: boolean;
    suggestions: { drinkSizeId: string; label: string; score: number }[];
  }[];
  drinkSizes: { id: string; label: string }[];
}
