import { Caution } from '@/components/caution';
import type { KitChargingPaths, KitDevicePaths, KitPath, PathNode } from '@/lib/kits';
import type { KitPowerRole } from '@/lib/measure';
import { fmt, fmtPercent } from './format';

const ROLE_WORDS: Readonly<Record<KitPowerRole, string>> = {
  source: 'panel',
  storage: 'battery or bank',
  device: 'device',
  cable: 'cable',
  adapter: 'adapter',
};

/** How many paths show before "more ways"; the rest are one click away. */
const SHOWN_PATHS = 2;

function Node({ node }: { node: PathNode }) {
  return (
    <span className="inline-block rounded-md border border-rule bg-paper px-2 py-1 align-middle">
      <span className="block font-semibold leading-tight">{node.itemName}</span>
      <span className="block text-xs text-slate">
        {ROLE_WORDS[node.role]} · {node.detail}
        {node.efficiency < 1 ? ` · keeps ${fmtPercent(node.efficiency)}` : ''}
      </span>
    </span>
  );
}

function PathChain({ path, number }: { path: KitPath; number: number }) {
  return (
    <li className="space-y-1" data-testid="charging-path">
      <p className="text-sm">
        <span className="font-semibold">Way {number}:</span> {fmtPercent(path.efficiency)} of the energy arrives
        {path.fromStorageEfficiency !== null && path.startsAt === 'source' ? ` (${fmtPercent(path.fromStorageEfficiency)} from the battery onward)` : ''}
        {path.maxWatts !== null ? `; it delivers up to ${fmt(path.maxWatts, 1)} W` : ''}.
      </p>
      <ol className="flex flex-wrap items-center gap-x-1 gap-y-2 text-sm" aria-label={`Way ${number}, step by step`}>
        {path.nodes.map((n, i) => (
          <li key={i} className="flex items-center gap-1">
            {i > 0 ? (
              <span aria-hidden="true" className="text-slate">
                →
              </span>
            ) : null}
            <Node node={n} />
          </li>
        ))}
      </ol>
      {path.cautions.length > 0 ? (
        <div className="text-xs text-slate">
          <p className="font-semibold">Worth checking by hand:</p>
          <ul className="list-disc pl-5">
            {path.cautions.map((c) => (
              <li key={c}>{c.charAt(0).toUpperCase() + c.slice(1)}.</li>
            ))}
          </ul>
        </div>
      ) : null}
    </li>
  );
}

function DevicePaths({ device }: { device: KitDevicePaths }) {
  const title = `${device.quantity > 1 ? `${device.quantity} × ` : ''}${device.name}`;
  return (
    <li className="rounded-lg border border-rule bg-card p-4" data-testid="device-paths" data-device={device.name}>
      <h3 className="font-bold">{title}</h3>
      {device.paths.length > 0 ? (
        <>
          <p className="mt-1 text-sm font-semibold text-lichen-dark" data-testid="device-path-status">
            ✓ Can run or charge from this kit{device.paths.length === 1 ? '.' : ` in ${device.paths.length} ways (the most efficient first).`}
          </p>
          <ol className="mt-3 space-y-4">
            {device.paths.slice(0, SHOWN_PATHS).map((p, i) => (
              <PathChain key={i} path={p} number={i + 1} />
            ))}
          </ol>
          {device.paths.length > SHOWN_PATHS ? (
            <details className="mt-3">
              <summary className="cursor-pointer text-sm font-semibold">
                {device.paths.length - SHOWN_PATHS} more {device.paths.length - SHOWN_PATHS === 1 ? 'way' : 'ways'}
              </summary>
              <ol className="mt-3 space-y-4" start={SHOWN_PATHS + 1}>
                {device.paths.slice(SHOWN_PATHS).map((p, i) => (
                  <PathChain key={i} path={p} number={i + 1 + SHOWN_PATHS} />
                ))}
              </ol>
            </details>
          ) : null}
        </>
      ) : !device.listsPorts ? (
        <p className="mt-1 text-sm text-slate" data-testid="device-path-status">
          No ports listed yet, so nothing can be checked. List its connectors (with volts and amps) to see how it charges.
        </p>
      ) : (
        <>
          <p className="mt-1 text-sm font-semibold text-danger" data-testid="device-path-status">
            ✗ No way to run or charge it from this kit.
          </p>
          <p className="mt-2 text-sm">Why:</p>
          <ul className="list-disc space-y-1 pl-5 text-sm" data-testid="device-path-reasons">
            {device.reasons.map((r) => (
              <li key={r}>{r.charAt(0).toUpperCase() + r.slice(1)}.</li>
            ))}
          </ul>
          {device.takes.length > 0 || device.offers.length > 0 ? (
            <dl className="mt-2 grid gap-x-3 gap-y-1 text-sm sm:grid-cols-[max-content_1fr]" data-testid="device-path-compare">
              <dt className="font-semibold">It takes</dt>
              <dd>{device.takes.length ? device.takes.join('; ') : 'no input listed'}</dd>
              <dt className="font-semibold">The kit offers</dt>
              <dd>
                {device.offers.length ? (
                  <ul>
                    {device.offers.map((o) => (
                      <li key={o}>{o}</li>
                    ))}
                  </ul>
                ) : (
                  'nothing to draw from yet (no battery, bank or panel with an output)'
                )}
              </dd>
            </dl>
          ) : null}
          <p className="mt-2 text-xs text-slate">
            To fix it, follow the reasons: where only the plugs differ, a lead that joins them is enough (fused close to the battery for 12 V); where
            the voltage differs, it takes an adapter that converts it (for example a 12 V socket to USB-C charger for a laptop); or add a battery or
            bank with the right port.
          </p>
        </>
      )}
    </li>
  );
}

/** For every powered device of the kit: each way it can be run or charged, or plainly why there is none. */
export function ChargingPathsPanel({ charging }: { charging: KitChargingPaths }) {
  return (
    <section aria-labelledby="charging-paths-heading" className="space-y-4" data-testid="charging-paths">
      <h2 id="charging-paths-heading" className="text-xl font-bold">
        Charging paths
      </h2>
      <p className="text-sm">
        A charging path is the chain that carries energy from a panel, battery or power bank to a device: each socket, cable and adapter on the way
        must fit the next. Converters lose some energy as heat, so the percentage says how much of it arrives. Devices are matched by the ports you
        list: the connector, its volts and amps, and for USB-C the Power Delivery profiles (such as 20 V at 3 A).
      </p>
      <div aria-live="polite">
        {charging.problem ? <p className="rounded-md border border-rule bg-card px-4 py-3 text-sm">{charging.problem}</p> : null}
        {!charging.problem && charging.devices.length === 0 ? (
          <p className="text-sm text-slate" data-testid="charging-paths-empty">
            No powered devices yet. Add a device (a radio, a lamp, a laptop) with its ports to see how the kit can run it.
          </p>
        ) : null}
        {charging.devices.length > 0 ? (
          <ul className="space-y-3">
            {charging.devices.map((d) => (
              <DevicePaths key={d.index} device={d} />
            ))}
          </ul>
        ) : null}
        {charging.truncated ? <p className="mt-2 text-xs text-slate">The search stopped at its limits; some less efficient ways may be missing.</p> : null}
      </div>
      <Caution title="A path is a plan, not a wiring diagram" level={3} deferNote={false}>
        <p>
          A path says the plugs and figures match, not that a connection is safe. Fit a fuse close to the battery&apos;s positive terminal, check
          polarity before you connect anything (DC barrel plugs differ), and use cable thick enough for the current over its whole length. The
          makers&apos; instructions and local electrical codes come first; ask a licensed electrician for anything wired into a vehicle or building.
        </p>
      </Caution>
    </section>
  );
}
