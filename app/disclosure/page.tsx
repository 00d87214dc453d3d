import { ContentPage, contentPageMetadata } from '@/components/content-page';

export function generateMetadata() {
  return contentPageMetadata('disclosure');
}

export default function DisclosurePage() {
  return <ContentPage slug="disclosure" />;
}
