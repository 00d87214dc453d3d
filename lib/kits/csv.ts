/** CSV export of a kit: one row per entry (papaparse `unparse`, formula-looking cells escaped). */
import Papa from 'papaparse';
import { minorUnitDigits, isCurrencyCode } from '@/lib/measure';
import { budgetRole, drawModes, defaultMode } from './budget';
import { entryName, pickSpec, resolveEntries } from './resolve';
import type { KitEntryInput } from './schemas';
import type { KitCatalog } from './types';

export const KIT_CSV_COLUMNS = [
  'entry',
  'source',
  'category',
  'quantity',
  'mass_g_each',
  'mass_basis',
  'price_each',
  'currency',
  'draw_w',
  'draw_mode',
  'draw_basis',
  'hours_per_day',
  'duty_cycle',
  'rated_energy_wh',
  'rated_power_w',
  'chemistry',
  'depth_of_discharge',
] as const;

function major(minor: number, currency: string): string {
  if (!isCurrencyCode(currency)) return String(minor);
  const digits = minorUnitDigits(currency);
  return (minor / 10 ** digits).toFixed(digits);
}

const num = (v: number | null | undefined) => (v == null ? '' : String(v));

export function kitCsv(entries: readonly KitEntryInput[], catalog: KitCatalog): string {
  const rows = resolveEntries(entries, catalog).map((e) => {
    const base = { entry: entryName(e), quantity: e.quantity, hours_per_day: num(e.entry.hoursPerDay), duty_cycle: num(e.entry.dutyCycle) };
    if (e.kind === 'hidden') return { ...base, source: 'unpublished' };
    if (e.kind === 'free') {
      const p = e.entry.freePrice;
      return {
        ...base,
        source: 'your entry',
        mass_g_each: num(e.entry.freeMassG),
        mass_basis: e.entry.freeMassG == null ? '' : 'typed',
        price_each: p ? major(p.amountMinor, p.currency) : '',
        currency: p?.currency ?? '',
        draw_w: num(e.entry.freeDrawW),
        draw_basis: e.entry.freeDrawW == null ? '' : 'typed',
        rated_energy_wh: num(e.entry.freeEnergyWh),
        rated_power_w: num(e.entry.freeRatedW),
      };
    }
    const { item } = e;
    const mass = pickSpec(item, 'mass');
    const modes = drawModes(item);
    const draw = budgetRole(item) === 'load' ? (modes.find((m) => m.mode === e.entry.loadMode) ?? defaultMode(modes)) : undefined;
    return {
      ...base,
      source: 'catalog',
      category: item.category,
      mass_g_each: num(mass?.value),
      mass_basis: mass?.basis ?? '',
      price_each: item.priceMinor != null && item.priceCurrency ? major(item.priceMinor, item.priceCurrency) : '',
      currency: item.priceCurrency ?? '',
      draw_w: num(draw?.watts),
      draw_mode: draw?.mode ?? '',
      draw_basis: draw?.basis ?? '',
      rated_energy_wh: num(pickSpec(item, 'ratedEnergy')?.value),
      rated_power_w: num(pickSpec(item, 'ratedPower')?.value),
      chemistry: e.entry.chemistry ?? item.chemistry ?? '',
      depth_of_discharge: num(e.entry.depthOfDischarge),
    };
  });
  return Papa.unparse({ fields: [...KIT_CSV_COLUMNS], data: rows.map((r) => KIT_CSV_COLUMNS.map((c) => (r as Record<string, unknown>)[c] ?? '')) }, { escapeFormulae: true, newline: '\r\n' });
}
