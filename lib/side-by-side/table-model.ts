/**
 * What the side-by-side shows, computed from a `/api/v1/compare` response: rows grouped, each cell
 * as display text in the row's display unit (durations in hours; masses, lengths and temperatures
 * in imperial units when asked), rows whose cells are all equal left out when asked. The table and
 * the CSV export both read this model, so the file holds the figures on screen — as plain machine
 * numbers (10400, dot decimal, no grouping) with the unit in the row's Unit column.
 */
import Papa from 'papaparse';
import type { CompareCell, CompareGroup, CompareResponse, CompareRow, FigureBasis, RowDirection } from '@/lib/browse/contract';
import { formatNumber } from '@/lib/gear/format';
import { convert } from '@/lib/measure';

export type UnitSystem = 'metric' | 'imperial';

export interface ShownCell {
  /** Display number or text ("348.7", "10,400", "clear"); "" when the item lacks the figure. */
  text: string;
  /** The same figure for a CSV: a plain number in the row's display unit ("10400"), text as is. */
  plain: string;
  /** The cell's own unit when the row has none (per-money ratios in several currencies), else "". */
  ownUnit: string;
  basis: FigureBasis | null;
  provenance: string | null;
  best: boolean;
}

export interface ShownRow {
  key: string;
  groupId: CompareGroup['id'];
  label: string;
  /** Display unit ("g", "oz", "h", "lm/g"; "" for a dimensionless figure). */
  unit: string;
  direction: RowDirection;
  cells: ShownCell[];
}

export interface ShownGroup {
  id: CompareGroup['id'];
  label: string;
  rows: ShownRow[];
}

export interface SideBySideView {
  columns: { slug: string; name: string; maker: string }[];
  groups: ShownGroup[];
  /** Rows left out because every item has the same value. */
  hiddenEqualRows: number;
}

const DURATION_UNITS = new Set(['s']);
const TEMPERATURE_UNITS: Record<string, 'degC'> = { '°C': 'degC', degC: 'degC' };

/** The unit a row is shown in, and how to turn a canonical value into it. */
function displayUnit(row: CompareRow, units: UnitSystem): { unit: string; toDisplay: (v: number) => number } {
  const numbers = row.cells.map((c) => c.value).filter((v): v is number => typeof v === 'number');
  if (DURATION_UNITS.has(row.unit)) return { unit: 'h', toDisplay: (v) => convert(v, 's', 'h') };
  if (units === 'imperial') {
    if (row.unit === 'g') {
      // A pound and over reads better in lb (a 12 V battery is 25 lb, not 405 oz).
      const inPounds = numbers.some((v) => v >= convert(1, 'lb', 'g'));
      return inPounds ? { unit: 'lb', toDisplay: (v) => convert(v, 'g', 'lb') } : { unit: 'oz', toDisplay: (v) => convert(v, 'g', 'oz') };
    }
    if (row.unit === 'm') return { unit: 'ft', toDisplay: (v) => convert(v, 'm', 'ft') };
    if (TEMPERATURE_UNITS[row.unit]) return { unit: '°F', toDisplay: (v) => convert(v, 'degC', 'degF') };
  }
  return { unit: row.unit, toDisplay: (v) => v };
}

/** A display number without grouping: formatNumber's rounding, en-US digits (dot decimal), commas dropped. */
export function plainNumber(value: number): string {
  return formatNumber(value).replace(/,/g, '');
}

function shownCell(cell: CompareCell, rowUnit: string, toDisplay: (v: number) => number): ShownCell {
  const base = { basis: cell.basis, provenance: cell.provenance, best: cell.best };
  if (cell.value === null) return { ...base, text: '', plain: '', ownUnit: '' };
  if (typeof cell.value === 'string') return { ...base, text: cell.value, plain: cell.value, ownUnit: '' };
  // A row without one unit (per-money ratios in several currencies) carries each cell's own unit.
  if (rowUnit === '' && cell.unit !== '') {
    return { ...base, text: `${formatNumber(cell.value)} ${cell.unit}`, plain: plainNumber(cell.value), ownUnit: cell.unit };
  }
  const shown = toDisplay(cell.value);
  return { ...base, text: formatNumber(shown), plain: plainNumber(shown), ownUnit: '' };
}

export function sideBySideView(response: CompareResponse, options: { units: UnitSystem; hideEqual: boolean }): SideBySideView {
  let hiddenEqualRows = 0;
  const groups: ShownGroup[] = [];
  for (const group of response.groups) {
    const rows: ShownRow[] = [];
    for (const row of group.rows) {
      if (options.hideEqual && row.allEqual && response.items.length > 1) {
        hiddenEqualRows += 1;
        continue;
      }
      const { unit, toDisplay } = displayUnit(row, options.units);
      rows.push({
        key: row.key,
        groupId: group.id,
        label: row.label,
        unit,
        direction: row.direction,
        cells: row.cells.map((cell) => shownCell(cell, row.unit, toDisplay)),
      });
    }
    if (rows.length > 0) groups.push({ id: group.id, label: group.label, rows });
  }
  return {
    columns: response.items.map((i) => ({ slug: i.slug, name: i.name, maker: i.maker })),
    groups,
    hiddenEqualRows,
  };
}

/** The Unit column of a row: its display unit, or each item's own unit in column order ("lm/USD; lm/EUR"). */
function csvUnit(row: ShownRow): string {
  if (row.unit !== '' || !row.cells.some((c) => c.ownUnit !== '')) return row.unit;
  return row.cells.map((c) => c.ownUnit || '—').join('; ');
}

/**
 * The CSV rows of a view: a header (group, figure, unit, one column per item), then one line per
 * shown row with the table's figures as plain numbers (no grouping, dot decimal, no unit in the cell:
 * the unit is in the Unit column). The best cell is not marked in the figures themselves (so they stay
 * numbers); a last column names the best items.
 */
export function sideBySideCsvRows(view: SideBySideView): string[][] {
  const header = ['Group', 'Figure', 'Unit', ...view.columns.map((c) => `${c.maker} ${c.name}`), 'Best'];
  const lines = view.groups.flatMap((group) =>
    group.rows.map((row) => [
      group.label,
      row.label,
      csvUnit(row),
      ...row.cells.map((c) => c.plain),
      row.cells
        .map((c, i) => (c.best ? `${view.columns[i]!.maker} ${view.columns[i]!.name}` : null))
        .filter((n): n is string => n !== null)
        .join('; '),
    ]),
  );
  return [header, ...lines];
}

export function sideBySideCsv(view: SideBySideView): string {
  return Papa.unparse(sideBySideCsvRows(view), { newline: '\r\n' });
}
