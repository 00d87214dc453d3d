import { Caution } from '@/components/caution';
import { ContentPage, contentPageMetadata } from '@/components/content-page';

export function generateMetadata() {
  return contentPageMetadata('safety');
}

export default function SafetyPage() {
  return (
    <ContentPage
      slug="safety"
      lead={
        <Caution title="Read this before you charge, wire or fuel anything">
          <p>
            Batteries, chargers, 12 V wiring and fuel appliances can cause fires, burns and carbon monoxide poisoning.
            The notes below are general cautions, not instructions for your gear, and Trailbench&apos;s power budget is
            a planning aid, not an electrical design. When in doubt, ask a licensed practitioner.
          </p>
        </Caution>
      }
    />
  );
}
