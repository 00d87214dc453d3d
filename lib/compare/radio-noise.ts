/**
 * The side-by-side's "Radio noise" group: per S-meter range any item was checked in, a verdict row (our
 * verdict word, lib/measure radioQuietVerdict) and a worst-rise row (dB, lower is better, best marked as
 * in every other row). The noise-rise specs move here from the Specs group, so they are not shown twice.
 * Pure: no framework or database.
 */
import type { CompareCell, CompareGroup, CompareResponse, CompareRow } from '@/lib/browse/contract';
import { NOISE_RISE_SPEC, RANGE_LABELS, rangeVerdicts } from '@/lib/browse/radio-quiet';
import { S_METER_RANGES } from '@/lib/measure';
import { allEqual, bestFlags, type CompareItemInput } from './index';

const NOISE_KEYS = new Set<string>(Object.values(NOISE_RISE_SPEC));

function rowOf(key: string, label: string, unit: string, direction: CompareRow['direction'], cells: Omit<CompareCell, 'best'>[]): CompareRow {
  const values = cells.map((c) => c.value);
  const best = bestFlags(values, direction);
  return { key, label, unit, direction, cells: cells.map((c, i) => ({ ...c, best: best[i]! })), allEqual: allEqual(values) };
}

/** The Radio noise group of the given items (in column order), or null when none was checked. */
export function radioNoiseGroup(items: readonly Pick<CompareItemInput, 'specs'>[]): CompareGroup | null {
  const perItem = items.map((i) => rangeVerdicts(i.specs as Record<string, { value: number; basis: string }>));
  const rows: CompareRow[] = [];
  for (const range of S_METER_RANGES) {
    const found = perItem.map((verdicts) => verdicts.find((v) => v.range === range) ?? null);
    if (found.every((v) => v === null)) continue;
    const provenance = (i: number) => items[i]!.specs[NOISE_RISE_SPEC[range]]?.provenance ?? null;
    const empty = { value: null, unit: '', basis: null, provenance: null };
    rows.push(
      rowOf(
        `radio-noise-verdict:${range}`,
        `Verdict ${RANGE_LABELS[range]}`,
        '',
        null,
        found.map((v, i) => (v ? { value: v.verdict, unit: '', basis: 'measured', provenance: provenance(i) } : empty)),
      ),
      rowOf(
        NOISE_RISE_SPEC[range],
        `Worst noise rise ${RANGE_LABELS[range]}`,
        'dB',
        'lower',
        found.map((v, i) => (v ? { value: v.riseDb, unit: 'dB', basis: 'measured', provenance: provenance(i) } : { ...empty, unit: 'dB' })),
      ),
    );
  }
  return rows.length ? { id: 'radio-noise', label: 'Radio noise', rows } : null;
}

/** A built side-by-side with the Radio noise group placed after Specs and the noise-rise spec rows moved into it. */
export function withRadioNoise(response: CompareResponse, items: readonly Pick<CompareItemInput, 'specs'>[]): CompareResponse {
  const group = radioNoiseGroup(items);
  const groups = response.groups
    .map((g) => (g.id === 'specs' ? { ...g, rows: g.rows.filter((r) => !NOISE_KEYS.has(r.key)) } : g))
    .filter((g) => g.rows.length > 0);
  if (!group) return { ...response, groups };
  const after = groups.findIndex((g) => g.id === 'specs');
  groups.splice(after + 1, 0, group);
  return { ...response, groups };
}
