'use client';

import { useState } from 'react';
import { useController, type Control, type FieldErrors } from 'react-hook-form';
import { Button, Field, TextInput } from '@/components/ui/form';
import { FREE_ROLES, MAX_FREE_PORTS, type FreeRole, type KitFormValues, type KitInput, type KitPort } from '@/lib/kits';
import { PORT_DIRECTIONS, PORT_KIND_LABELS, PORT_KINDS, type PortDirection, type PortKind } from '@/lib/measure';

const ROLE_LABELS: Readonly<Record<FreeRole, string>> = {
  device: 'Device (uses power: radio, laptop, lamp)',
  storage: 'Battery or power bank (stores power)',
  source: 'Solar panel (makes power)',
  cable: 'Cable (joins two connectors)',
  adapter: 'Adapter or charger (changes the voltage)',
};

const DIRECTION_LABELS: Readonly<Record<PortDirection, string>> = { input: 'Input (takes power)', output: 'Output (gives power)', both: 'Both ways' };

const isLink = (role: FreeRole | null | undefined) => role === 'cable' || role === 'adapter';

/** A port as the form's text boxes hold it. */
interface PortText {
  kind: PortKind;
  direction: PortDirection;
  volts: string;
  amps: string;
  watts: string;
  pd: string;
  label: string;
}

const toText = (p: Partial<KitPort>): PortText => ({
  kind: (p.kind ?? 'usb-c') as PortKind,
  direction: (p.direction ?? 'input') as PortDirection,
  volts: p.volts != null ? String(p.volts) : '',
  amps: p.amps != null ? String(p.amps) : '',
  watts: p.watts != null ? String(p.watts) : '',
  pd: (p.pdProfiles ?? []).map((x) => `${x.volts} V ${x.amps} A`).join(', '),
  label: p.label ?? '',
});

const PD_PROFILE = /^\s*(\d+(?:\.\d+)?)\s*V\s*(?:at|@|x|×)?\s*(\d+(?:\.\d+)?)\s*A\s*$/i;

/** "5 V 3 A, 20 V 2.25 A" → profiles; null when a part cannot be read. */
export function parsePdProfiles(text: string): { volts: number; amps: number }[] | null {
  const parts = text.split(/[,;]/).filter((s) => s.trim() !== '');
  const out: { volts: number; amps: number }[] = [];
  for (const part of parts) {
    const m = PD_PROFILE.exec(part);
    if (!m) return null;
    out.push({ volts: Number(m[1]), amps: Number(m[2]) });
  }
  return out;
}

const num = (s: string) => (s.trim() === '' ? null : Number(s));

function fromText(t: PortText, cable: boolean): KitPort {
  const port: KitPort = { kind: t.kind, direction: t.direction };
  if (!cable) {
    if (num(t.volts) !== null) port.volts = num(t.volts);
  }
  if (num(t.amps) !== null) port.amps = num(t.amps);
  if (num(t.watts) !== null) port.watts = num(t.watts);
  if (!cable && t.kind === 'usb-c' && t.pd.trim() !== '') port.pdProfiles = parsePdProfiles(t.pd) ?? [{ volts: Number.NaN, amps: Number.NaN }];
  if (t.label.trim() !== '') port.label = t.label.trim();
  return port;
}

/** Every message under an entry's error object (ports nest them by index and field). */
function messages(error: unknown, out: string[] = []): string[] {
  if (!error || typeof error !== 'object') return out;
  const e = error as Record<string, unknown>;
  if (typeof e.message === 'string' && e.message) out.push(e.message);
  for (const [k, v] of Object.entries(e)) if (k !== 'ref' && k !== 'message' && k !== 'type') messages(v, out);
  return [...new Set(out)];
}

function PortRow({ id, value, onChange, fixedDirection, cable, legend, onRemove }: { id: string; value: PortText; onChange: (t: PortText) => void; fixedDirection?: PortDirection; cable: boolean; legend: string; onRemove?: () => void }) {
  const set = (patch: Partial<PortText>) => onChange({ ...value, ...patch });
  const pdOk = value.pd.trim() === '' || parsePdProfiles(value.pd) !== null;
  return (
    <fieldset className="rounded-md border border-rule p-3" data-testid="port-row">
      <legend className="px-1 text-sm font-semibold">{legend}</legend>
      <div className="grid gap-2 sm:grid-cols-3">
        <Field id={`${id}.kind`} label="Connector">
          <select id={`${id}.kind`} className="block w-full rounded-md border border-rule bg-paper px-2 py-2" value={value.kind} onChange={(e) => set({ kind: e.target.value as PortKind })}>
            {PORT_KINDS.map((k) => (
              <option key={k} value={k}>
                {PORT_KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </Field>
        {fixedDirection ? null : (
          <Field id={`${id}.direction`} label="Direction">
            <select id={`${id}.direction`} className="block w-full rounded-md border border-rule bg-paper px-2 py-2" value={value.direction} onChange={(e) => set({ direction: e.target.value as PortDirection })}>
              {PORT_DIRECTIONS.map((d) => (
                <option key={d} value={d}>
                  {DIRECTION_LABELS[d]}
                </option>
              ))}
            </select>
          </Field>
        )}
        {cable ? null : (
          <Field id={`${id}.volts`} label="Volts (V)" hint="Empty: USB 5 V, 12 V socket 12 V.">
            <TextInput id={`${id}.volts`} type="number" step="any" min="0" inputMode="decimal" value={value.volts} onChange={(e) => set({ volts: e.target.value })} />
          </Field>
        )}
        <Field id={`${id}.amps`} label={cable ? 'Rated amps (A)' : 'Amps (A)'}>
          <TextInput id={`${id}.amps`} type="number" step="any" min="0" inputMode="decimal" value={value.amps} onChange={(e) => set({ amps: e.target.value })} />
        </Field>
        <Field id={`${id}.watts`} label="Watts (W)">
          <TextInput id={`${id}.watts`} type="number" step="any" min="0" inputMode="decimal" value={value.watts} onChange={(e) => set({ watts: e.target.value })} />
        </Field>
        {!cable && value.kind === 'usb-c' ? (
          <div className="sm:col-span-3">
            <Field
              id={`${id}.pd`}
              label="USB Power Delivery profiles (optional)"
              hint="What it offers (output) or can use (input), e.g. 5 V 3 A, 9 V 3 A, 20 V 3 A. A laptop lists the one it needs, e.g. 20 V 2.25 A."
              errors={pdOk ? undefined : ['Write each profile as volts and amps, e.g. 20 V 2.25 A, separated by commas.']}
            >
              <TextInput id={`${id}.pd`} value={value.pd} onChange={(e) => set({ pd: e.target.value })} invalid={!pdOk} />
            </Field>
          </div>
        ) : null}
        {value.kind === 'other' ? (
          <Field id={`${id}.label`} label="Connector name" hint="Two “other” connectors join when their names match.">
            <TextInput id={`${id}.label`} value={value.label} onChange={(e) => set({ label: e.target.value })} />
          </Field>
        ) : null}
      </div>
      {onRemove ? (
        <Button type="button" variant="quiet" className="mt-2" onClick={onRemove}>
          Remove this port
        </Button>
      ) : null}
    </fieldset>
  );
}

type Form = { control: Control<KitFormValues, unknown, KitInput>; errors: FieldErrors<KitFormValues> };

/** A free-form entry's part in charging paths: its role and its ports (or, for a cable or adapter, its two ends). */
/** A decimal box whose text the parent keeps (so a role change can clear it) and whose number goes to the form. */
function DecimalField({ id, label, hint, errors, text, max, onText }: { id: string; label: string; hint: string; errors: string[]; text: string; max?: string; onText: (text: string) => void }) {
  return (
    <Field id={id} label={label} hint={hint} errors={errors.length ? errors : undefined}>
      <TextInput id={id} type="number" step="any" min="0" max={max} inputMode="decimal" value={text} invalid={errors.length > 0} onChange={(e) => onText(e.target.value)} />
    </Field>
  );
}

export function FreePowerFields({ index, form }: { index: number; form: Form }) {
  const role = useController({ control: form.control, name: `entries.${index}.freeRole` });
  const ports = useController({ control: form.control, name: `entries.${index}.freePorts` });
  const efficiency = useController({ control: form.control, name: `entries.${index}.freeEfficiency` });
  const energy = useController({ control: form.control, name: `entries.${index}.freeEnergyWh` });
  const ratedW = useController({ control: form.control, name: `entries.${index}.freeRatedW` });
  const [energyText, setEnergyText] = useState(energy.field.value != null ? String(energy.field.value) : '');
  const [ratedText, setRatedText] = useState(ratedW.field.value != null ? String(ratedW.field.value) : '');
  const entryErrors = form.errors.entries?.[index] as Record<string, unknown> | undefined;
  const energyErrors = messages(entryErrors?.freeEnergyWh);
  const ratedErrors = messages(entryErrors?.freeRatedW);
  const current = (role.field.value ?? null) as FreeRole | null;
  const [rows, setRows] = useState<PortText[]>(() => ((ports.field.value ?? []) as KitPort[]).map(toText));
  const [effText, setEffText] = useState(efficiency.field.value != null ? String(efficiency.field.value) : '');
  const link = isLink(current);
  const id = `entries.${index}`;
  const errors = messages((form.errors.entries?.[index] as Record<string, unknown> | undefined)?.freePorts);
  const effErrors = messages((form.errors.entries?.[index] as Record<string, unknown> | undefined)?.freeEfficiency);

  const push = (next: PortText[], asLink = link, isCable = current === 'cable') => {
    setRows(next);
    ports.field.onChange(next.length === 0 && !asLink ? null : next.map((t) => fromText(t, asLink && isCable)));
  };

  const changeRole = (value: string) => {
    const next = value === '' ? null : (value as FreeRole);
    role.field.onChange(next);
    // Stored energy belongs to a battery or bank, rated power to a panel: drop the one the new role does not have.
    if (next !== 'storage') {
      setEnergyText('');
      energy.field.onChange(null);
    }
    if (next !== 'source') {
      setRatedText('');
      ratedW.field.onChange(null);
    }
    if (isLink(next)) {
      const ends = rows.length === 2 && isLink(current) ? rows : [toText({ kind: 'socket-12v', direction: 'input' }), toText({ kind: 'usb-c', direction: 'output' })];
      push(ends.map((t, i) => ({ ...t, direction: i === 0 ? 'input' : 'output' })), true, next === 'cable');
    } else {
      if (isLink(current)) push([], false);
      setEffText('');
      efficiency.field.onChange(null);
    }
  };

  return (
    <div className="space-y-3 sm:col-span-4" data-testid="free-power">
      <Field id={`${id}.freeRole`} label="What is it, for charging paths?" hint="Choose a role and list its connectors to see how the kit can charge or run it.">
        <select id={`${id}.freeRole`} className="block w-full rounded-md border border-rule bg-paper px-3 py-2" value={current ?? ''} onChange={(e) => changeRole(e.target.value)}>
          <option value="">Not chosen (a device if it has a draw)</option>
          {FREE_ROLES.map((r) => (
            <option key={r} value={r}>
              {ROLE_LABELS[r]}
            </option>
          ))}
        </select>
      </Field>
      {link ? (
        <>
          <PortRow id={`${id}.freePorts.0`} legend="End that plugs into a power output" value={rows[0] ?? toText({ direction: 'input' })} fixedDirection="input" cable={current === 'cable'} onChange={(t) => push([t, rows[1] ?? toText({ direction: 'output' })])} />
          <PortRow id={`${id}.freePorts.1`} legend="End that feeds a device or battery" value={rows[1] ?? toText({ direction: 'output' })} fixedDirection="output" cable={current === 'cable'} onChange={(t) => push([rows[0] ?? toText({ direction: 'input' }), t])} />
          <DecimalField
            id={`${id}.freeEfficiency`}
            label={current === 'adapter' ? 'Efficiency (0–1)' : 'Efficiency (0–1, optional)'}
            hint={current === 'adapter' ? 'Share of the power that comes out, from the maker; 0.85 to 0.9 is common for 12 V USB chargers (common practice, no source).' : 'Empty = 1: a short cable loses little.'}
            errors={effErrors}
            text={effText}
            max="1"
            onText={(text) => {
              setEffText(text);
              efficiency.field.onChange(num(text));
            }}
          />
        </>
      ) : current ? (
        <>
          {current === 'storage' ? (
            <DecimalField
              id={`${id}.freeEnergyWh`}
              label="Stored energy each (Wh)"
              hint="As on its label (Wh, or mAh × V ÷ 1000). Counts in the power budget; empty = left out of it."
              errors={energyErrors}
              text={energyText}
              onText={(text) => {
                setEnergyText(text);
                energy.field.onChange(num(text));
              }}
            />
          ) : null}
          {current === 'source' ? (
            <DecimalField
              id={`${id}.freeRatedW`}
              label="Rated power each (W)"
              hint="In full sun, as on its label. Counts in the power budget with the kit’s peak sun hours; empty = left out of it."
              errors={ratedErrors}
              text={ratedText}
              onText={(text) => {
                setRatedText(text);
                ratedW.field.onChange(num(text));
              }}
            />
          ) : null}
          {rows.map((r, j) => (
            <PortRow
              key={j}
              id={`${id}.freePorts.${j}`}
              legend={`Port ${j + 1}`}
              value={r}
              cable={false}
              onChange={(t) => push(rows.map((x, k) => (k === j ? t : x)))}
              onRemove={() => push(rows.filter((_, k) => k !== j))}
            />
          ))}
          {rows.length < MAX_FREE_PORTS ? (
            <Button type="button" variant="quiet" onClick={() => push([...rows, toText({ kind: 'usb-c', direction: current === 'device' ? 'input' : 'output' })])}>
              Add a port
            </Button>
          ) : null}
        </>
      ) : null}
      {errors.length ? (
        <p className="text-sm text-danger" data-testid={`${id}.freePorts-error`}>
          {errors.join(' ')}
        </p>
      ) : null}
    </div>
  );
}
