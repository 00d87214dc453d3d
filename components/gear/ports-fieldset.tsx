'use client';

import { useFieldArray, useWatch, type Control, type UseFormRegister } from 'react-hook-form';
import { Button, Field, TextInput } from '@/components/ui/form';
import { CLAIM_SOURCE_LABELS, CLAIM_SOURCES } from '@/lib/gear/categories';
import { emptyPortRow, type GearFormValues } from '@/lib/gear/form-values';
import { formatPdProfiles, PORT_DIRECTION_LABELS, PORT_KIND_HINTS, tryParsePdProfiles } from '@/lib/gear/ports';
import { PORT_DIRECTIONS, PORT_KIND_LABELS, PORT_KINDS, type PortKind } from '@/lib/measure';

const SELECT = 'block w-full rounded-md border border-rule bg-paper px-3 py-2';

type ErrorAt = (path: string) => string[] | undefined;

/** The "Ports" section of the gear form: one row per input or output, added and removed with useFieldArray. */
export function PortsFieldset({ control, register, errorAt }: { control: Control<GearFormValues>; register: UseFormRegister<GearFormValues>; errorAt: ErrorAt }) {
  const { fields, append, remove } = useFieldArray({ control, name: 'ports' });
  return (
    <fieldset className="space-y-4" data-testid="ports-fieldset">
      <legend className="text-lg font-bold">Ports</legend>
      <p className="text-sm text-slate">
        Each socket or plug the item charges from or powers other things with, as claimed. For an output give the most it delivers; for an input what it
        needs. Figures in volts (V), amps (A) and watts (W); leave unknown ones blank. Enter a port twice when it differs as input and as output.
      </p>
      {errorAt('ports')?.length ? <p className="text-sm text-danger">{errorAt('ports')!.join(' ')}</p> : null}
      {fields.map((field, i) => (
        <PortRow key={field.id} index={i} control={control} register={register} errorAt={errorAt} onRemove={() => remove(i)} />
      ))}
      <Button type="button" variant="quiet" onClick={() => append(emptyPortRow())}>
        Add a port
      </Button>
    </fieldset>
  );
}

function PortRow({
  index: i,
  control,
  register,
  errorAt,
  onRemove,
}: {
  index: number;
  control: Control<GearFormValues>;
  register: UseFormRegister<GearFormValues>;
  errorAt: ErrorAt;
  onRemove: () => void;
}) {
  const kind = (useWatch({ control, name: `ports.${i}.kind` }) as PortKind) ?? 'usb-c';
  const direction = useWatch({ control, name: `ports.${i}.direction` }) as string;
  const pdText = (useWatch({ control, name: `ports.${i}.pdProfiles` }) as string | undefined) ?? '';
  const id = (name: string) => `port-${i}-${name}`;
  const at = (name: string) => errorAt(`ports.${i}.${name}`);
  const rowErrors = errorAt(`ports.${i}`);
  const title = `Port ${i + 1}`;
  return (
    <div role="group" aria-labelledby={id('title')} className="space-y-3 rounded-md border border-rule p-3" data-testid={`port-${i}`}>
      <h3 id={id('title')} className="text-sm font-bold">
        {title}
      </h3>
      {rowErrors?.length ? <p className="text-sm text-danger">{rowErrors.join(' ')}</p> : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id={id('kind')} label="Connector" hint={PORT_KIND_HINTS[kind]} errors={at('kind')}>
          <select id={id('kind')} className={SELECT} {...register(`ports.${i}.kind`)}>
            {PORT_KINDS.map((k) => (
              <option key={k} value={k}>
                {k === 'other' ? 'Other (name it below)' : PORT_KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </Field>
        <Field id={id('direction')} label="Direction" errors={at('direction')}>
          <select id={id('direction')} className={SELECT} {...register(`ports.${i}.direction`)}>
            {PORT_DIRECTIONS.map((d) => (
              <option key={d} value={d}>
                {PORT_DIRECTION_LABELS[d]}
              </option>
            ))}
          </select>
        </Field>
      </div>
      <div className="grid gap-3 sm:grid-cols-3">
        <Field id={id('volts')} label="Volts (V)" errors={at('volts')}>
          <TextInput id={id('volts')} inputMode="decimal" placeholder={kind.startsWith('usb') ? '5' : '12'} invalid={!!at('volts')} {...register(`ports.${i}.volts`)} />
        </Field>
        <Field id={id('amps')} label="Amps (A)" errors={at('amps')}>
          <TextInput id={id('amps')} inputMode="decimal" placeholder="2.4" invalid={!!at('amps')} {...register(`ports.${i}.amps`)} />
        </Field>
        <Field id={id('watts')} label="Watts (W)" errors={at('watts')}>
          <TextInput id={id('watts')} inputMode="decimal" placeholder="18" invalid={!!at('watts')} {...register(`ports.${i}.watts`)} />
        </Field>
      </div>
      {kind === 'usb-c' ? (
        <Field
          id={id('pd')}
          label="USB Power Delivery profiles"
          hint={`Volts and amps of each profile, separated by commas or “·”, e.g. “5 V 3 A, 9 V 3 A, 15 V 3 A, 20 V 3.25 A”. ${direction === 'output' ? 'What the port offers.' : 'What the device can use (any one is enough).'} Leave blank when none is stated.`}
          errors={at('pdProfiles') ?? firstProfileError(errorAt, i)}
        >
          <TextInput id={id('pd')} autoComplete="off" placeholder="5 V 3 A, 9 V 3 A" invalid={!!at('pdProfiles')} aria-describedby={`${id('pd')}-echo`} {...register(`ports.${i}.pdProfiles`)} />
          <PdEcho id={`${id('pd')}-echo`} text={pdText} />
        </Field>
      ) : null}
      {direction !== 'output' ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <Field
            id={id('min')}
            label="Lowest voltage it accepts (V)"
            hint={kind === 'solar-input' ? 'The solar input’s window, as printed.' : 'Optional: the supply range, e.g. 11.7 for a 13.8 V radio.'}
            errors={at('voltageWindow.minVolts') ?? at('voltageWindow')}
          >
            <TextInput id={id('min')} inputMode="decimal" invalid={!!at('voltageWindow.minVolts')} {...register(`ports.${i}.minVolts`)} />
          </Field>
          <Field id={id('max')} label="Highest voltage it accepts (V)" errors={at('voltageWindow.maxVolts')}>
            <TextInput id={id('max')} inputMode="decimal" invalid={!!at('voltageWindow.maxVolts')} {...register(`ports.${i}.maxVolts`)} />
          </Field>
        </div>
      ) : null}
      <div className="grid gap-3 sm:grid-cols-3">
        <Field id={id('label')} label={kind === 'other' ? 'Connector name (required)' : 'Label (optional)'} errors={at('label')}>
          <TextInput id={id('label')} placeholder={kind === 'other' ? '2-pin trailer plug' : 'e.g. “fast port”'} invalid={!!at('label')} {...register(`ports.${i}.label`)} />
        </Field>
        <Field id={id('efficiency')} label="Efficiency (0–1, optional)" errors={at('efficiency')}>
          <TextInput id={id('efficiency')} inputMode="decimal" placeholder="0.9" invalid={!!at('efficiency')} {...register(`ports.${i}.efficiency`)} />
        </Field>
        <Field id={id('source')} label="Source" errors={at('source')}>
          <select id={id('source')} className={SELECT} {...register(`ports.${i}.source`)}>
            <option value="">As above</option>
            {CLAIM_SOURCES.map((s) => (
              <option key={s} value={s}>
                {CLAIM_SOURCE_LABELS[s]}
              </option>
            ))}
          </select>
        </Field>
      </div>
      <Button type="button" variant="quiet" onClick={onRemove} aria-label={`Remove port ${i + 1}`}>
        Remove this port
      </Button>
    </div>
  );
}

/** The first error of a single PD profile (e.g. "USB Power Delivery profiles go up to 48 V."), prefixed with its number. */
function firstProfileError(errorAt: ErrorAt, i: number): string[] | undefined {
  for (let j = 0; j < 16; j += 1) {
    for (const part of ['volts', 'amps', '']) {
      const e = errorAt(`ports.${i}.pdProfiles.${j}${part ? `.${part}` : ''}`);
      if (e?.length) return [`Profile ${j + 1}: ${e.join(' ')}`];
    }
  }
  return undefined;
}

/** Echoes the typed profiles as read, or says what could not be read. */
function PdEcho({ id, text }: { id: string; text: string }) {
  const parsed = text.trim() ? tryParsePdProfiles(text) : null;
  return (
    <p id={id} aria-live="polite" data-testid={id} className="min-h-5 font-mono text-xs">
      {parsed === null ? null : parsed.ok ? (
        <span className="text-lichen">= {formatPdProfiles(parsed.profiles)}</span>
      ) : (
        <span className="text-amber">{parsed.message}</span>
      )}
    </p>
  );
}
