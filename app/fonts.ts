import localFont from 'next/font/local';

export const publicSans = localFont({
  src: [
    { path: './fonts/PublicSans-Variable.woff2', style: 'normal', weight: '100 900' },
    { path: './fonts/PublicSans-Variable-Italic.woff2', style: 'italic', weight: '100 900' },
  ],
  variable: '--font-public-sans',
  display: 'swap',
});

export const plexMono = localFont({
  src: [
    { path: './fonts/IBMPlexMono-Regular.woff2', weight: '400', style: 'normal' },
    { path: './fonts/IBMPlexMono-SemiBold.woff2', weight: '600', style: 'normal' },
  ],
  variable: '--font-plex-mono',
  display: 'swap',
});
