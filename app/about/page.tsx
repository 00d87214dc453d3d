import { ContentPage, contentPageMetadata } from '@/components/content-page';

export function generateMetadata() {
  return contentPageMetadata('about');
}

export default function AboutPage() {
  return <ContentPage slug="about" />;
}
