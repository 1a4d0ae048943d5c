/**
 * Moving between a table's cells with the keyboard, as in a spreadsheet: the arrows move one
 * cell, Home and End to the start and end of the row, Ctrl+Home and Ctrl+End to the first and
 * last row. Controls that use the arrows themselves keep them (see `keepsKey`).
 */

const FOCUSABLE = [
  'a[href]',
  'button:not([disabled])',
  'input:not([disabled]):not([type="hidden"])',
  'select:not([disabled])',
  'textarea:not([disabled])',
  '[tabindex]:not([tabindex="-1"])',
].join(', ');

/** Inputs where the caret moves with Left, Right, Home and End. */
const TEXT_INPUTS = new Set(['', 'text', 'search', 'email', 'url', 'tel', 'password', 'number', 'date', 'time', 'datetime-local', 'month', 'week']);
/** Inputs whose value Up and Down step through, left to them: date and time parts, radio groups, sliders. */
const STEPPED_INPUTS = new Set(['date', 'time', 'datetime-local', 'month', 'week', 'radio', 'range']);

function isTextEntry(el: Element): boolean {
  if (el instanceof HTMLTextAreaElement) return true;
  if (el instanceof HTMLElement && el.isContentEditable) return true;
  return el instanceof HTMLInputElement && TEXT_INPUTS.has(el.getAttribute('type')?.toLowerCase() ?? '');
}

/** Does the focused element need this key for itself? */
function keepsKey(el: Element, key: string, ctrl: boolean): boolean {
  // An open list (an autocomplete) is moved through with the arrows.
  if (el.getAttribute('aria-expanded') === 'true') return true;
  const type = el instanceof HTMLInputElement ? (el.getAttribute('type')?.toLowerCase() ?? '') : '';
  if (key === 'ArrowUp' || key === 'ArrowDown') {
    // Up and Down leave text boxes, number boxes and closed selects for the next row; a
    // text area's lines and stepped inputs keep them.
    return el instanceof HTMLTextAreaElement || (el instanceof HTMLElement && el.isContentEditable) || STEPPED_INPUTS.has(type);
  }
  if (ctrl) return isTextEntry(el);
  return isTextEntry(el) || el instanceof HTMLSelectElement || type === 'radio' || type === 'range';
}

const isShown = (el: Element) => el.getClientRects().length > 0;

/** The cell of `table` that holds `el`, if any (not a cell of a table nested inside it). */
function cellOf(table: HTMLTableElement, el: Element): HTMLTableCellElement | null {
  const cell = el.closest('td, th');
  return cell instanceof HTMLTableCellElement && cell.closest('table') === table ? cell : null;
}

/** Where a cell starts, counting spanned columns. */
function columnOf(cell: HTMLTableCellElement): number {
  let col = 0;
  for (let c = cell.previousElementSibling; c; c = c.previousElementSibling) if (c instanceof HTMLTableCellElement) col += c.colSpan;
  return col;
}

/** The cell of `row` covering column `col`, or its last cell if the row is shorter. */
function cellAt(row: HTMLTableRowElement, col: number): HTMLTableCellElement | null {
  let start = 0;
  for (const cell of row.cells) {
    if (col < start + cell.colSpan) return cell;
    start += cell.colSpan;
  }
  return row.cells[row.cells.length - 1] ?? null;
}

/** Focuses the first control in a cell, or else the cell itself. */
export function focusCell(cell: HTMLTableCellElement): void {
  const control = [...cell.querySelectorAll<HTMLElement>(FOCUSABLE)].find(isShown);
  if (control) {
    control.focus();
    return;
  }
  if (!cell.hasAttribute('tabindex')) cell.tabIndex = -1;
  cell.focus();
}

/** The cell a key moves to from `cell`, or null if it does not move. */
function target(table: HTMLTableElement, cell: HTMLTableCellElement, key: string, ctrl: boolean): HTMLTableCellElement | null {
  const rows = [...table.rows].filter((r) => r.closest('table') === table && isShown(r));
  const bodyRows = rows.filter((r) => r.parentElement instanceof HTMLTableSectionElement && r.parentElement.tagName === 'TBODY');
  const row = cell.parentElement as HTMLTableRowElement;
  const at = rows.indexOf(row);
  const col = columnOf(cell);
  switch (key) {
    case 'ArrowUp':
      return at > 0 ? cellAt(rows[at - 1], col) : null;
    case 'ArrowDown':
      return at >= 0 && at < rows.length - 1 ? cellAt(rows[at + 1], col) : null;
    case 'ArrowLeft':
      return cell.previousElementSibling instanceof HTMLTableCellElement ? cell.previousElementSibling : null;
    case 'ArrowRight':
      return cell.nextElementSibling instanceof HTMLTableCellElement ? cell.nextElementSibling : null;
    case 'Home': {
      const r = ctrl ? bodyRows[0] : row;
      return r?.cells[0] ?? null;
    }
    case 'End': {
      const r = ctrl ? bodyRows[bodyRows.length - 1] : row;
      return r?.cells[r.cells.length - 1] ?? null;
    }
    default:
      return null;
  }
}

const KEYS = new Set(['ArrowUp', 'ArrowDown', 'ArrowLeft', 'ArrowRight', 'Home', 'End']);

/**
 * Handles a keydown inside `table`; returns true when it moved the focus (the caller then
 * prevents the key's default, e.g. scrolling the page).
 */
export function moveInTable(table: HTMLTableElement, event: Pick<KeyboardEvent, 'key' | 'ctrlKey' | 'altKey' | 'metaKey' | 'shiftKey' | 'defaultPrevented' | 'isComposing'> & { target: EventTarget | null }): boolean {
  const { key, target: el } = event;
  if (!KEYS.has(key) || event.defaultPrevented || event.isComposing || event.altKey || event.metaKey || event.shiftKey) return false;
  const ctrl = event.ctrlKey;
  if (ctrl && key !== 'Home' && key !== 'End') return false;
  if (!(el instanceof Element)) return false;
  const cell = cellOf(table, el);
  if (!cell || keepsKey(el, key, ctrl)) return false;
  const next = target(table, cell, key, ctrl);
  if (!next || next === cell) return false;
  focusCell(next);
  return true;
}

/**
 * A table with no control at all could not be reached with Tab: its first body cell then takes
 * part in the tab order (and the arrows go on from there).
 */
export function keepTableReachable(table: HTMLTableElement): void {
  const entry = table.querySelector<HTMLElement>('[data-table-entry]');
  const reachable = [...table.querySelectorAll(FOCUSABLE)].some((el) => el !== entry);
  const first = table.tBodies[0]?.rows[0]?.cells[0] ?? null;
  if (entry && (reachable || entry !== first)) {
    entry.removeAttribute('data-table-entry');
    entry.tabIndex = -1;
  }
  if (!reachable && first && first !== entry) {
    first.dataset.tableEntry = '';
    first.tabIndex = 0;
  }
}
