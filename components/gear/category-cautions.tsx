import { Caution } from '@/components/caution';
import type { CautionKey } from '@/lib/gear/categories';

/** Plain-words safety cautions per category (brief: Safety). Sources: Battery University BU-410 for the lithium charging range. */
const CAUTIONS: Record<CautionKey, { title: string; lines: string[] }> = {
  lithium: {
    title: 'Lithium cells',
    lines: [
      'Do not charge lithium cells below freezing (0 °C); let a cold pack warm up first.',
      'Stop using a pack that is swollen, dented, leaking, hot or smells odd, and keep it away from anything that burns.',
      'Airlines limit lithium batteries by their rated watt-hours; spare packs travel in carry-on baggage only.',
    ],
  },
  'lead-acid': {
    title: 'Lead-acid batteries',
    lines: [
      'Charging can give off hydrogen: charge in a ventilated space, away from flames and sparks.',
      'The acid burns skin and eyes; wear eye protection when you handle terminals or fill cells.',
    ],
  },
  'wiring-12v': {
    title: '12 V wiring',
    lines: [
      'Fit a fuse close to the battery’s positive terminal, rated for the cable it protects.',
      'Check polarity before you connect anything; a reversed lead can destroy a device.',
      'Size the cable for the current and the length of the run; an undersized cable heats up.',
    ],
  },
  'mains-charging': {
    title: 'Mains charging',
    lines: ['Use a charger meant for this item, keep it dry, and do not charge under bedding or in a closed bag.'],
  },
  'radio-licence': {
    title: 'Transmitting',
    lines: ['Transmitting on amateur radio bands needs a licence; listening does not. Check the rules of the country you are in.'],
  },
  'solar-heat': {
    title: 'Solar panels',
    lines: [
      'Panels and their connectors get hot in full sun.',
      'A panel’s open-circuit voltage rises on cold mornings; check it against your charge controller’s input rating.',
    ],
  },
};

export function CategoryCautions({ cautions }: { cautions: readonly CautionKey[] }) {
  if (cautions.length === 0) return null;
  return (
    <section aria-labelledby="cautions-heading" className="space-y-3">
      <h2 id="cautions-heading" className="text-xl font-bold">
        Safety
      </h2>
      {cautions.map((key, i) => (
        <Caution key={key} title={CAUTIONS[key].title} level={3} deferNote={i === cautions.length - 1}>
          {CAUTIONS[key].lines.map((line) => (
            <p key={line}>{line}</p>
          ))}
        </Caution>
      ))}
    </section>
  );
}
