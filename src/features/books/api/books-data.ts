/**
 * Every path of the books: a change to counts, waste, sales or a month's state refreshes all
 * of them (each feeds the month's figures).
 */
export const BOOKS_PATHS: `/api/${string}`[] = ['/api/stock-counts', '/api/waste', '/api/sales-imports', '/api/sales', '/api/reports', '/api/periods'];
