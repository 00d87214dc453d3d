/**
 * The side-by-side: items' figures aligned into rows grouped as specs, value ratios, measured ÷
 * claimed and test conditions, each row with a direction (from lib/measure SPECS and valueRatios),
 * the best cell(s) of the row and whether all cells are equal. Pure: no framework or database.
 */
import type { CompareCell, CompareGroup, CompareResponse, CompareRow, FigureBasis, RowDirection } from '@/lib/browse/contract';
import { MEASURED_VS_CLAIMED, higherIsBetter } from '@/lib/browse/query';
import { CATEGORY_DEFS, RATIO_LABELS, ratioLabel } from '@/lib/gear/categories';
import { SKY_LABELS, type Sky } from '@/lib/field-tests/kinds';
import { isCategory, SPEC_KEYS, SPECS, type SpecKey } from '@/lib/measure';
import { imperialValue } from '@/lib/units/display';

export interface CompareFigure {
  value: number;
  unit: string;
  basis: FigureBasis;
  provenance: string | null;
}

export interface CompareConditions {
  /** Approved field test the conditions come from (`/field-tests/{id}`). */
  provenance: string;
  testedOn: string;
  ambientC: number | null;
  sky: string | null;
  place: string;
}

export interface CompareItemInput {
  item: CompareResponse['items'][number];
  /** Headline figure per spec key (measured preferred), canonical units. */
  specs: Partial<Record<string, CompareFigure>>;
  /** Stored value ratios by id, incl. `measured-vs-claimed:<key>`. */
  ratios: Record<string, CompareFigure>;
  /** Conditions of the latest approved field test behind the item's measured figures, if any. */
  conditions: CompareConditions | null;
}

/** Cells equal within floating-point noise (relative 1e-9): ratios computed in different orders still tie. */
export function sameNumber(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

function sameValue(a: number | string | null, b: number | string | null): boolean {
  if (typeof a === 'number' && typeof b === 'number') return sameNumber(a, b);
  return a === b;
}

/**
 * Which cells are best in a row: the highest (or lowest) numeric value, every tied cell included.
 * Nothing is best in a row without a direction, or with fewer than two numeric values (nothing to compare).
 */
export function bestFlags(values: readonly (number | string | null)[], direction: RowDirection): boolean[] {
  const numbers = values.filter((v): v is number => typeof v === 'number' && Number.isFinite(v));
  if (!direction || numbers.length < 2) return values.map(() => false);
  const best = direction === 'higher' ? Math.max(...numbers) : Math.min(...numbers);
  return values.map((v) => typeof v === 'number' && sameNumber(v, best));
}

/** True when every cell holds the same value (missing counts as a value of its own). */
export function allEqual(values: readonly (number | string | null)[]): boolean {
  return values.every((v) => sameValue(v, values[0] ?? null));
}

export function directionOf(better: boolean | null): RowDirection {
  return better === null ? null : better ? 'higher' : 'lower';
}

interface RowCell {
  value: number | string | null;
  unit: string;
  basis: FigureBasis | null;
  provenance: string | null;
}

function row(key: string, label: string, unit: string, direction: RowDirection, cells: RowCell[], imperial: boolean): CompareRow {
  const values = cells.map((c) => c.value);
  const best = bestFlags(values, direction);
  return {
    key,
    label,
    unit,
    direction,
    cells: cells.map((cell, i): CompareCell => {
      const out: CompareCell = { ...cell, best: best[i]! };
      if (imperial && typeof cell.value === 'number') {
        const shown = imperialValue(cell.value, cell.unit);
        if (shown) out.imperial = shown;
      }
      return out;
    }),
    allEqual: allEqual(values),
  };
}

const EMPTY: RowCell = { value: null, unit: '', basis: null, provenance: null };
const cellOf = (figure: CompareFigure | undefined): RowCell =>
  figure ? { value: figure.value, unit: figure.unit, basis: figure.basis, provenance: figure.provenance } : EMPTY;

/** Spec keys in the shared category's order (when all items share one), then the rest of SPEC_KEYS. */
function specOrder(items: readonly CompareItemInput[]): { key: SpecKey; label: string }[] {
  const categories = new Set(items.map((i) => i.item.category));
  const [only] = categories;
  const shared = categories.size === 1 && only && isCategory(only) ? CATEGORY_DEFS[only].specs : [];
  const present = new Set(items.flatMap((i) => Object.keys(i.specs)));
  const ordered: { key: SpecKey; label: string }[] = shared.filter((s) => present.has(s.key)).map((s) => ({ key: s.key, label: s.label }));
  for (const key of SPEC_KEYS) {
    if (present.has(key) && !ordered.some((o) => o.key === key)) ordered.push({ key, label: SPECS[key].label });
  }
  return ordered;
}

/** Builds the side-by-side of 2–6 items (in the order given). */
export function buildComparison(items: readonly CompareItemInput[], options: { imperial?: boolean } = {}): CompareResponse {
  const imperial = options.imperial ?? false;

  const specRows = specOrder(items).map(({ key, label }) =>
    row(key, label, SPECS[key].unit, directionOf(SPECS[key].higherIsBetter), items.map((i) => cellOf(i.specs[key])), imperial),
  );

  const ratioIds = new Set(items.flatMap((i) => Object.keys(i.ratios)));
  const valueRatioIds = Object.keys(RATIO_LABELS).filter((id) => ratioIds.has(id));
  const ratioRows = valueRatioIds.map((id) => {
    const cells = items.map((i) => cellOf(i.ratios[id]));
    const units = new Set(cells.filter((c) => c.value !== null).map((c) => c.unit));
    // Per-money ratios in different currencies cannot be ranked against each other.
    const comparable = units.size <= 1;
    return row(id, ratioLabel(id), comparable ? ([...units][0] ?? '') : '', comparable ? directionOf(higherIsBetter(id)) : null, cells, imperial);
  });

  const mvcRows = SPEC_KEYS.map((key) => `${MEASURED_VS_CLAIMED}${key}`)
    .filter((id) => ratioIds.has(id))
    .map((id) => row(id, ratioLabel(id), '', directionOf(higherIsBetter(id)), items.map((i) => cellOf(i.ratios[id])), imperial));

  const condition = (key: string, label: string, unit: string, pick: (c: CompareConditions) => number | string | null): CompareRow | null => {
    const cells = items.map((i): RowCell => {
      const value = i.conditions ? pick(i.conditions) : null;
      return value === null || value === '' ? EMPTY : { value, unit, basis: 'measured', provenance: i.conditions!.provenance };
    });
    return cells.some((c) => c.value !== null) ? row(key, label, unit, null, cells, imperial) : null;
  };
  const conditionRows = [
    condition('tested-on', 'Tested on', '', (c) => c.testedOn),
    condition('ambient-temperature', 'Ambient temperature', '°C', (c) => c.ambientC),
    condition('sky', 'Sky', '', (c) => (c.sky ? (SKY_LABELS[c.sky as Sky] ?? c.sky) : null)),
    condition('place', 'Place', '', (c) => c.place),
  ].filter((r): r is CompareRow => r !== null);

  const groups: CompareGroup[] = [
    { id: 'specs' as const, label: 'Specs', rows: specRows },
    { id: 'ratios' as const, label: 'Value ratios', rows: ratioRows },
    { id: 'measured-vs-claimed' as const, label: 'Measured ÷ claimed', rows: mvcRows },
    { id: 'test-conditions' as const, label: 'Test conditions', rows: conditionRows },
  ].filter((g) => g.rows.length > 0);

  return { items: items.map((i) => i.item), groups };
}
