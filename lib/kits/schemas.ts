/**
 * One zod schema per input, shared by the kit form (react-hook-form + zodResolver), the browser's
 * saved guest kit, and the API route handlers. Objects are strict: unknown keys (ownerId, id,
 * shareToken …) are refused with a field error, never stored.
 */
import { z } from 'zod';
import {
  CHEMISTRIES,
  findChargingPaths,
  isCurrencyCode,
  MeasureError,
  PD_MAX_AMPS,
  PD_MAX_VOLTS,
  PORT_DIRECTIONS,
  PORT_KINDS,
  validatePort,
  type Port,
} from '@/lib/measure';
import { SKIES } from './sky';

export const MAX_TRIP_DAYS = 3650;
export const MAX_ENTRIES = 200;
export const MAX_QUANTITY = 999;

const finite = (what: string) => z.number({ error: `${what} must be a number.` }).refine(Number.isFinite, `${what} must be a finite number.`);

/** A number or null ("not set, use the default"). */
const optionalNumber = (schema: z.ZodNumber | z.ZodType<number>) => schema.nullable().optional();

const hours = finite('Hours per day').min(0, 'Hours per day cannot be negative.').max(24, 'A day has at most 24 hours.');
const duty = finite('Duty cycle')
  .gt(0, 'Duty cycle must be more than 0 (use 0 hours to switch a load off).')
  .max(1, 'Duty cycle is a share of the on-time: at most 1 (100 %).');
const depth = finite('Depth of discharge')
  .gt(0, 'Depth of discharge must be more than 0: a battery you may not use at all stores nothing for the trip.')
  .max(1, 'Depth of discharge is a share of the capacity: at most 1 (100 %).');

export const priceSchema = z.strictObject({
  amountMinor: z.number({ error: 'Price must be a number.' }).int('Price is in whole minor units (cents).').min(0, 'Price cannot be negative.').max(1e11, 'Price is too large.'),
  currency: z.string().refine((code): boolean => isCurrencyCode(code), 'Use a three-letter ISO 4217 currency code such as USD or EUR.'),
});

const MAX_PORT_FIGURE = 1e6;
export const MAX_FREE_PORTS = 16;
/** Largest free-form figures accepted: far above any camp kit, low enough to catch a slipped decimal point. */
export const MAX_FREE_ENERGY_WH = 100_000;
export const MAX_FREE_RATED_W = 100_000;
const portFigure = (what: string) => finite(what).gt(0, `${what} must be more than 0 (leave it empty when not stated).`).max(MAX_PORT_FIGURE, `${what} is too large.`);

/**
 * A port of a free-form entry: lib/measure `Port`. The cross-field rules (PD profiles only on USB-C,
 * a voltage window only on an input, a label for "other") are lib/measure `validatePort`'s.
 */
export const portSchema = z
  .strictObject({
    kind: z.enum(PORT_KINDS, { error: `Connector must be one of ${PORT_KINDS.join(', ')}.` }),
    direction: z.enum(PORT_DIRECTIONS, { error: `Direction must be one of ${PORT_DIRECTIONS.join(', ')}.` }),
    volts: optionalNumber(portFigure('Volts')),
    amps: optionalNumber(portFigure('Amps')),
    watts: optionalNumber(portFigure('Watts')),
    pdProfiles: z
      .array(
        z.strictObject({
          volts: finite('Profile volts').gt(0, 'Profile volts must be more than 0.').max(PD_MAX_VOLTS, `USB Power Delivery goes up to ${PD_MAX_VOLTS} V.`),
          amps: finite('Profile amps').gt(0, 'Profile amps must be more than 0.').max(PD_MAX_AMPS, `USB Power Delivery goes up to ${PD_MAX_AMPS} A.`),
        }),
      )
      .min(1, 'List at least one Power Delivery profile, or leave them out.')
      .max(16, 'At most 16 Power Delivery profiles.')
      .nullable()
      .optional(),
    voltageWindow: z
      .strictObject({ minVolts: portFigure('Lowest accepted voltage'), maxVolts: portFigure('Highest accepted voltage') })
      .nullable()
      .optional(),
    label: z.string().trim().max(100, 'Use at most 100 characters for a connector label.').nullable().optional(),
    efficiency: optionalNumber(finite('Efficiency').gt(0, 'Efficiency must be more than 0.').max(1, 'Efficiency is at most 1 (100 %).')),
  })
  .superRefine((port, ctx) => {
    try {
      validatePort(port, 'This port');
    } catch (error) {
      if (!(error instanceof MeasureError)) throw error;
      ctx.addIssue({ code: 'custom', message: error.message });
    }
  });

/** What a free-form entry is in charging paths (lib/measure KIT_POWER_ROLES). */
export const FREE_ROLES = ['device', 'storage', 'source', 'cable', 'adapter'] as const;
export type FreeRole = (typeof FREE_ROLES)[number];

export type KitPort = z.output<typeof portSchema>;

/** The charging-path item of a free-form entry; used by lib/kits/paths.ts and to check an entry on the way in. */
export function freePowerItem(
  id: string,
  name: string,
  quantity: number,
  entry: { freeRole?: FreeRole | null; freePorts?: KitPort[] | null; freeEfficiency?: number | null },
) {
  const role = entry.freeRole ?? 'device';
  const ports = (entry.freePorts ?? []).map(cleanPort);
  if (role === 'cable' || role === 'adapter') {
    const [from, to] = ports;
    return { id, name, role, quantity, from, to, ...(entry.freeEfficiency != null ? { efficiency: entry.freeEfficiency } : {}) };
  }
  return { id, name, role, quantity, ports };
}

/** A port without its null fields (lib/measure takes absent, not null). */
export function cleanPort(port: KitPort) {
  return Object.fromEntries(Object.entries(port).filter(([, v]) => v !== null && v !== undefined && v !== '')) as unknown as Port;
}

export const kitEntrySchema = z
  .strictObject({
    /** A catalog item id, or null for a free-form entry. */
    gearItemId: z.string().min(1).max(100).nullable().optional(),
    quantity: z
      .number({ error: 'Quantity must be a number.' })
      .int('Quantity must be a whole number.')
      .min(1, 'Quantity must be at least 1.')
      .max(MAX_QUANTITY, `Quantity must be at most ${MAX_QUANTITY}.`),
    freeName: z.string().trim().max(120, 'Use at most 120 characters.').nullable().optional(),
    freeMassG: optionalNumber(finite('Mass').min(0, 'Mass cannot be negative.').max(1e7, 'Mass is too large.')),
    freePrice: priceSchema.nullable().optional(),
    freeDrawW: optionalNumber(finite('Draw').min(0, 'Draw cannot be negative.').max(1e5, 'Draw is too large for a camp kit (over 100 kW).')),
    loadMode: z.string().max(40).nullable().optional(),
    hoursPerDay: optionalNumber(hours),
    dutyCycle: optionalNumber(duty),
    chemistry: z.enum(CHEMISTRIES, { error: `Chemistry must be one of ${CHEMISTRIES.join(', ')}.` }).nullable().optional(),
    depthOfDischarge: optionalNumber(depth),
    /** Free-form entries: what the thing is in charging paths (null = a device when it has ports or a draw). */
    freeRole: z
      .enum(FREE_ROLES, { error: `Role must be one of ${FREE_ROLES.join(', ')}.` })
      .nullable()
      .optional()
      .meta({ description: 'Free-form entries: what it is in charging paths. Unset: a device when it has ports or a draw.' }),
    /**
     * Free-form entries: the ports. A cable or adapter has exactly two: first the end that plugs into an
     * output (direction "input"), then the end that feeds an input (direction "output").
     */
    freePorts: z
      .array(portSchema)
      .max(MAX_FREE_PORTS, `List at most ${MAX_FREE_PORTS} ports.`)
      .nullable()
      .optional()
      .meta({
        description:
          'Free-form entries: ports (figures in V, A, W). A cable or adapter has exactly two: first the end that plugs into an output (direction "input"), then the end that feeds an input (direction "output"); a cable’s ends state no voltage.',
      }),
    /** Free-form adapter (or lossy cable): conversion efficiency, (0, 1]. */
    freeEfficiency: optionalNumber(finite('Efficiency').gt(0, 'Efficiency must be more than 0.').max(1, 'Efficiency is at most 1 (100 %).')),
    /** Free-form battery or power bank (role storage): rated energy of one unit, Wh, as on its label. */
    freeEnergyWh: optionalNumber(
      finite('Stored energy')
        .gt(0, 'Stored energy must be more than 0 Wh (leave it empty when not known).')
        .max(MAX_FREE_ENERGY_WH, `Stored energy is too large for a camp kit (over ${MAX_FREE_ENERGY_WH / 1000} kWh).`),
    ).meta({ description: 'Free-form battery or power bank (freeRole "storage"): rated energy of one unit, Wh. Counted in the budget as a catalog item’s rated energy is.' }),
    /** Free-form solar panel (role source): rated power of one unit in full sun, W. */
    freeRatedW: optionalNumber(
      finite('Rated power')
        .gt(0, 'Rated power must be more than 0 W (leave it empty when not known).')
        .max(MAX_FREE_RATED_W, `Rated power is too large for a camp kit (over ${MAX_FREE_RATED_W / 1000} kW).`),
    ).meta({ description: 'Free-form solar panel (freeRole "source"): rated power of one unit in full sun, W. Counted in the budget as a catalog panel’s rated power is.' }),
  })
  .superRefine((entry, ctx) => {
    const hasItem = typeof entry.gearItemId === 'string';
    const hasName = typeof entry.freeName === 'string' && entry.freeName.length > 0;
    if (!hasItem && !hasName) ctx.addIssue({ code: 'custom', path: ['freeName'], message: 'Give the entry a name, or pick an item from the catalog.' });
    if (hasItem && (hasName || entry.freeMassG != null || entry.freePrice != null || entry.freeDrawW != null)) {
      ctx.addIssue({ code: 'custom', path: ['gearItemId'], message: 'A catalog entry takes its name, mass, price and draw from the catalog.' });
    }
    if (hasItem && (entry.freeEnergyWh != null || entry.freeRatedW != null)) {
      ctx.addIssue({ code: 'custom', path: ['gearItemId'], message: 'A catalog entry takes its rated energy and rated power from the catalog.' });
    }
    if (hasItem && (entry.freeRole != null || entry.freePorts != null || entry.freeEfficiency != null)) {
      ctx.addIssue({ code: 'custom', path: ['gearItemId'], message: 'A catalog entry takes its ports from the catalog.' });
      return;
    }
    if (!hasItem && entry.freeEnergyWh != null && entry.freeRole !== 'storage') {
      ctx.addIssue({ code: 'custom', path: ['freeEnergyWh'], message: 'Only a battery or power bank stores energy: choose that role, or leave the stored energy empty.' });
    }
    if (!hasItem && entry.freeRatedW != null && entry.freeRole !== 'source') {
      ctx.addIssue({ code: 'custom', path: ['freeRatedW'], message: 'Only a solar panel has a rated power here: choose that role, or leave the rated power empty.' });
    }
    const link = entry.freeRole === 'cable' || entry.freeRole === 'adapter';
    const ports = entry.freePorts ?? [];
    if (link) {
      if (ports.length !== 2 || ports[0]?.direction !== 'input' || ports[1]?.direction !== 'output') {
        ctx.addIssue({ code: 'custom', path: ['freePorts'], message: 'A cable or adapter has two ends: the one that plugs into an output, then the one that feeds a device.' });
        return;
      }
    } else if (entry.freeEfficiency != null) {
      ctx.addIssue({ code: 'custom', path: ['freeEfficiency'], message: 'Only a cable or adapter has an efficiency of its own; give a port its efficiency instead.' });
      return;
    }
    if (entry.freeRole == null && entry.freePorts == null) return;
    // The path finder's own checks (a cable states no voltage, an adapter states its efficiency and output voltage).
    try {
      findChargingPaths({ items: [freePowerItem('entry', entry.freeName || 'This entry', entry.quantity, entry)] });
    } catch (error) {
      if (!(error instanceof MeasureError)) throw error;
      const message = error.message.replace(/^Item 1 \([^)]*\): /, '');
      ctx.addIssue({ code: 'custom', path: [/efficiency/i.test(message) && link ? 'freeEfficiency' : 'freePorts'], message });
    }
  });

const kitFields = {
  name: z.string({ error: 'Give the kit a name.' }).trim().min(1, 'Give the kit a name.').max(120, 'Use at most 120 characters.'),
  purpose: z.string().trim().max(1000, 'Use at most 1000 characters.'),
  tripDays: z
    .number({ error: 'Trip length must be a number of days.' })
    .int('Trip length is a whole number of days.')
    .min(1, 'A trip lasts at least 1 day.')
    .max(MAX_TRIP_DAYS, `Trip length must be at most ${MAX_TRIP_DAYS} days (ten years).`),
  peakSunHours: optionalNumber(finite('Peak sun hours').min(0, 'Peak sun hours cannot be negative.').max(24, 'Peak sun hours are at most 24 a day.')),
  sky: z.enum(SKIES).nullable().optional(),
  skyShare: optionalNumber(finite('Sky share').min(0, 'Sky share cannot be negative.').max(1, 'Sky share is at most 1 (a clear sky).')),
  lossFraction: optionalNumber(finite('System losses').min(0, 'System losses cannot be negative.').lt(1, 'System losses must be under 1 (100 %).')),
  conversionEfficiency: optionalNumber(
    finite('Conversion efficiency').gt(0, 'Conversion efficiency must be more than 0.').max(1, 'Conversion efficiency is at most 1 (100 %).'),
  ),
  entries: z.array(kitEntrySchema).max(MAX_ENTRIES, `A kit holds at most ${MAX_ENTRIES} entries.`),
};

/** A whole kit: create (POST), the form, and the guest kit in localStorage. */
export const kitInputSchema = z.strictObject({ ...kitFields, purpose: kitFields.purpose.default('') });

/** PATCH: any subset of the fields; `entries`, when given, replaces the list. */
export const kitPatchSchema = z.strictObject({
  name: kitFields.name.optional(),
  purpose: kitFields.purpose.optional(),
  tripDays: kitFields.tripDays.optional(),
  peakSunHours: kitFields.peakSunHours,
  sky: kitFields.sky,
  skyShare: kitFields.skyShare,
  lossFraction: kitFields.lossFraction,
  conversionEfficiency: kitFields.conversionEfficiency,
  entries: kitFields.entries.optional(),
});

export type KitEntryInput = z.output<typeof kitEntrySchema>;
export type KitInput = z.output<typeof kitInputSchema>;
export type KitFormValues = z.input<typeof kitInputSchema>;
export type KitPatch = z.output<typeof kitPatchSchema>;

/** A new, empty kit for the form. */
export function emptyKit(): KitInput {
  return { name: 'My camp kit', purpose: '', tripDays: 3, peakSunHours: null, sky: null, skyShare: null, lossFraction: null, conversionEfficiency: null, entries: [] };
}
