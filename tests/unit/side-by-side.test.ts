import { describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import type { CompareResponse, Figure, GearSummary } from '@/lib/browse/contract';
import { axisOptions, axisUnit, axisValue, defaultAxes, findAxis } from '@/lib/side-by-side/axes';
import { bestValuePlot } from '@/lib/side-by-side/frontier';
import { addToSelection, MAX_SIDE_BY_SIDE, moveInSelection, parseSelection, removeFromSelection, serializeSelection, sideBySidePath } from '@/lib/side-by-side/selection';
import { plainNumber, sideBySideCsv, sideBySideCsvRows, sideBySideView } from '@/lib/side-by-side/table-model';

describe('side-by-side selection', () => {
  it('reads distinct valid slugs, keeps the first six', () => {
    expect(parseSelection('a,b,a, c ,Bad Slug,,d-1,e,f,g,h')).toEqual(['a', 'b', 'c', 'd-1', 'e', 'f']);
    expect(parseSelection(['x', 3, 'y', null])).toEqual(['x', 'y']);
    expect(parseSelection(null)).toEqual([]);
    expect(parseSelection('-lead,trail-,ok')).toEqual(['ok']);
    expect(MAX_SIDE_BY_SIDE).toBe(6); // issue 7: "up to 6 items"
  });

  it('adds up to six, refuses duplicates and bad slugs', () => {
    expect(addToSelection(['a'], 'b')).toEqual({ ok: true, slugs: ['a', 'b'] });
    expect(addToSelection(['a', 'b'], 'a')).toEqual({ ok: false, reason: 'present', slugs: ['a', 'b'] });
    expect(addToSelection(['a', 'b', 'c', 'd', 'e', 'f'], 'g')).toMatchObject({ ok: false, reason: 'full' });
    expect(addToSelection([], '../x')).toMatchObject({ ok: false, reason: 'invalid' });
  });

  it('removes and moves; moving past an end changes nothing', () => {
    expect(removeFromSelection(['a', 'b', 'c'], 'b')).toEqual(['a', 'c']);
    expect(moveInSelection(['a', 'b', 'c'], 0, 1)).toEqual(['b', 'a', 'c']);
    expect(moveInSelection(['a', 'b', 'c'], 2, -1)).toEqual(['a', 'c', 'b']);
    expect(moveInSelection(['a', 'b', 'c'], 0, -1)).toEqual(['a', 'b', 'c']);
    expect(moveInSelection(['a', 'b', 'c'], 2, 1)).toEqual(['a', 'b', 'c']);
    expect(serializeSelection(['a', 'b'])).toBe('a,b');
    expect(sideBySidePath(['a', 'b'])).toBe('/side-by-side?items=a,b');
    expect(sideBySidePath([])).toBe('/side-by-side');
  });
});

const compare: CompareResponse = {
  items: [
    { slug: 'a', name: 'Ridge Lantern', maker: 'Glowmere', category: 'light', kind: 'lantern', path: '/gear/a', photo: null, price: null },
    { slug: 'b', name: 'Fold, "Lite"', maker: 'Northcairn', category: 'light', kind: 'lantern', path: '/gear/b', photo: null, price: null },
  ],
  groups: [
    {
      id: 'specs',
      label: 'Specs',
      rows: [
        {
          key: 'mass', label: 'Mass', unit: 'g', direction: 'lower', allEqual: false,
          cells: [
            { value: 410, unit: 'g', basis: 'claimed', provenance: null, best: false },
            { value: 185, unit: 'g', basis: 'measured', provenance: '/field-tests/1', best: true },
          ],
        },
        {
          key: 'runtime', label: 'Runtime', unit: 's', direction: 'higher', allEqual: true,
          cells: [
            { value: 18000, unit: 's', basis: 'claimed', provenance: null, best: true },
            { value: 18000, unit: 's', basis: 'claimed', provenance: null, best: true },
          ],
        },
        {
          key: 'luminousFlux', label: 'Light output', unit: 'lm', direction: 'higher', allEqual: false,
          cells: [
            { value: 10400, unit: 'lm', basis: 'claimed', provenance: null, best: true },
            { value: null, unit: 'lm', basis: null, provenance: null, best: false },
          ],
        },
      ],
    },
    {
      id: 'test-conditions',
      label: 'Test conditions',
      rows: [
        {
          key: 'temperature', label: 'Air temperature', unit: '°C', direction: null, allEqual: false,
          cells: [
            { value: 20, unit: '°C', basis: 'measured', provenance: '/field-tests/1', best: false },
            { value: 'not tested', unit: '', basis: null, provenance: null, best: false },
          ],
        },
      ],
    },
  ],
};

describe('side-by-side view and CSV', () => {
  it('shows durations in hours and keeps equal rows unless asked to hide them', () => {
    const view = sideBySideView(compare, { units: 'metric', hideEqual: false });
    const runtime = view.groups[0]!.rows.find((r) => r.key === 'runtime')!;
    expect(runtime.unit).toBe('h');
    expect(runtime.cells.map((c) => c.text)).toEqual(['5', '5']); // 18 000 s ÷ 3600 s/h = 5 h
    expect(view.hiddenEqualRows).toBe(0);
    const hidden = sideBySideView(compare, { units: 'metric', hideEqual: true });
    expect(hidden.groups[0]!.rows.map((r) => r.key)).toEqual(['mass', 'luminousFlux']);
    expect(hidden.hiddenEqualRows).toBe(1);
  });

  it('a row of per-money ratios in two currencies keeps each cell\'s unit (no shared unit to rank by)', () => {
    const mixed: CompareResponse = {
      items: compare.items,
      groups: [
        {
          id: 'ratios',
          label: 'Value ratios',
          rows: [
            {
              key: 'lm-per-money', label: 'Light output per unit of money', unit: '', direction: null, allEqual: false,
              cells: [
                { value: 6.668, unit: 'lm/USD', basis: 'claimed', provenance: null, best: false },
                { value: 12.2449, unit: 'lm/EUR', basis: 'claimed', provenance: null, best: false },
              ],
            },
          ],
        },
      ],
    };
    const view = sideBySideView(mixed, { units: 'metric', hideEqual: false });
    const row = view.groups[0]!.rows[0]!;
    expect(row.cells.map((c) => c.text)).toEqual(['6.67 lm/USD', '12.24 lm/EUR']);
    // In the CSV the cells stay numbers and the Unit column names each item's unit in column order.
    expect(sideBySideCsvRows(view)[1]).toEqual(['Value ratios', 'Light output per unit of money', 'lm/USD; lm/EUR', '6.67', '12.24', '']);
  });

  it('imperial: grams to ounces, °C to °F', () => {
    const view = sideBySideView(compare, { units: 'imperial', hideEqual: false });
    const mass = view.groups[0]!.rows[0]!;
    expect(mass.unit).toBe('oz');
    // 1 oz = 28.349523125 g (international yard and pound agreement, 1959): 410 g = 14.46 oz, 185 g = 6.53 oz.
    expect(mass.cells.map((c) => c.text)).toEqual(['14.46', '6.53']);
    const temperature = view.groups[1]!.rows[0]!;
    expect(temperature.unit).toBe('°F');
    expect(temperature.cells[0]!.text).toBe('68'); // °F = °C × 9/5 + 32 (NIST SP 811 §B.8): 20 °C = 68 °F
    expect(temperature.cells[1]!.text).toBe('not tested');
  });

  it('the CSV holds the shown rows, quoted per RFC 4180, and reads back to the same text', () => {
    const view = sideBySideView(compare, { units: 'metric', hideEqual: true });
    const rows = sideBySideCsvRows(view);
    expect(rows[0]).toEqual(['Group', 'Figure', 'Unit', 'Glowmere Ridge Lantern', 'Northcairn Fold, "Lite"', 'Best']);
    expect(rows[1]).toEqual(['Specs', 'Mass', 'g', '410', '185', 'Northcairn Fold, "Lite"']);
    // Plain machine numbers: no grouping, so 10,400 on screen is 10400 in the file (RFC 4180 needs no quotes).
    expect(rows[2]).toEqual(['Specs', 'Light output', 'lm', '10400', '', 'Glowmere Ridge Lantern']);
    expect(view.groups[0]!.rows[1]!.cells[0]!.text).toBe('10,400'); // the table keeps its grouping
    const csv = sideBySideCsv(view);
    expect(csv.split('\r\n')[2]).toBe('Specs,Light output,lm,10400,,Glowmere Ridge Lantern');
    // RFC 4180 §2.6–2.7: fields with commas or quotes are quoted, inner quotes doubled.
    expect(csv.split('\r\n')[0]).toBe('Group,Figure,Unit,Glowmere Ridge Lantern,"Northcairn Fold, ""Lite""",Best');
    const back = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data;
    expect(back).toEqual(rows);
  });
});

const fig = (value: number, unit: string): Figure => ({ value, unit, basis: 'claimed', provenance: null });
function light(slug: string, massG: number | null, lm: number | null, price: { minor: number; currency: string } | null = null): GearSummary {
  const specs: Record<string, Figure> = {};
  if (massG !== null) specs.mass = fig(massG, 'g');
  if (lm !== null) specs.luminousFlux = fig(lm, 'lm');
  return { slug, name: slug.toUpperCase(), maker: 'Glowmere', category: 'light', kind: 'lantern', path: `/gear/${slug}`, photo: null, price, specs, ratios: {}, sortValue: null, reviewed: false };
}

describe('best-value axes and frontier', () => {
  it('defaults follow issue 7: mass vs output for lights, price vs Wh for banks and batteries, mass vs rated W for panels', () => {
    expect(defaultAxes('light')).toEqual({ x: 'mass', y: 'luminousFlux' });
    expect(defaultAxes('power-bank')).toEqual({ x: 'price', y: 'ratedEnergy' });
    expect(defaultAxes('battery-12v')).toEqual({ x: 'price', y: 'ratedEnergy' });
    expect(defaultAxes('solar-panel')).toEqual({ x: 'mass', y: 'ratedPower' });
    expect(defaultAxes('radio')).toEqual({ x: 'mass', y: 'transmitPower' });
  });

  it('directions: less mass and less cost per Wh are better; supply voltage has no better end so is not offered', () => {
    expect(findAxis('light', 'mass')!.better).toBe('min');
    expect(findAxis('light', 'lm-per-g')!.better).toBe('max');
    expect(findAxis('power-bank', 'money-per-wh')).toMatchObject({ better: 'min', money: true });
    expect(findAxis('solar-panel', 'supplyVoltage')).toBeUndefined();
    expect(axisOptions('light').map((o) => o.key)).toContain('price');
    expect(axisUnit(findAxis('power-bank', 'money-per-wh')!, 'EUR', 'metric')).toBe('EUR/Wh');
    expect(axisUnit(findAxis('light', 'mass')!, null, 'imperial')).toBe('oz');
  });

  it('price is read in major units and only in the plotted currency', () => {
    const priced = light('p', 100, 100, { minor: 5999, currency: 'USD' });
    const price = findAxis('light', 'price')!;
    expect(axisValue(priced, price, 'USD', 'metric')).toBeCloseTo(59.99, 10); // USD has 2 minor digits (ISO 4217)
    expect(axisValue(priced, price, 'EUR', 'metric')).toBeNull();
  });

  it('lists the front (mass min, output max), worked by hand', () => {
    // a 100 g/300 lm, b 150 g/500 lm, c 150 g/400 lm (beaten by b), d 200 g/450 lm (beaten by b),
    // e 80 g/100 lm, f no output (left out). Front by mass: e, a, b.
    const items = [light('a', 100, 300), light('b', 150, 500), light('c', 150, 400), light('d', 200, 450), light('e', 80, 100), light('f', 90, null)];
    const plot = bestValuePlot(items, { x: findAxis('light', 'mass')!, y: findAxis('light', 'luminousFlux')! }, { currency: null, units: 'metric' });
    expect(plot.front.map((p) => p.slug)).toEqual(['e', 'a', 'b']);
    expect(plot.points.filter((p) => p.onFront).map((p) => p.slug).sort()).toEqual(['a', 'b', 'e']);
    expect(plot.missing.map((m) => m.slug)).toEqual(['f']);
  });
});

describe('plain CSV numbers', () => {
  it('drop grouping, keep the display rounding and a dot decimal', () => {
    expect(plainNumber(10400)).toBe('10400');
    expect(plainNumber(1234567.8)).toBe('1234568'); // ≥ 1000: no decimals (lib/gear/format)
    expect(plainNumber(348.66)).toBe('348.7');
    expect(plainNumber(0.8534)).toBe('0.853');
    expect(plainNumber(-2500.4)).toBe('-2500');
    expect(Number(plainNumber(14.4624))).toBe(14.46); // 410 g in oz (1 oz = 28.349 523 125 g), as on screen
  });
});
