/**
 * Feature checklists and multi-role gear (issue 9): checklists per category and their union, answers as
 * lines (has / has not / not stated, the IP rating from the water rating), the shared input schema, the
 * browse `feature.<name>=true` parameters, and the specs a second role adds. The checklists and labels
 * are our own (no outside source); IP codes follow IEC 60529 (the schema's existing rule).
 */
import { describe, expect, it } from 'vitest';
import {
  CATEGORY_FEATURES,
  checklistFor,
  checklistLines,
  FEATURE_DEFS,
  FEATURE_NAMES,
  FeatureFilterError,
  featuresAsInput,
  featuresField,
  featureText,
  parseFeatureFilters,
  statedChecklist,
} from '@/lib/gear/features';
import { alsoServesText, cleanAlsoServes, extraRoleSpecs, roleNoun, roleSpecs, rolesOf } from '@/lib/gear/roles';
import { gearInputSchema, gearPatchSchema } from '@/lib/gear/schemas';
import { CATEGORIES } from '@/lib/measure';

describe('checklists', () => {
  it('every category lists only known features, each once', () => {
    for (const c of CATEGORIES) {
      const list = CATEGORY_FEATURES[c];
      expect(new Set(list).size).toBe(list.length);
      for (const name of list) expect(FEATURE_NAMES).toContain(name);
    }
  });

  it('a light lists the issue’s features: red mode, flashing modes, lock-out, hanging hook, magnet, USB output, pass-through, IP rating', () => {
    expect(checklistFor(['light'])).toEqual(['red-mode', 'flashing-modes', 'lock-out', 'hanging-hook', 'magnet', 'usb-output', 'pass-through-charging', 'ip-rating']);
    expect(FEATURE_DEFS['hanging-hook'].detail?.label).toBe('Hook material');
  });

  it('the checklist of a lantern serving as a power bank is the union, primary first, each feature once', () => {
    const list = checklistFor(['light', 'power-bank']);
    expect(list.slice(0, 8)).toEqual(checklistFor(['light']));
    expect(list.slice(8)).toEqual(['charge-display', 'output-12v', 'wireless-charging', 'built-in-light']);
    expect(list.filter((n) => n === 'pass-through-charging')).toHaveLength(1);
  });

  it('the stated checklist leaves out the derived IP rating', () => {
    expect(statedChecklist(['light'])).not.toContain('ip-rating');
    expect(statedChecklist(['cable-adapter'])).toEqual(['inline-fuse', 'strain-relief', 'polarity-marked']);
  });
});

describe('checklist lines', () => {
  it('says has, has not and not stated, with a detail only on "has"', () => {
    const lines = checklistLines(['light'], [
      { name: 'red-mode', present: true },
      { name: 'magnet', present: false },
      { name: 'hanging-hook', present: true, detail: 'steel' },
    ], null);
    const by = Object.fromEntries(lines.map((l) => [l.name, l]));
    expect(by['red-mode']!.state).toBe('has');
    expect(by['magnet']!.state).toBe('has-not');
    expect(by['hanging-hook']).toMatchObject({ state: 'has', detail: 'steel' });
    expect(by['lock-out']!.state).toBe('not-stated');
    expect(lines).toHaveLength(8);
  });

  it('derives the IP rating from the water rating (a code is "has"; no code is "not stated", never "has not")', () => {
    expect(checklistLines(['light'], [], 'IPX4').find((l) => l.name === 'ip-rating')).toMatchObject({ state: 'has', detail: 'IPX4' });
    expect(checklistLines(['light'], [], null).find((l) => l.name === 'ip-rating')!.state).toBe('not-stated');
  });

  it('leaves out answers for features outside the checklist', () => {
    expect(checklistLines(['cable-adapter'], [{ name: 'red-mode', present: true }], null).map((l) => l.name)).not.toContain('red-mode');
  });

  it('puts answers in words for the spec history', () => {
    expect(featureText({ name: 'hanging-hook', present: true, detail: 'steel' })).toBe('has (steel)');
    expect(featureText({ name: 'magnet', present: false })).toBe('has not');
    expect(featureText(undefined)).toBeNull();
  });
});

describe('features field', () => {
  it('reads booleans, form answers and objects; null and "" mean not stated', () => {
    const out = featuresField.parse({ 'red-mode': true, magnet: 'no', 'lock-out': '', 'usb-output': null, 'hanging-hook': { present: 'yes', detail: ' steel ' } });
    // In checklist-definition order; "" and null leave lock-out and USB output unstated.
    expect(out).toEqual([
      { name: 'red-mode', present: true },
      { name: 'hanging-hook', present: true, detail: 'steel' },
      { name: 'magnet', present: false },
    ]);
  });

  it('refuses unknown feature names, naming them', () => {
    const result = featuresField.safeParse({ 'red-mode': true, 'laser-sight': true });
    expect(result.success).toBe(false);
    expect(result.error!.issues[0]!.path).toEqual(['laser-sight']);
    expect(result.error!.issues[0]!.message).toContain('laser-sight');
  });

  it('refuses other values and over-long or odd details', () => {
    expect(featuresField.safeParse({ 'red-mode': 'maybe' }).success).toBe(false);
    expect(featuresField.safeParse({ 'hanging-hook': { present: true, detail: 'x'.repeat(41) } }).success).toBe(false);
    expect(featuresField.safeParse({ 'hanging-hook': { present: true, detail: '<script>' } }).success).toBe(false);
  });

  it('round-trips through featuresAsInput', () => {
    const claims = featuresField.parse({ 'red-mode': true, 'hanging-hook': { present: true, detail: 'aluminium' } });
    expect(featuresField.parse(featuresAsInput(claims))).toEqual(claims);
  });
});

const lantern = {
  category: 'light',
  name: 'Test Lantern',
  maker: 'Glowmere',
  chemistry: 'li-ion',
  specs: { mass: { value: '400 g' }, luminousFlux: { value: '300 lm' } },
};

describe('gear input with roles and features', () => {
  it('accepts a lantern serving as a power bank with its rated energy and both checklists', () => {
    const data = gearInputSchema.parse({
      ...lantern,
      alsoServesAs: ['power-bank'],
      specs: { ...lantern.specs, ratedEnergy: { value: '18.5 Wh' } },
      features: { 'red-mode': true, 'output-12v': false },
    });
    expect(data.alsoServesAs).toEqual(['power-bank']);
    expect(data.features).toEqual([
      { name: 'red-mode', present: true },
      { name: 'output-12v', present: false },
    ]);
  });

  it('requires the rated energy once a lantern serves as a power bank (a bank requires it)', () => {
    const result = gearInputSchema.safeParse({ ...lantern, alsoServesAs: ['power-bank'] });
    expect(result.success).toBe(false);
    const issue = result.error!.issues.find((i) => i.path.join('.') === 'specs.ratedEnergy.value');
    expect(issue?.message).toMatch(/required for a light serving as power bank/);
  });

  it('allows a second role’s specs only with that role', () => {
    const panelSpec = { ...lantern, specs: { ...lantern.specs, ratedPower: { value: '10 W' } } };
    expect(gearInputSchema.safeParse(panelSpec).success).toBe(false);
    expect(gearInputSchema.safeParse({ ...panelSpec, alsoServesAs: ['solar-panel'] }).success).toBe(true);
  });

  it('refuses the primary category, repeats, "other" and unknown categories in alsoServesAs', () => {
    for (const alsoServesAs of [['light'], ['power-bank', 'power-bank'], ['other'], ['toaster'], 'power-bank']) {
      const result = gearInputSchema.safeParse({ ...lantern, specs: { ...lantern.specs, ratedEnergy: { value: '10 Wh' } }, alsoServesAs });
      expect(result.success, JSON.stringify(alsoServesAs)).toBe(false);
      expect(result.error!.issues.some((i) => i.path[0] === 'alsoServesAs')).toBe(true);
    }
  });

  it('refuses features off the checklist, a stated IP rating, and a detail where none is taken', () => {
    const off = gearInputSchema.safeParse({ ...lantern, features: { kickstand: true } });
    expect(off.error!.issues.map((i) => i.path.join('.'))).toContain('features.kickstand');
    const ip = gearInputSchema.safeParse({ ...lantern, features: { 'ip-rating': true } });
    expect(ip.error!.issues[0]!.message).toMatch(/water rating/);
    const detail = gearInputSchema.safeParse({ ...lantern, features: { 'red-mode': { present: true, detail: 'deep red' } } });
    expect(detail.error!.issues.map((i) => i.path.join('.'))).toContain('features.red-mode.detail');
  });

  it('lets a patch carry only features or roles', () => {
    expect(gearPatchSchema.safeParse({ features: { magnet: true } }).success).toBe(true);
    expect(gearPatchSchema.safeParse({ alsoServesAs: ['power-bank'] }).success).toBe(true);
  });
});

describe('browse feature filters', () => {
  it('reads feature.<name>=true and ignores other parameters', () => {
    expect(parseFeatureFilters(new URLSearchParams('category=light&feature.red-mode=true&feature.magnet=true&feature.red-mode=true'))).toEqual(['red-mode', 'magnet']);
    expect(parseFeatureFilters(new URLSearchParams('category=light'))).toEqual([]);
  });

  it('refuses unknown names and values other than true, naming each parameter', () => {
    try {
      parseFeatureFilters(new URLSearchParams('feature.laser=true&feature.magnet=yes'));
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(FeatureFilterError);
      const e = error as FeatureFilterError;
      expect(Object.keys(e.fields)).toEqual(['feature.laser', 'feature.magnet']);
      expect(e.message).toContain('feature.laser');
    }
  });
});

describe('roles', () => {
  it('puts the primary category first and keeps each spec once, labelled by its first role', () => {
    expect(rolesOf('light', ['power-bank'])).toEqual(['light', 'power-bank']);
    const specs = roleSpecs(['light', 'power-bank']);
    expect(specs.filter((s) => s.key === 'ratedEnergy')).toHaveLength(1);
    expect(specs.find((s) => s.key === 'ratedEnergy')!.role).toBe('light');
    expect(extraRoleSpecs(['light', 'power-bank']).map((s) => s.key)).toEqual(['deliveredEnergy', 'continuousPower', 'rechargePower', 'cycleRating']);
  });

  it('cleans stored lists: known ids, not the primary, not "other", no repeats', () => {
    expect(cleanAlsoServes('light', ['power-bank', 'light', 'other', 'nope', 'power-bank', 3])).toEqual(['power-bank']);
    expect(cleanAlsoServes('light', 'power-bank')).toEqual([]);
  });

  it('says what else an item serves as in words', () => {
    expect(alsoServesText([])).toBeNull();
    expect(alsoServesText(['power-bank'])).toBe('Also serves as a power bank');
    expect(alsoServesText(['power-bank', 'battery-12v', 'radio'])).toBe('Also serves as a power bank, a 12 V battery and a radio transceiver');
    expect(roleNoun('light')).toBe('a light');
  });
});

describe('form values', async () => {
  const { clean, emptyGearValues, formRoles, toFormValues } = await import('@/lib/gear/form-values');

  it('keeps the specs of every ticked role and only answers on the current checklist', () => {
    const values = {
      ...emptyGearValues('light'),
      name: 'Form Lantern',
      maker: 'Glowmere',
      alsoServesAs: ['power-bank', 'light'],
      specs: { mass: { value: '400 g', source: '' }, luminousFlux: { value: '300 lm', source: '' }, ratedEnergy: { value: '18.5 Wh', source: '' }, rechargePower: { value: '10 W', source: '' }, ratedPower: { value: '5 W', source: '' } },
      features: {
        'red-mode': { present: 'yes', detail: '' },
        magnet: { present: '', detail: '' },
        'hanging-hook': { present: 'yes', detail: 'steel' },
        'output-12v': { present: 'no', detail: 'ignored' },
        kickstand: { present: 'yes', detail: '' },
      },
    };
    expect(formRoles(values)).toEqual(['light', 'power-bank']);
    const out = clean(values, true) as { alsoServesAs: string[]; specs: Record<string, unknown>; features: Record<string, unknown> };
    expect(out.alsoServesAs).toEqual(['power-bank']);
    // rechargePower is a bank spec (kept); ratedPower belongs to panels (dropped).
    expect(Object.keys(out.specs).sort()).toEqual(['luminousFlux', 'mass', 'ratedEnergy', 'rechargePower']);
    expect(out.features).toEqual({ 'red-mode': 'yes', 'hanging-hook': { present: 'yes', detail: 'steel' }, 'output-12v': 'no' });
    const parsed = gearInputSchema.safeParse({ ...out, chemistry: 'li-ion' });
    expect(parsed.success).toBe(true);
  });

  it('unticking the role drops its specs and answers, so nothing stray is refused', () => {
    const values = { ...emptyGearValues('light'), alsoServesAs: [], features: { 'output-12v': { present: 'yes', detail: '' } }, specs: { rechargePower: { value: '10 W', source: '' } } };
    const out = clean(values, true) as { specs: Record<string, unknown>; features: Record<string, unknown> };
    expect(out.specs).toEqual({});
    expect(out.features).toEqual({});
  });

  it('prefills roles and answers from the working copy input', () => {
    const values = toFormValues({ name: 'x', maker: 'y', alsoServesAs: ['power-bank'], features: { 'red-mode': true, magnet: false, 'hanging-hook': { present: true, detail: 'steel' }, bogus: true } }, 'light');
    expect(values.alsoServesAs).toEqual(['power-bank']);
    expect(values.features).toEqual({
      'red-mode': { present: 'yes', detail: '' },
      magnet: { present: 'no', detail: '' },
      'hanging-hook': { present: 'yes', detail: 'steel' },
    });
  });
});

describe('side-by-side features group', async () => {
  const { featuresGroup } = await import('@/lib/compare/features');
  const line = (name: string, state: 'has' | 'has-not' | 'not-stated', detail: string | null = null) => ({ name, label: name, state, detail });

  it('has an also-serves row and one row per feature in words, empty where the feature is off an item’s checklist, never a best cell', () => {
    const group = featuresGroup([
      { alsoServesAs: ['power-bank'], features: [line('red-mode', 'has'), line('hanging-hook', 'has', 'steel'), line('output-12v', 'not-stated')] },
      { alsoServesAs: [], features: [line('red-mode', 'has-not'), line('hanging-hook', 'not-stated'), line('output-12v', 'has-not')] },
    ])!;
    expect(group.id).toBe('features');
    const rows = Object.fromEntries(group.rows.map((r) => [r.key, r.cells.map((c) => c.value)]));
    expect(rows['also-serves-as']).toEqual(['Power bank', 'Only its own category']);
    expect(rows['feature:red-mode']).toEqual(['Has', 'Has not']);
    expect(rows['feature:hanging-hook']).toEqual(['Has (steel)', 'Not stated']);
    expect(rows['feature:output-12v']).toEqual(['Not stated', 'Has not']);
    expect(group.rows.find((r) => r.key === 'feature:red-mode')!.label).toBe('Red light mode');
    expect(group.rows.flatMap((r) => r.cells).some((c) => c.best)).toBe(false);
  });

  it('leaves out features nobody states, and the whole group when no item has roles or a stated feature', () => {
    expect(featuresGroup([{ alsoServesAs: [], features: [line('red-mode', 'not-stated')] }, {}])).toBeNull();
    const group = featuresGroup([{ features: [line('red-mode', 'has'), line('magnet', 'not-stated')] }, { features: [line('magnet', 'not-stated')] }])!;
    expect(group.rows.map((r) => r.key)).toEqual(['feature:red-mode']);
  });
});

describe('browse feature parameters', async () => {
  const { featureKeysOutside, offeredFeatures, FEATURE_PARAM_KEYS } = await import('@/lib/browse/feature-filters');
  const { browseApiQuery, browseValuesFromSearchParams } = await import('@/components/browse/browse-params');
  const { roleNote } = await import('@/lib/gear/roles');

  it('offers the chosen category’s checklist and clears the others on a category change', () => {
    expect(offeredFeatures('light')).toEqual(CATEGORY_FEATURES.light);
    expect(offeredFeatures(null)).toEqual([]);
    expect(featureKeysOutside('light')).toContain('feature.kickstand');
    expect(featureKeysOutside('light')).not.toContain('feature.red-mode');
    expect(FEATURE_PARAM_KEYS).toContain('feature.red-mode');
  });

  it('carries feature filters from the page URL into the API query', () => {
    const values = browseValuesFromSearchParams({ category: 'light', 'feature.red-mode': 'true', 'feature.bogus': 'true' });
    const query = new URLSearchParams(browseApiQuery(values));
    expect(query.get('feature.red-mode')).toBe('true');
    expect(query.has('feature.bogus')).toBe(false);
  });

  it('says on a card that a lantern listed under banks serves as one', () => {
    expect(roleNote({ category: 'light', kindLabel: 'Lantern', alsoServesAs: ['power-bank'] }, 'power-bank')).toBe('A lantern serving as a power bank');
    expect(roleNote({ category: 'light', kindLabel: 'Lantern', alsoServesAs: ['power-bank'] }, 'light')).toBe('Also serves as a power bank');
    expect(roleNote({ category: 'light', kindLabel: null, alsoServesAs: [] }, null)).toBeNull();
  });
});
