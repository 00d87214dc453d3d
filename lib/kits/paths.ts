/**
 * Charging paths of a kit: from its entries (catalog items with their ports, free-form entries with
 * a role and ports) to lib/measure `findChargingPaths`, and its result to what the kit page shows.
 * Pure; runs in the browser as you type.
 */
import {
  findChargingPaths,
  formatFigure,
  MeasureError,
  nominalVolts,
  PATH_SEARCH_LIMITS,
  portKindLabel,
  type ChargingPath,
  type KitPowerItem,
  type KitPowerRole,
  type Port,
} from '@/lib/measure';
import { entryName, pickSpec, resolveEntries, storesEnergy, type ResolvedEntry } from './resolve';
import { freePowerItem, type KitEntryInput } from './schemas';
import type { KitCatalog, KitCatalogItem } from './types';

/** Efficiency of a catalog adapter that states none: 0.85, common practice, no source. */
export const DEFAULT_ADAPTER_EFFICIENCY = 0.85;

/** One link of a path as the page writes it: "Bank (USB-C output)", "Car charger (12 V socket → USB-C, 87 %)". */
export interface PathNode {
  itemName: string;
  role: KitPowerRole;
  /** "12 V socket output", "solar input, 12 V socket output", "12 V socket → USB-C". */
  detail: string;
  /** Product of this item's step efficiencies; 1 when it loses nothing stated. */
  efficiency: number;
}

export interface KitPath {
  nodes: PathNode[];
  /** Product of every step's efficiency (lib/measure). */
  efficiency: number;
  /** From the last battery or bank to the device; null for panel → device. */
  fromStorageEfficiency: number | null;
  startsAt: 'source' | 'storage';
  /** The least power (W) any stated port or cable rating along the path delivers; null when none is stated. */
  maxWatts: number | null;
  cautions: string[];
}

export interface KitDevicePaths {
  /** Index of the device's entry in the kit. */
  index: number;
  name: string;
  quantity: number;
  /** False when the device lists no ports at all (nothing to check yet). */
  listsPorts: boolean;
  paths: KitPath[];
  reasons: string[];
  /** With no path: what the device takes ("genderless DC connector, 11.7–15.2 V") … */
  takes: string[];
  /** … and what the kit's batteries, banks and panels offer ("Camp battery: 12 V socket, 12.8 V"), to choose a cable or adapter. */
  offers: string[];
}

export interface KitChargingPaths {
  devices: KitDevicePaths[];
  /** True when the search reached its bounds (some paths may be missing). */
  truncated: boolean;
  /** Why no paths could be looked for at all (e.g. too many items), else null. */
  problem: string | null;
}

/** Where a catalog item sits in charging paths, by its category; null when it plays no part. */
export function catalogPowerRole(item: KitCatalogItem): KitPowerRole | null {
  if (item.category === 'solar-panel') return 'source';
  if (item.category === 'power-bank' || item.category === 'battery-12v') return 'storage';
  // With no ports and no draw, an item that also serves as a bank is only that (see catalogPowerItems).
  if (storesEnergy(item) && !(item.ports ?? []).some((p) => p.direction !== 'output') && !item.specs.some((s) => s.key === 'powerDraw')) return 'storage';
  const ports = item.ports ?? [];
  if (item.category === 'cable-adapter') return ports.length >= 2 ? (isConverter(ports) ? 'adapter' : 'cable') : null;
  return ports.length > 0 || item.specs.some((s) => s.key === 'powerDraw') ? 'device' : null;
}

/** A cable passes power through (its ends state no voltage); anything that states one converts. */
function isConverter(ports: readonly Port[]): boolean {
  return ports.some((p) => p.volts !== undefined || p.pdProfiles !== undefined || p.voltageWindow !== undefined || (p.efficiency !== undefined && p.efficiency < 1));
}

const itemId = (index: number) => `entry-${index}`;

/**
 * The entry as `findChargingPaths` items: usually one; an item that also serves as a bank or battery
 * (a lantern with a USB output) is both a device and a storage, one physical unit (`unit`) so a path
 * never runs from it back into itself.
 */
function catalogPowerItems(e: ResolvedEntry & { kind: 'catalog' }): KitPowerItem[] {
  const role = catalogPowerRole(e.item);
  const main = role ? catalogPowerItem(e, role) : null;
  if (!storesEnergy(e.item) || role === 'storage') return main ? [main] : [];
  const ports = e.item.ports ?? [];
  if (!ports.some((p) => p.direction !== 'input')) return main ? [main] : [];
  const storage: KitPowerItem = { id: `${itemId(e.index)}${STORAGE_ROLE_SUFFIX}`, unit: itemId(e.index), name: entryName(e), role: 'storage', quantity: e.quantity, ports };
  return main ? [{ ...main, unit: itemId(e.index) }, storage] : [storage];
}

/** Id suffix of the storage role of an item that also serves as a bank or battery. */
const STORAGE_ROLE_SUFFIX = ':storage';

function catalogPowerItem(e: ResolvedEntry & { kind: 'catalog' }, role: KitPowerRole): KitPowerItem | null {
  const name = entryName(e);
  const ports = e.item.ports ?? [];
  if (role === 'cable' || role === 'adapter') {
    const from = ports.find((p) => p.direction !== 'output');
    const to = ports.find((p) => p !== from && p.direction !== 'input');
    if (!from || !to) return null;
    const strip = (end: Port) => {
      // A cable's ends state only their connector and rating; an adapter's keep their voltages.
      const kept = role === 'cable' ? (['kind', 'amps', 'watts', 'label'] as const) : (['kind', 'volts', 'amps', 'watts', 'pdProfiles', 'voltageWindow', 'label'] as const);
      return Object.fromEntries(kept.filter((k) => end[k] !== undefined).map((k) => [k, end[k]])) as Omit<Port, 'direction'>;
    };
    const stated = to.efficiency ?? from.efficiency ?? pickSpec(e.item, 'conversionEfficiency')?.value;
    const efficiency = role === 'adapter' ? (stated ?? DEFAULT_ADAPTER_EFFICIENCY) : (stated ?? 1);
    return { id: itemId(e.index), name, role, quantity: e.quantity, from: strip(from), to: strip(to), efficiency };
  }
  return { id: itemId(e.index), name, role, quantity: e.quantity, ports };
}

function freeItem(e: ResolvedEntry & { kind: 'free' }): KitPowerItem | null {
  const { freeRole, freePorts, freeDrawW } = e.entry;
  // An entry from before roles existed counts as a device when it draws power.
  if (freeRole == null && !(freePorts?.length || (freeDrawW ?? 0) > 0)) return null;
  return freePowerItem(itemId(e.index), entryName(e), e.quantity, e.entry) as KitPowerItem;
}

/** The kit as `findChargingPaths` takes it; items the viewer may not read are left out. */
export function kitPowerItems(entries: readonly KitEntryInput[], catalog: KitCatalog): KitPowerItem[] {
  return resolveEntries(entries, catalog).flatMap((e) => {
    if (e.kind === 'hidden') return [];
    if (e.kind === 'catalog') return catalogPowerItems(e);
    const item = freeItem(e);
    return item ? [item] : [];
  });
}

/** "USB-C, PD 5 V 3 A / 9 V 2 A", "12 V socket, 12.8 V 10 A", "genderless DC connector, 11.7–15.2 V". */
export function portSummary(port: Port): string {
  const figures: string[] = [];
  if (port.pdProfiles) figures.push(`USB PD ${port.pdProfiles.map((p) => `${formatFigure(p.volts)} V ${formatFigure(p.amps)} A`).join(' / ')}`);
  else if (port.voltageWindow) figures.push(`${formatFigure(port.voltageWindow.minVolts)}–${formatFigure(port.voltageWindow.maxVolts)} V${port.amps !== undefined ? ` ${formatFigure(port.amps)} A` : ''}`);
  else {
    const v = nominalVolts(port);
    const parts = [v !== undefined ? `${formatFigure(v)} V` : null, port.amps !== undefined ? `${formatFigure(port.amps)} A` : null].filter(Boolean);
    if (parts.length) figures.push(parts.join(' '));
  }
  if (port.watts !== undefined) figures.push(`${formatFigure(port.watts)} W`);
  return [portKindLabel(port), ...figures].join(', ');
}

/** The most power (W) a port or cable end states it delivers; undefined when it states no limit. */
function portWatts(port: Omit<Port, 'direction'>, volts: number | undefined): number | undefined {
  const limits: number[] = [];
  if (port.watts !== undefined) limits.push(port.watts);
  if (port.pdProfiles) limits.push(Math.max(...port.pdProfiles.map((p) => p.volts * p.amps)));
  else if (port.amps !== undefined) {
    const v = port.volts ?? volts;
    if (v !== undefined) limits.push(v * port.amps);
  }
  return limits.length ? Math.min(...limits) : undefined;
}

function topVolts(port: Omit<Port, 'direction'>): number | undefined {
  if (port.pdProfiles) return Math.max(...port.pdProfiles.map((p) => p.volts));
  return nominalVolts({ ...port, direction: 'output' });
}

function describePath(path: ChargingPath, byId: ReadonlyMap<string, KitPowerItem>): KitPath {
  const nodes: PathNode[] = [];
  let volts: number | undefined;
  const limits: number[] = [];
  for (const step of path.steps) {
    const item = byId.get(step.itemId);
    const last = nodes[nodes.length - 1];
    if (step.kind === 'link') {
      nodes.push({ itemName: step.itemName, role: step.role, detail: item?.from && item.to ? `${portKindLabel(item.from)} → ${portKindLabel(item.to)}` : step.description, efficiency: step.efficiency });
      const to = item?.to;
      if (to && item) {
        if (item.role === 'adapter') volts = topVolts(to) ?? volts;
        const w = portWatts(to, volts);
        const wFrom = item.from ? portWatts(item.from, volts) : undefined;
        for (const x of [w, wFrom]) if (x !== undefined) limits.push(x);
      }
      continue;
    }
    if (step.kind === 'output') {
      const port = step.portIndex !== undefined ? item?.ports?.[step.portIndex] : undefined;
      if (port) {
        volts = topVolts(port);
        const w = portWatts(port, volts);
        if (w !== undefined) limits.push(w);
      }
      if (last && last.itemName === step.itemName && nodes.length > 0 && path.steps[path.steps.indexOf(step) - 1]?.itemId === step.itemId) {
        last.detail = `${last.detail}, ${step.description}`;
        last.efficiency *= step.efficiency;
        continue;
      }
    }
    nodes.push({ itemName: step.itemName, role: step.role, detail: step.description, efficiency: step.efficiency });
  }
  return {
    nodes,
    efficiency: path.efficiency,
    fromStorageEfficiency: path.fromStorageEfficiency,
    startsAt: path.startsAt,
    maxWatts: limits.length ? Math.min(...limits) : null,
    cautions: path.cautions,
  };
}

/** Every device's charging paths, or why it has none, in the words the kit page shows. */
export function kitChargingPaths(kit: { entries: readonly KitEntryInput[] }, catalog: KitCatalog): KitChargingPaths {
  const items = kitPowerItems(kit.entries, catalog);
  const byId = new Map(items.map((i) => [i.id, i]));
  if (items.length > PATH_SEARCH_LIMITS.items) {
    return { devices: [], truncated: false, problem: `Charging paths are looked for in kits of at most ${PATH_SEARCH_LIMITS.items} powered entries; this kit has ${items.length}.` };
  }
  let result;
  try {
    result = findChargingPaths({ items });
  } catch (error) {
    if (!(error instanceof MeasureError)) throw error;
    return { devices: [], truncated: false, problem: error.message };
  }
  const offers = items
    .filter((i) => i.role === 'storage' || i.role === 'source')
    .flatMap((i) => (i.ports ?? []).filter((p) => p.direction !== 'input').map((p) => `${i.name}: ${portSummary(p)}`));
  return {
    devices: result.devices.map((d) => ({
      index: Number(d.itemId.slice('entry-'.length)),
      name: d.itemName,
      quantity: d.quantity,
      listsPorts: (byId.get(d.itemId)?.ports?.length ?? 0) > 0,
      paths: d.paths.map((p) => describePath(p, byId)),
      reasons: d.reasons,
      takes: d.paths.length ? [] : (byId.get(d.itemId)?.ports ?? []).filter((p) => p.direction !== 'output').map(portSummary),
      offers: d.paths.length ? [] : offers,
    })),
    truncated: result.truncated,
    problem: null,
  };
}

/** The path a device's draw is budgeted on: the most efficient one from a battery or bank, else null. */
export function budgetPath(device: KitDevicePaths): KitPath | null {
  return device.paths.find((p) => p.fromStorageEfficiency !== null) ?? null;
}

/** "Battery (12 V socket output) → Car charger (12 V socket → USB-C, 87 %) → Laptop (USB-C input)". */
export function pathText(path: KitPath): string {
  return path.nodes.map((n) => `${n.itemName} (${n.detail}${n.efficiency < 1 ? `, ${formatFigure(n.efficiency * 100)} %` : ''})`).join(' → ');
}
