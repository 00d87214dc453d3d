import { ContentPage, contentPageMetadata } from '@/components/content-page';

export function generateMetadata() {
  return contentPageMetadata('help');
}

export default function HelpPage() {
  return <ContentPage slug="help" />;
}
