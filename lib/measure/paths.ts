import { assertRange, finiteResult, MeasureError } from './errors';
import {
  fitValidatedPorts,
  formatFigure,
  portKindLabel,
  SOLAR_LEAD_KINDS,
  validatePort,
  type Port,
  type PortFit,
  type PortKind,
} from './ports';

/**
 * Roles of kit items in charging paths: `source` (a panel), `storage` (a battery or bank),
 * `device` (a load to run or charge), `cable` (passes power through, may change the connector)
 * and `adapter` (converts: a 12 V-to-USB-C charger, a PD trigger lead).
 */
export const KIT_POWER_ROLES = ['source', 'storage', 'device', 'cable', 'adapter'] as const;
export type KitPowerRole = (typeof KIT_POWER_ROLES)[number];

/** An end of a cable or adapter; its direction is implied (`from` plugs into an output, `to` feeds an input). */
export type LinkEnd = Omit<Port, 'direction'>;

/** One item of a kit as the path finder sees it. */
export interface KitPowerItem {
  /** Unique within the kit. */
  id: string;
  name: string;
  role: KitPowerRole;
  /** Whole number ≥ 1; default 1. Paths are possible routes, not an allocation of units. */
  quantity?: number;
  /**
   * Items with the same `unit` are one physical thing in two roles (a lantern that is a device and
   * also serves as a power bank): a path never passes through it twice. Default: the item's id.
   */
  unit?: string;
  /** Ports of a source, storage or device. */
  ports?: Port[];
  /** Cable or adapter: the end that plugs into an output. */
  from?: LinkEnd;
  /** Cable or adapter: the end that feeds an input. */
  to?: LinkEnd;
  /** Cable or adapter: conversion efficiency, (0, 1]; required for an adapter, default 1 for a cable. */
  efficiency?: number;
}

export interface ChargingKit {
  items: KitPowerItem[];
}

/** One step of a path: leaving an item by a port, passing a cable or adapter, or entering an item by a port. */
export interface PathStep {
  kind: 'output' | 'link' | 'input';
  itemId: string;
  itemName: string;
  role: KitPowerRole;
  /** Index of the port in the item's `ports` (output and input steps). */
  portIndex?: number;
  /** "USB-C output", "solar input", "Car charger (12 V socket → USB-C)". */
  description: string;
  efficiency: number;
}

export interface ChargingPath {
  steps: PathStep[];
  /** Product of every step's efficiency. */
  efficiency: number;
  /**
   * Product of the steps from the last storage's output to the device: the efficiency to use for
   * this device's draw in a power budget. Null when the path has no storage (panel straight to device).
   */
  fromStorageEfficiency: number | null;
  startsAt: 'source' | 'storage';
  /** Things to check by hand along the path (plug sizes, unstated currents, cable ratings). */
  cautions: string[];
}

export interface DeviceChargingPaths {
  itemId: string;
  itemName: string;
  quantity: number;
  /** Every path found, highest efficiency first, then fewest steps. */
  paths: ChargingPath[];
  /** Why there is no path (empty when there is one). */
  reasons: string[];
}

export interface ChargingPathsResult {
  devices: DeviceChargingPaths[];
  /** True when the search stopped at its bounds; some paths may be missing. */
  truncated: boolean;
}

/** Bounds of the search (our own limits, to keep any kit's answer fast). */
export const PATH_SEARCH_LIMITS = {
  items: 100,
  portsPerItem: 16,
  /** Cables and adapters in a row between two items. */
  linksInARow: 3,
  /** Batteries and banks in one path (panel → battery → bank → device has two). */
  storagesInAPath: 2,
  /** Paths kept per device. */
  pathsPerDevice: 50,
  /** Search steps in total, shared between the starting ports… */
  searchSteps: 5_000,
  /** …with at least this many for each. */
  minStepsPerStart: 20,
} as const;

/** Paths collected per device before tails are removed and the list is cut to `pathsPerDevice`. */
const COLLECT_PER_DEVICE = PATH_SEARCH_LIMITS.pathsPerDevice * 4;
const MAX_ID = 100;
const MAX_NAME = 200;

interface Item {
  id: string;
  unit: string;
  name: string;
  role: KitPowerRole;
  quantity: number;
  ports: Port[];
  from?: Port;
  to?: Port;
  efficiency: number;
}

function text(value: unknown, what: string, max: number): string {
  if (typeof value !== 'string' || value.trim() === '' || value.length > max) {
    throw new MeasureError('out-of-range', `${what} must be non-empty text of at most ${max} characters.`);
  }
  return value.trim();
}

function validateLinkEnd(value: unknown, direction: 'input' | 'output', what: string, cable: boolean): Port {
  if (value === null || typeof value !== 'object' || Array.isArray(value)) {
    throw new MeasureError('out-of-range', `${what} must be an object with a kind.`);
  }
  const end = value as Record<string, unknown>;
  if (cable && (end.volts != null || end.pdProfiles != null || end.voltageWindow != null)) {
    throw new MeasureError(
      'out-of-range',
      `${what}: a cable passes its input through, so its ends state no voltage; record a converter as an adapter.`,
    );
  }
  return validatePort(
    {
      kind: end.kind,
      direction,
      volts: end.volts,
      amps: end.amps,
      watts: end.watts,
      pdProfiles: end.pdProfiles,
      voltageWindow: direction === 'input' ? end.voltageWindow : undefined,
      label: end.label,
      efficiency: end.efficiency,
    },
    what,
  );
}

function validateKit(kit: unknown): Item[] {
  if (kit === null || typeof kit !== 'object' || !Array.isArray((kit as ChargingKit).items)) {
    throw new MeasureError('out-of-range', 'A kit for charging paths needs a list of items.');
  }
  const raw = (kit as ChargingKit).items as unknown[];
  if (raw.length > PATH_SEARCH_LIMITS.items) {
    throw new MeasureError('out-of-range', `A kit may hold at most ${PATH_SEARCH_LIMITS.items} items for charging paths.`);
  }
  const ids = new Set<string>();
  return raw.map((value, i) => {
    if (value === null || typeof value !== 'object' || Array.isArray(value)) {
      throw new MeasureError('out-of-range', `Item ${i + 1} must be an object.`);
    }
    const v = value as Record<string, unknown>;
    const id = text(v.id, `Item ${i + 1}: id`, MAX_ID);
    if (ids.has(id)) throw new MeasureError('out-of-range', `Item ${i + 1}: the id "${id}" is used twice.`);
    ids.add(id);
    const name = text(v.name, `Item ${i + 1}: name`, MAX_NAME);
    const what = `Item ${i + 1} (${name})`;
    const unit = v.unit === undefined || v.unit === null ? id : text(v.unit, `${what}: unit`, MAX_ID);
    if (typeof v.role !== 'string' || !(KIT_POWER_ROLES as readonly string[]).includes(v.role)) {
      throw new MeasureError('out-of-range', `${what}: role must be one of ${KIT_POWER_ROLES.join(', ')}, got "${String(v.role)}".`);
    }
    const role = v.role as KitPowerRole;
    const quantity =
      v.quantity === undefined || v.quantity === null
        ? 1
        : assertRange(v.quantity as number, `${what}: quantity`, { min: 1, max: 1_000_000, integer: true });
    if (role === 'cable' || role === 'adapter') {
      const cable = role === 'cable';
      const from = validateLinkEnd(v.from, 'input', `${what}: the end that plugs into an output`, cable);
      const to = validateLinkEnd(v.to, 'output', `${what}: the end that feeds an input`, cable);
      if (!cable && to.volts === undefined && !to.pdProfiles && to.kind !== 'usb-a' && to.kind !== 'usb-c' && to.kind !== 'socket-12v') {
        throw new MeasureError('out-of-range', `${what}: an adapter must state the voltage it gives.`);
      }
      if (!cable && (v.efficiency === undefined || v.efficiency === null)) {
        throw new MeasureError('out-of-range', `${what}: an adapter needs its conversion efficiency (0 to 1).`);
      }
      const efficiency =
        v.efficiency === undefined || v.efficiency === null
          ? 1
          : assertRange(v.efficiency as number, `${what}: efficiency`, { min: 0, minExclusive: true, max: 1 });
      return { id, unit, name, role, quantity, ports: [], from, to, efficiency };
    }
    if (v.from != null || v.to != null) {
      throw new MeasureError('out-of-range', `${what}: only a cable or adapter has two ends; list this item's ports instead.`);
    }
    const portsRaw = v.ports ?? [];
    if (!Array.isArray(portsRaw) || portsRaw.length > PATH_SEARCH_LIMITS.portsPerItem) {
      throw new MeasureError('out-of-range', `${what}: ports must be a list of at most ${PATH_SEARCH_LIMITS.portsPerItem}.`);
    }
    const ports = portsRaw.map((p, j) => validatePort(p, `${what}: port ${j + 1}`));
    return { id, unit, name, role, quantity, ports, efficiency: 1 };
  });
}

const isOutput = (p: Port) => p.direction !== 'input';
const isInput = (p: Port) => p.direction !== 'output';

function portDescription(port: Port, side: 'input' | 'output'): string {
  // "solar input", not "solar input input".
  return port.kind === 'solar-input' || port.kind === 'mains-input' ? portKindLabel(port) : `${portKindLabel(port)} ${side}`;
}

function inputStep(target: Item, port: Port, index: number): PathStep {
  return {
    kind: 'input',
    itemId: target.id,
    itemName: target.name,
    role: target.role,
    portIndex: index,
    description: portDescription(port, 'input'),
    efficiency: port.efficiency ?? 1,
  };
}

/** What is on offer at the end of a partial path: a port (possibly reshaped by cables) and its name for messages. */
interface Offer {
  port: Port;
  name: string;
}

/** Power after a plain cable: the upstream voltage and profiles, current limited by the cable's rating. */
function throughCable(up: Port, cable: Item): Port {
  const from = cable.from as Port;
  const to = cable.to as Port;
  const ratings = [from.amps, to.amps].filter((a): a is number => a !== undefined);
  const cableAmps = ratings.length ? Math.min(...ratings) : undefined;
  const capAmps = (a: number | undefined) => (cableAmps === undefined ? a : a === undefined ? cableAmps : Math.min(a, cableAmps));
  const ratingWatts = [from.watts, to.watts, up.watts].filter((w): w is number => w !== undefined);
  const out: Port = { kind: to.kind, direction: 'output' };
  if (to.label) out.label = to.label;
  if (up.pdProfiles && to.kind === 'usb-c') {
    // A plain cable carries the negotiated profiles, each limited to the cable's current rating.
    out.pdProfiles = up.pdProfiles.map((p) => ({ volts: p.volts, amps: capAmps(p.amps) as number }));
  } else if (up.pdProfiles) {
    // Without USB-C at the far end nothing negotiates a higher voltage: the default 5 V remains.
    const fiveVolt = up.pdProfiles.find((p) => Math.abs(p.volts - 5) <= 1e-3);
    out.volts = 5;
    const amps = capAmps(fiveVolt?.amps ?? up.amps);
    if (amps !== undefined) out.amps = amps;
  } else {
    const volts = up.volts ?? (up.kind === 'usb-a' || up.kind === 'usb-c' ? 5 : up.kind === 'socket-12v' ? 12 : undefined);
    if (volts !== undefined) out.volts = volts;
    const amps = capAmps(up.amps);
    if (amps !== undefined) out.amps = amps;
  }
  if (ratingWatts.length) out.watts = Math.min(...ratingWatts);
  return out;
}

function cableJoins(up: Port, cable: Item): boolean {
  const from = cable.from as Port;
  if (up.kind !== from.kind) return false;
  return up.kind !== 'other' || (up.label ?? '').toLowerCase() === (from.label ?? '').toLowerCase();
}

function linkDescription(link: Item): string {
  return `${link.name} (${portKindLabel(link.from as Port)} → ${portKindLabel(link.to as Port)})`;
}

const KEY_SEPARATOR = '\u0001';
function stepsKey(steps: readonly PathStep[]): string {
  return steps.map((s) => `${s.kind}${KEY_SEPARATOR}${s.itemId}${KEY_SEPARATOR}${s.portIndex ?? ''}`).join(KEY_SEPARATOR.repeat(2));
}

function joinOr(parts: string[]): string {
  if (parts.length <= 1) return parts.join('');
  return `${parts.slice(0, -1).join(', ')} or ${parts[parts.length - 1]}`;
}

/**
 * Every way the kit's panels and stored energy can reach each device: panel → storage →
 * port → cable/adapter → device (storage may feed storage), or storage → device, or panel →
 * device. A path never visits an item twice and uses a cable or adapter at most once; at most
 * three cables or adapters in a row. A path from a storage that is the tail of a path from a
 * panel is not listed separately. When a device has no path, `reasons` says why in plain words.
 *
 * Throws `MeasureError` for a malformed kit (see `KitPowerItem`).
 */
export function findChargingPaths(kit: ChargingKit): ChargingPathsResult {
  const items = validateKit(kit);
  const devices = items.filter((i) => i.role === 'device');
  if (devices.length === 0) return { devices: [], truncated: false };
  const links = items.filter((i) => i.role === 'cable' || i.role === 'adapter');
  // Inputs of devices and storages by connector kind: an offer only meets inputs it could plug into.
  interface Target {
    item: Item;
    port: Port;
    index: number;
  }
  const inputsByKind = new Map<PortKind, Target[]>();
  for (const item of items) {
    if (item.role !== 'device' && item.role !== 'storage') continue;
    item.ports.forEach((port, index) => {
      if (!isInput(port)) return;
      const list = inputsByKind.get(port.kind) ?? [];
      list.push({ item, port, index });
      inputsByKind.set(port.kind, list);
    });
  }
  const candidates = (kind: PortKind): Target[] => {
    const same = kind === 'solar-input' ? [] : (inputsByKind.get(kind) ?? []);
    return SOLAR_LEAD_KINDS.includes(kind) ? [...same, ...(inputsByKind.get('solar-input') ?? [])] : same;
  };
  // Devices before storages, so the short paths are found before the search goes deeper.
  for (const list of inputsByKind.values()) list.sort((a, b) => Number(a.item.role === 'storage') - Number(b.item.role === 'storage'));
  const found = new Map<string, ChargingPath[]>(devices.map((d) => [d.id, []]));
  /**
   * Per device, why offers whose connector did join still did not fit: one sentence per problem,
   * item drawn from (and its output port) and device input, so the same misfit reached through
   * another cable is not repeated.
   */
  const electricalReasons = new Map<string, Map<string, string>>(devices.map((d) => [d.id, new Map()]));
  /** Per device, the batteries, banks and panels whose power reached one of its inputs with a connector that joins. */
  const reachedFrom = new Map<string, Set<string>>(devices.map((d) => [d.id, new Set()]));
  /** Panels whose power reaches a battery or bank input that it fits (they count through that storage). */
  const feedsStorage = new Set<string>();
  let budget = 0;
  let truncated = false;

  // Fits are cached by what an offer is (its figures), not by the route that produced it, with the
  // names left as placeholders and filled in only where a sentence is used. Many routes give the
  // same offer, so the search costs map look-ups rather than re-checks.
  const OUT = '\u0002output\u0002';
  const IN = '\u0002input\u0002';
  const name = (sentence: string, outName: string, inName: string) => sentence.split(OUT).join(outName).split(IN).join(inName);
  const signatures = new WeakMap<Port, string>();
  const fitCache = new Map<string, WeakMap<Port, PortFit>>();
  const fit = (offer: Offer, input: Port): PortFit => {
    let sig = signatures.get(offer.port);
    if (sig === undefined) signatures.set(offer.port, (sig = JSON.stringify(offer.port)));
    let row = fitCache.get(sig);
    if (!row) fitCache.set(sig, (row = new WeakMap()));
    let f = row.get(input);
    if (!f) row.set(input, (f = fitValidatedPorts(offer.port, input, { output: OUT, input: IN })));
    return f;
  };
  const cableCache = new WeakMap<Port, Map<string, Port>>();
  const throughCableMemo = (up: Port, cable: Item): Port => {
    let row = cableCache.get(up);
    if (!row) cableCache.set(up, (row = new Map()));
    let p = row.get(cable.id);
    if (!p) row.set(cable.id, (p = throughCable(up, cable)));
    return p;
  };

  // Keeps at most COLLECT_PER_DEVICE paths per device; when full, a better path replaces the worst,
  // so a search cut short still shows the most efficient routes it saw.
  const worstIndex = new Map<string, number>();
  const wanted = (deviceId: string, efficiency: number): boolean => {
    const list = found.get(deviceId) as ChargingPath[];
    if (list.length < COLLECT_PER_DEVICE) return true;
    truncated = true;
    return efficiency > (list[worstIndex.get(deviceId) as number] as ChargingPath).efficiency;
  };
  const emit = (deviceId: string, steps: PathStep[], cautions: string[]) => {
    const list = found.get(deviceId) as ChargingPath[];
    let lastStorageOut = -1;
    steps.forEach((s, i) => {
      if (s.kind === 'output' && s.role === 'storage') lastStorageOut = i;
    });
    const path: ChargingPath = {
      steps,
      efficiency: finiteResult(
        steps.reduce((acc, s) => acc * s.efficiency, 1),
        'Path efficiency',
      ),
      fromStorageEfficiency: lastStorageOut < 0 ? null : steps.slice(lastStorageOut).reduce((acc, s) => acc * s.efficiency, 1),
      startsAt: steps[0]?.role === 'source' ? 'source' : 'storage',
      cautions: [...new Set(cautions)],
    };
    if (list.length < COLLECT_PER_DEVICE) list.push(path);
    else list[worstIndex.get(deviceId) as number] = path;
    if (list.length === COLLECT_PER_DEVICE) {
      let worst = 0;
      list.forEach((p, i) => {
        if (p.efficiency < (list[worst] as ChargingPath).efficiency) worst = i;
      });
      worstIndex.set(deviceId, worst);
    }
  };

  const explore = (
    offer: Offer,
    steps: PathStep[],
    visited: Set<string>,
    usedLinks: Set<string>,
    linksInARow: number,
    cautions: string[],
    storages: number,
    /** Product of the efficiencies of `steps`. */
    efficiency: number,
  ) => {
    if (--budget < 0) {
      truncated = true;
      return;
    }
    for (const { item: target, port, index } of candidates(offer.port.kind)) {
      if (visited.has(target.unit)) continue;
      const f = fit(offer, port);
      if (target.role === 'device') {
        if (f.problem !== 'connector') for (const s of steps) if (s.kind === 'output') (reachedFrom.get(target.id) as Set<string>).add(s.itemId);
        if (!f.fits) {
          const reasons = electricalReasons.get(target.id) as Map<string, string>;
          const drawnFrom = steps.findLast((s) => s.kind === 'output');
          const key = `${f.problem}${KEY_SEPARATOR}${drawnFrom?.itemId}${KEY_SEPARATOR}${drawnFrom?.portIndex}${KEY_SEPARATOR}${index}`;
          if (f.problem !== 'connector' && !reasons.has(key) && reasons.size < MAX_REASONS) reasons.set(key, f.reasons.map((r) => name(r, offer.name, target.name)).join('; '));
        } else if (wanted(target.id, efficiency * (port.efficiency ?? 1))) {
          emit(target.id, [...steps, inputStep(target, port, index)], [...cautions, ...f.cautions.map((c) => name(c, offer.name, target.name))]);
        }
        continue;
      }
      if (f.fits && steps[0]?.role === 'source') feedsStorage.add(steps[0].itemId);
      if (!f.fits || storages >= PATH_SEARCH_LIMITS.storagesInAPath) continue;
      const nextVisited = new Set(visited).add(target.unit);
      target.ports.forEach((outPort, outIndex) => {
        // The same port may be used in and out: paths are routes for energy over time, not at one moment.
        if (!isOutput(outPort)) return;
        explore(
          { port: outPort, name: target.name },
          [
            ...steps,
            inputStep(target, port, index),
            {
              kind: 'output',
              itemId: target.id,
              itemName: target.name,
              role: target.role,
              portIndex: outIndex,
              description: portDescription(outPort, 'output'),
              efficiency: outPort.efficiency ?? 1,
            },
          ],
          nextVisited,
          usedLinks,
          0,
          [...cautions, ...f.cautions.map((c) => name(c, offer.name, target.name))],
          storages + 1,
          efficiency * (port.efficiency ?? 1) * (outPort.efficiency ?? 1),
        );
      });
    }
    if (linksInARow >= PATH_SEARCH_LIMITS.linksInARow) return;
    for (const link of links) {
      if (usedLinks.has(link.id)) continue;
      let next: Port;
      let linkCautions: string[] = [];
      if (link.role === 'cable') {
        if (!cableJoins(offer.port, link)) continue;
        next = throughCableMemo(offer.port, link);
      } else {
        const f = fit(offer, link.from as Port);
        if (!f.fits) continue;
        linkCautions = f.cautions.map((c) => name(c, offer.name, link.name));
        next = link.to as Port;
      }
      // A cable's output is the upstream's power ("Bank through A-to-C cable"); an adapter's is its own.
      explore(
        { port: next, name: link.role === 'cable' ? `${offer.name} through ${link.name}` : link.name },
        [
          ...steps,
          {
            kind: 'link',
            itemId: link.id,
            itemName: link.name,
            role: link.role,
            description: linkDescription(link),
            efficiency: link.efficiency,
          },
        ],
        visited,
        new Set(usedLinks).add(link.id),
        linksInARow + 1,
        [...cautions, ...linkCautions],
        storages,
        efficiency * link.efficiency,
      );
    }
  };

  const starts = items.filter((i) => i.role === 'source' || i.role === 'storage');
  // Each starting port gets its share of the search, so one long chain cannot starve the others.
  const startPorts = starts.reduce((n, s) => n + s.ports.filter(isOutput).length, 0);
  const share = Math.max(PATH_SEARCH_LIMITS.minStepsPerStart, Math.floor(PATH_SEARCH_LIMITS.searchSteps / Math.max(1, startPorts)));
  for (const start of starts) {
    start.ports.forEach((port, index) => {
      if (!isOutput(port)) return;
      budget = share;
      explore(
        { port, name: start.name },
        [
          {
            kind: 'output',
            itemId: start.id,
            itemName: start.name,
            role: start.role,
            portIndex: index,
            description: portDescription(port, 'output'),
            efficiency: port.efficiency ?? 1,
          },
        ],
        new Set([start.unit]),
        new Set(),
        0,
        [],
        start.role === 'storage' ? 1 : 0,
        port.efficiency ?? 1,
      );
    });
  }


  const result: DeviceChargingPaths[] = devices.map((device) => {
    const all = found.get(device.id) as ChargingPath[];
    // A storage-first path that is the tail of a panel-first one (storage → device inside
    // panel → storage → device) is not listed: the panel-first path already shows it.
    const keys = all.map((p) => stepsKey(p.steps));
    const tails = new Set<string>();
    for (const p of all) {
      if (p.startsAt !== 'source') continue;
      p.steps.forEach((s, i) => {
        if (i > 0 && s.kind === 'output') tails.add(stepsKey(p.steps.slice(i)));
      });
    }
    const paths = all
      .filter((_, k) => !tails.has(keys[k] as string))
      .sort((a, b) => b.efficiency - a.efficiency || a.steps.length - b.steps.length);
    if (paths.length > PATH_SEARCH_LIMITS.pathsPerDevice) truncated = true;
    const kept = paths.slice(0, PATH_SEARCH_LIMITS.pathsPerDevice);
    return {
      itemId: device.id,
      itemName: device.name,
      quantity: device.quantity,
      paths: kept,
      reasons: kept.length
        ? []
        : reasonsForNoPath(device, starts, {
            electrical: [...(electricalReasons.get(device.id) as Map<string, string>).values()],
            reachedFrom: reachedFrom.get(device.id) as Set<string>,
            feedsStorage,
          }),
    };
  });

  return { devices: result, truncated };
}

/** Reasons kept per device (our own limit: enough for every distinct problem of a real kit). */
const MAX_REASONS = 8;

/**
 * Every distinct reason a device has no path: each misfit of voltage, current or USB PD profile
 * where a connector did join, then each battery, bank or panel whose outputs no cable or adapter
 * in the kit joins to the device's inputs (a panel that charges a battery or bank is left to it).
 */
function reasonsForNoPath(
  device: Item,
  starts: Item[],
  found: { electrical: string[]; reachedFrom: ReadonlySet<string>; feedsStorage: ReadonlySet<string> },
): string[] {
  const inputs = device.ports.filter(isInput);
  if (inputs.length === 0) return [`${device.name} lists no power input; add its charging or supply port`];
  // A device that also serves as a bank cannot charge from itself.
  const others = starts.filter((s) => s.unit !== device.unit);
  if (others.length === 0) return ['the kit has no battery, bank or panel to draw from'];
  const withOutputs = others.filter((s) => s.ports.some(isOutput));
  if (withOutputs.length === 0) return ['no battery, bank or panel in the kit lists an output port'];
  if (inputs.every((p) => p.kind === 'mains-input')) {
    return [`${device.name} charges only from mains; the kit has no mains outlet`];
  }
  const theirs = joinOr([...new Set(inputs.map((p) => portKindLabel(p)))]);
  const unjoined = withOutputs
    .filter((s) => !found.reachedFrom.has(s.id) && !(s.role === 'source' && found.feedsStorage.has(s.id)))
    .map((s) => {
      const outputs = s.ports.filter(isOutput);
      const ours = joinOr([...new Set(outputs.map((p) => portKindLabel(p)))]);
      // A plain cable would do when one output's voltage suits one input once the plugs match;
      // else the voltage is the problem and only a converting adapter would help.
      if (outputs.some((o) => inputs.some((i) => cableWouldDo(o, i)))) {
        return `no cable or adapter in the kit joins ${s.name}'s ${ours} to ${device.name}'s ${theirs}`;
      }
      return `${s.name}'s ${ours} ${outputs.length > 1 ? 'give' : 'gives'} ${joinOr([...new Set(outputs.map(voltsText))])}; ${device.name} needs ${joinOr(inputs.map(needText))}: that takes an adapter that converts the voltage, not just a cable`;
    });
  return [...found.electrical, ...unjoined].slice(0, MAX_REASONS);
}

/** Whether the output's voltage and current would suit the input if a cable matched the plugs. */
function cableWouldDo(output: Port, input: Port): boolean {
  if (input.kind === 'mains-input' || input.kind === 'solar-input') return true;
  const asIfJoined: Port = { ...output, kind: input.kind };
  if (input.label !== undefined) asIfJoined.label = input.label;
  else delete asIfJoined.label;
  // USB PD profiles travel only over USB-C; on another plug the output keeps its plain voltage.
  if (asIfJoined.pdProfiles && input.kind !== 'usb-c') {
    delete asIfJoined.pdProfiles;
    asIfJoined.volts = output.volts ?? 5;
  }
  const f = fitValidatedPorts(asIfJoined, input);
  return f.fits || f.problem === 'current';
}

/** "5 V", "5/9/20 V (USB PD)", "an unstated voltage". */
function voltsText(port: Port): string {
  if (port.pdProfiles?.length) return `${[...new Set(port.pdProfiles.map((p) => formatFigure(p.volts)))].join('/')} V (USB PD)`;
  const v = port.volts ?? (port.kind === 'usb-a' || port.kind === 'usb-c' ? 5 : port.kind === 'socket-12v' ? 12 : undefined);
  return v === undefined ? 'an unstated voltage' : `${formatFigure(v)} V`;
}

/** "11.7–15.2 V at its genderless DC connector", "20 V at 2.25 A over USB-C". */
function needText(port: Port): string {
  if (port.pdProfiles?.length) return `${port.pdProfiles.map((p) => `${formatFigure(p.volts)} V at ${formatFigure(p.amps)} A`).join(' or ')} over USB-C`;
  const at = `at its ${portKindLabel(port)}`;
  if (port.voltageWindow) return `${formatFigure(port.voltageWindow.minVolts)}–${formatFigure(port.voltageWindow.maxVolts)} V ${at}`;
  const v = port.volts ?? (port.kind === 'usb-a' || port.kind === 'usb-c' ? 5 : port.kind === 'socket-12v' ? 12 : undefined);
  return v === undefined ? `power ${at}` : `${formatFigure(v)} V ${at}`;
}
