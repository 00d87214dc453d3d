import type { Metadata } from 'next';
import { ComingSoon } from '@/components/coming-soon';

export const metadata: Metadata = { title: 'Gear' };

export default function GearPage() {
  return (
    <ComingSoon title="Gear">
      <p>Browse lights, power banks, 12 V batteries, solar panels and radios, filtered and sorted by value ratios such as lumens per gram or watt-hours per unit of money.</p>
    </ComingSoon>
  );
}
