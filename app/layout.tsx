import type { Metadata, Viewport } from 'next';
import localFont from 'next/font/local';
import { headers } from 'next/headers';
import { NONCE_HEADER } from '@/src/server/security-headers';
import { THEME_BOOT_SCRIPT } from '@/src/web/shell/theme-script';
import './globals.css';

const plexSans = localFont({
  src: [
    { path: '../public/fonts/ibm-plex-sans-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../public/fonts/ibm-plex-sans-latin-500-normal.woff2', weight: '500', style: 'normal' },
    { path: '../public/fonts/ibm-plex-sans-latin-600-normal.woff2', weight: '600', style: 'normal' },
  ],
  variable: '--font-plex-sans',
  display: 'swap',
});

const plexMono = localFont({
  src: [
    { path: '../public/fonts/ibm-plex-mono-latin-400-normal.woff2', weight: '400', style: 'normal' },
    { path: '../public/fonts/ibm-plex-mono-latin-500-normal.woff2', weight: '500', style: 'normal' },
  ],
  variable: '--font-plex-mono',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'Cavitas', template: '%s · Cavitas' },
  description: 'Workbench for ELF stations: Schumann-resonance spectra, mode fits and global thunderstorm activity.',
};

export const viewport: Viewport = {
  themeColor: [
    { media: '(prefers-color-scheme: light)', color: '#f9f6f0' },
    { media: '(prefers-color-scheme: dark)', color: '#14161b' },
  ],
};

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // The proxy's per-request nonce lets the theme script run under the Content-Security-Policy.
  const nonce = (await headers()).get(NONCE_HEADER) ?? undefined;
  return (
    <html lang="en" className={`${plexSans.variable} ${plexMono.variable}`} suppressHydrationWarning>
      <head>
        <script nonce={nonce} dangerouslySetInnerHTML={{ __html: THEME_BOOT_SCRIPT }} />
      </head>
      <body className="bg-canvas font-sans text-fg antialiased">{children}</body>
    </html>
  );
}
