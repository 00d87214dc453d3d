/**
 * From a kit (catalog entries with their specs + free-form entries) to the input of lib/measure
 * `powerBudget`, and its result with the kit's own warnings. Pure; runs in the browser as you type.
 */
import {
  airlineBand,
  DEFAULT_CONVERSION_EFFICIENCY,
  DEFAULT_DEPTH_OF_DISCHARGE,
  formatFigure,
  MeasureError,
  powerBudget,
  type AirlineBand,
  type BudgetBattery,
  type BudgetLoad,
  type BudgetPanel,
  type Chemistry,
  type PowerBudgetInput,
  type PowerBudgetResult,
} from '@/lib/measure';
import { budgetPath, kitChargingPaths, pathText, type KitChargingPaths } from './paths';
import { entryName, gathersSolar, pickSpec, resolveEntries, storesEnergy, type ResolvedEntry } from './resolve';
import type { KitEntryInput, KitInput } from './schemas';
import type { KitCatalog, KitCatalogItem, SpecBasis } from './types';

export type BudgetRole = 'load' | 'storage' | 'panel' | 'none';

/** Where an item sits in the power budget, by its category and specs. */
export function budgetRole(item: KitCatalogItem): BudgetRole {
  if (item.category === 'solar-panel') return 'panel';
  if (item.category === 'power-bank' || item.category === 'battery-12v') return 'storage';
  return item.specs.some((s) => s.key === 'powerDraw') ? 'load' : 'none';
}

export interface DrawMode {
  mode: string;
  watts: number;
  basis: SpecBasis;
}

/** The item's powerDraw modes, each with its measured figure where there is one, else the claimed. */
export function drawModes(item: KitCatalogItem): DrawMode[] {
  const modes = [...new Set(item.specs.filter((s) => s.key === 'powerDraw').map((s) => s.mode))];
  return modes.flatMap((mode) => {
    const spec = pickSpec(item, 'powerDraw', mode);
    return spec ? [{ mode, watts: spec.value, basis: spec.basis }] : [];
  });
}

const PREFERRED_MODES = ['high', 'receive', 'running'];

/** The mode a load uses when none is chosen: high, receive or running when the item has one, else its first. */
export function defaultMode(modes: readonly DrawMode[]): DrawMode | undefined {
  for (const name of PREFERRED_MODES) {
    const found = modes.find((m) => m.mode === name);
    if (found) return found;
  }
  return modes[0];
}

export const LITHIUM: readonly Chemistry[] = ['li-ion', 'lifepo4'];

export const CHEMISTRY_LABELS: Readonly<Record<Chemistry, string>> = {
  'lead-acid': 'Lead-acid (flooded)',
  agm: 'Lead-acid (AGM)',
  lifepo4: 'Lithium iron phosphate (LiFePO4)',
  'li-ion': 'Lithium-ion',
  nimh: 'Nickel-metal hydride (NiMH)',
};

/** Where the default depth of discharge of a chemistry comes from (check-values §5). */
export function depthSource(chemistry: Chemistry): string {
  return chemistry === 'lead-acid' || chemistry === 'agm'
    ? 'about 50 % for deep-cycle lead-acid (encyclopedic and trade-press summaries; no standard)'
    : '80 %: common practice, no source';
}

export interface LoadLine {
  index: number;
  name: string;
  mode: string;
  watts: number;
  basis: SpecBasis | 'typed';
  hoursPerDay: number;
  dutyCycle: number;
  quantity: number;
  /** watts × hours × duty × quantity, Wh a day. */
  dailyWh: number;
  /** Share of the energy taken from storage that reaches the device. */
  efficiency: number;
  /** 'path': the best charging path's efficiency from its battery or bank; 'kit': the kit's one figure. */
  efficiencyFrom: 'path' | 'kit';
  /** The path used, in words (efficiencyFrom 'path'). */
  pathText: string | null;
}

export interface StorageLine {
  index: number;
  name: string;
  chemistry: Chemistry | null;
  /** Rated energy of one unit, Wh. */
  capacityWh: number;
  /** 'typed' for a free-form entry's stored energy. */
  capacityBasis: SpecBasis | 'typed';
  depthOfDischarge: number;
  /** 'yours' when typed for this kit, 'default' from the chemistry, 'cautious' when the chemistry is unknown. */
  depthFrom: 'yours' | 'default' | 'cautious';
  depthNote: string;
  quantity: number;
  usableWh: number;
  maxContinuousW: number | null;
  airline: AirlineBand | null;
}

export interface PanelLine {
  index: number;
  name: string;
  ratedW: number;
  /** 'typed' for a free-form panel's rated power. */
  basis: SpecBasis | 'typed';
  quantity: number;
}

export type KitWarningCode =
  | 'net-negative'
  | 'autonomy-under-one-day'
  | 'does-not-close'
  | 'load-exceeds-battery'
  | 'airline-approval'
  | 'airline-cargo-only'
  | 'chemistry-unknown'
  | 'hours-missing'
  | 'no-capacity'
  | 'load-exceeds-path'
  | 'no-path';

export interface KitWarning {
  code: KitWarningCode;
  message: string;
  day?: number;
}

export interface KitBudget {
  loads: LoadLine[];
  storage: StorageLine[];
  panels: PanelLine[];
  input: PowerBudgetInput;
  /** Null when the budget cannot be computed yet; `problem` then says why in plain words. */
  result: PowerBudgetResult | null;
  problem: string | null;
  warnings: KitWarning[];
  /** The kit's charging paths (lib/kits/paths.ts), whose efficiencies the loads use where known. */
  charging: KitChargingPaths;
}

type BudgetSettings = Pick<KitInput, 'tripDays' | 'peakSunHours' | 'skyShare' | 'lossFraction' | 'conversionEfficiency'>;

function loadLines(e: ResolvedEntry, warnings: KitWarning[]): LoadLine[] {
  const name = entryName(e);
  const hoursSet = typeof e.entry.hoursPerDay === 'number';
  const hoursPerDay = e.entry.hoursPerDay ?? 0;
  const duty = e.entry.dutyCycle ?? 1;
  const line = (mode: string, watts: number, basis: LoadLine['basis'], dutyCycle: number): LoadLine => ({
    index: e.index,
    name,
    mode,
    watts,
    basis,
    hoursPerDay,
    dutyCycle,
    quantity: e.quantity,
    dailyWh: watts * hoursPerDay * dutyCycle * e.quantity,
    efficiency: 1,
    efficiencyFrom: 'kit',
    pathText: null,
  });
  let lines: LoadLine[] = [];
  if (e.kind === 'free') {
    if (e.entry.freeDrawW == null || e.entry.freeDrawW === 0) return [];
    lines = [line('', e.entry.freeDrawW, 'typed', duty)];
  } else if (e.kind === 'catalog' && budgetRole(e.item) === 'load') {
    const modes = drawModes(e.item);
    const chosen = modes.find((m) => m.mode === e.entry.loadMode) ?? defaultMode(modes);
    if (!chosen) return [];
    lines = [line(chosen.mode, chosen.watts, chosen.basis, duty)];
    // A radio transmits a share of the time and listens for the rest of its on-time.
    const receive = modes.find((m) => m.mode === 'receive');
    if (chosen.mode === 'transmit' && receive && duty < 1) lines.push(line(receive.mode, receive.watts, receive.basis, 1 - duty));
  }
  if (lines.length > 0 && !hoursSet) {
    warnings.push({ code: 'hours-missing', message: `${name}: set the hours a day it runs; until then it counts as switched off.` });
  }
  return lines;
}

/** What a storage line needs of its entry: from the catalog item's specs, or typed on a free-form entry. */
interface StorageFigures {
  rated: { value: number; basis: SpecBasis | 'typed' } | null;
  itemChemistry: Chemistry | null;
  maxContinuousW: number | null;
  /** Why `rated` is missing, in words. */
  missing: string;
}

function storageFigures(e: ResolvedEntry & { kind: 'catalog' | 'free' }): StorageFigures {
  if (e.kind === 'free') {
    const wh = e.entry.freeEnergyWh;
    return { rated: wh != null ? { value: wh, basis: 'typed' } : null, itemChemistry: null, maxContinuousW: null, missing: 'type its stored energy (Wh) to count it in the budget' };
  }
  return {
    rated: pickSpec(e.item, 'ratedEnergy'),
    itemChemistry: e.item.chemistry,
    maxContinuousW: pickSpec(e.item, 'continuousPower')?.value ?? null,
    missing: 'the catalog gives no rated energy, so it is left out of the budget',
  };
}

function storageLine(e: ResolvedEntry & { kind: 'catalog' | 'free' }, warnings: KitWarning[]): StorageLine | null {
  const name = entryName(e);
  const { rated, itemChemistry, maxContinuousW, missing } = storageFigures(e);
  if (!rated || rated.value <= 0) {
    warnings.push({ code: 'no-capacity', message: `${name}: ${missing}.` });
    return null;
  }
  const chemistry = e.entry.chemistry ?? itemChemistry;
  let depthOfDischarge: number;
  let depthFrom: StorageLine['depthFrom'];
  let depthNote: string;
  if (typeof e.entry.depthOfDischarge === 'number') {
    depthOfDischarge = e.entry.depthOfDischarge;
    depthFrom = 'yours';
    depthNote = 'your figure for this kit';
  } else if (chemistry) {
    depthOfDischarge = DEFAULT_DEPTH_OF_DISCHARGE[chemistry];
    depthFrom = 'default';
    depthNote = `default for ${CHEMISTRY_LABELS[chemistry]}: ${depthSource(chemistry)}`;
  } else {
    depthOfDischarge = DEFAULT_DEPTH_OF_DISCHARGE['lead-acid'];
    depthFrom = 'cautious';
    depthNote = 'chemistry not stated: the most cautious default (50 %) until you choose one';
  }
  if (!chemistry) {
    warnings.push({ code: 'chemistry-unknown', message: `${name}: choose its chemistry; until then the budget uses only half of its capacity.` });
  }
  const airline = chemistry && LITHIUM.includes(chemistry) ? airlineBand(rated.value) : null;
  if (airline === 'approval') {
    warnings.push({
      code: 'airline-approval',
      message: `${name} is rated ${rated.value} Wh: over the 100 Wh airline limit. Flying with it needs the airline's approval, in carry-on only, at most two spares (IATA passenger lithium battery rules).`,
    });
  } else if (airline === 'cargo-only') {
    warnings.push({
      code: 'airline-cargo-only',
      message: `${name} is rated ${rated.value} Wh: over 160 Wh, so it may not travel in passenger baggage at all, only as cargo (IATA passenger lithium battery rules).`,
    });
  }
  return {
    index: e.index,
    name,
    chemistry: chemistry ?? null,
    capacityWh: rated.value,
    capacityBasis: rated.basis,
    depthOfDischarge,
    depthFrom,
    depthNote,
    quantity: e.quantity,
    usableWh: rated.value * depthOfDischarge * e.quantity,
    maxContinuousW,
    airline,
  };
}

function panelLine(e: ResolvedEntry & { kind: 'catalog' | 'free' }): PanelLine | null {
  const rated = e.kind === 'catalog' ? pickSpec(e.item, 'ratedPower') : e.entry.freeRatedW != null ? { value: e.entry.freeRatedW, basis: 'typed' as const } : null;
  if (!rated || rated.value <= 0) return null;
  return { index: e.index, name: entryName(e), ratedW: rated.value, basis: rated.basis, quantity: e.quantity };
}

/** Builds the `powerBudget` input from the kit and runs it; never throws for a kit that passed its schema. */
export function kitBudget(kit: BudgetSettings & { entries: readonly KitEntryInput[] }, catalog: KitCatalog): KitBudget {
  const warnings: KitWarning[] = [];
  const loads: LoadLine[] = [];
  const storage: StorageLine[] = [];
  const panels: PanelLine[] = [];
  for (const e of resolveEntries(kit.entries, catalog)) {
    if (e.kind === 'hidden') continue;
    loads.push(...loadLines(e, warnings));
    if (e.kind === 'free') {
      // A free-form battery or panel counts through the energy or rated power typed for it.
      if (e.entry.freeRole === 'storage') {
        const s = storageLine(e, warnings);
        if (s) storage.push(s);
      }
      if (e.entry.freeRole === 'source') {
        const p = panelLine(e);
        if (p) panels.push(p);
      }
      continue;
    }
    // An item counts in every role it has: a lantern that also serves as a power bank is a load and storage.
    if (storesEnergy(e.item)) {
      const s = storageLine(e, warnings);
      if (s) storage.push(s);
    }
    if (gathersSolar(e.item)) {
      const p = panelLine(e);
      if (p) panels.push(p);
    }
  }

  const charging = kitChargingPaths(kit, catalog);
  applyPaths(loads, charging, kit.conversionEfficiency ?? DEFAULT_CONVERSION_EFFICIENCY, warnings);

  const input: PowerBudgetInput = {
    loads: loads.map<BudgetLoad>((l) => ({
      name: `${l.name}${l.mode ? ` (${l.mode})` : ''}`,
      watts: l.watts,
      hoursPerDay: l.hoursPerDay,
      dutyCycle: l.dutyCycle,
      quantity: l.quantity,
      ...(l.efficiencyFrom === 'path' ? { efficiency: l.efficiency } : {}),
    })),
    batteries: storage.map<BudgetBattery>((s) => ({
      name: s.name,
      capacityWh: s.capacityWh,
      chemistry: s.chemistry ?? 'lead-acid',
      depthOfDischarge: s.depthOfDischarge,
      quantity: s.quantity,
      ...(s.maxContinuousW !== null ? { maxContinuousW: s.maxContinuousW } : {}),
    })),
    panels: panels.map<BudgetPanel>((p) => ({ ratedW: p.ratedW, quantity: p.quantity })),
    tripDays: kit.tripDays,
    ...(kit.peakSunHours != null ? { peakSunHours: kit.peakSunHours } : {}),
    ...(kit.skyShare != null ? { skyShare: kit.skyShare } : {}),
    ...(kit.lossFraction != null ? { lossFraction: kit.lossFraction } : {}),
    ...(kit.conversionEfficiency != null ? { conversionEfficiency: kit.conversionEfficiency } : {}),
  };

  let result: PowerBudgetResult | null = null;
  let problem: string | null = null;
  if (storage.length === 0) {
    problem = 'Add a battery or power bank to see how long the kit lasts.';
  } else if (panels.length > 0 && kit.peakSunHours == null) {
    problem = 'Type the peak sun hours of the place and season to count what the panels gather.';
  } else {
    try {
      result = powerBudget(input);
    } catch (error) {
      if (!(error instanceof MeasureError)) throw error;
      problem = error.message;
    }
  }
  const budgetWarnings: KitWarning[] = (result?.warnings ?? []).map((w) => ({ code: w.code, message: w.message, ...(w.day !== undefined ? { day: w.day } : {}) }));
  return { loads, storage, panels, input, result, problem, warnings: [...budgetWarnings, ...warnings], charging };
}

/**
 * Each load whose device has a charging path from a battery or bank uses that path's efficiency
 * (the most efficient such path) instead of the kit's one figure; warns when the draw is more than
 * the path delivers, and when a device that lists its ports has no path at all.
 */
function applyPaths(loads: LoadLine[], charging: KitChargingPaths, kitEfficiency: number, warnings: KitWarning[]): void {
  const warned = new Set<number>();
  for (const line of loads) {
    line.efficiency = kitEfficiency;
    const device = charging.devices.find((d) => d.index === line.index);
    if (!device) continue;
    const path = budgetPath(device);
    if (path && path.fromStorageEfficiency !== null) {
      line.efficiency = path.fromStorageEfficiency;
      line.efficiencyFrom = 'path';
      line.pathText = pathText(path);
      if (path.maxWatts !== null && line.watts > path.maxWatts * (1 + 1e-9)) {
        warnings.push({
          code: 'load-exceeds-path',
          message: `${line.name}${line.mode ? ` (${line.mode})` : ''} draws ${formatFigure(line.watts)} W, more than its charging path delivers (at most ${formatFigure(path.maxWatts)} W at its weakest step).`,
        });
      }
    } else if (device.listsPorts && device.paths.length === 0 && !warned.has(line.index)) {
      warned.add(line.index);
      warnings.push({
        code: 'no-path',
        message: `${line.name}: nothing in the kit can run or charge it${device.reasons.length ? ` (${device.reasons.join('; ')})` : ''}. Its use still counts at the kit's ${formatFigure(kitEfficiency * 100)} % efficiency.`,
      });
    }
  }
}

/** Energy level (Wh) below which the batteries should not go: capacity − usable. */
export function floorWh(result: PowerBudgetResult): number {
  return result.capacityWh - result.usableBatteryWh;
}
