import type { LineError } from './till-csv';

// What a till file's reading hands on: shared by the worker's task, the repo and the presenter.

export interface DrinkSizeChoice {
  id: string;
  drink: string;
  size: string;
  label: string;
}

export interface ItemSummary {
  tillItem: string;
  tillSize: string;
  rows: number;
  quantity: string;
  netSales: string;
  drinkSizeId: string | null;
  remembered: boolean;
  suggestions: { drinkSizeId: string; label: string; score: number }[];
}

export interface TillPreview {
  rowCount: number;
  errorCount: number;
  errors: LineError[];
  firstDay: string | null;
  lastDay: string | null;
  netSales: string;
  items: ItemSummary[];
}
