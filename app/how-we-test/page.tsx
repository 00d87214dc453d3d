import { ContentPage, contentPageMetadata } from '@/components/content-page';

export function generateMetadata() {
  return contentPageMetadata('how-we-test');
}

export default function HowWeTestPage() {
  return <ContentPage slug="how-we-test" />;
}
