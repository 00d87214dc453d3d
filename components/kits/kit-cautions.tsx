import { Caution } from '@/components/caution';

/** The cautions shown with every power budget (brief, "Safety"; issue 8). */
export function KitCautions() {
  return (
    <section aria-labelledby="kit-cautions" className="space-y-3">
      <h2 id="kit-cautions" className="text-xl font-bold">
        Before you wire anything
      </h2>
      <Caution title="This is a planning aid, not an electrical design" level={3}>
        <p>The budget estimates energy, not safety. Local electrical codes and each maker&apos;s instructions come first; ask a licensed electrician for anything wired to a building or vehicle.</p>
      </Caution>
      <Caution title="Lithium batteries and power banks" level={3} deferNote={false}>
        <p>Do not charge lithium cells below freezing (0 °C) or above about 45 °C; let a cold battery warm up before charging. Stop using a pack that is swollen, dented, hot or smells odd, and keep it away from the tent.</p>
        <p>Airlines limit lithium batteries: over 100 Wh needs the airline&apos;s approval, and over 160 Wh may not travel in passenger baggage.</p>
      </Caution>
      <Caution title="12 V wiring" level={3} deferNote={false}>
        <p>Fit a fuse close to the battery&apos;s positive terminal, check polarity before you connect, and use cable thick enough for the current over the whole run: thin or long cable heats up and wastes energy.</p>
      </Caution>
      <Caution title="Mains charging" level={3} deferNote={false}>
        <p>Charge from mains only with the charger made for the battery, on a dry, non-flammable surface, never unattended overnight in a tent.</p>
      </Caution>
      <Caution title="Carbon monoxide" level={3} deferNote={false}>
        <p>Never run a generator, fuel heater or stove inside a tent, vestibule or closed vehicle: carbon monoxide has no smell and kills in your sleep.</p>
      </Caution>
      <Caution title="Radios" level={3}>
        <p>Transmitting on amateur radio bands needs a licence. Receiving does not.</p>
      </Caution>
    </section>
  );
}
