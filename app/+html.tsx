import { ScrollViewStyleReset } from 'expo-router/html';
import type { ReactNode } from 'react';
import { colours } from '@/components/theme/tokens';

/** The web document (static rendering): phone viewport, the wax background before the app paints. */
export default function Root({ children }: { children: ReactNode }) {
  return (
    <html lang="en">
      <head>
        <meta charSet="utf-8" />
        <meta httpEquiv="X-UA-Compatible" content="IE=edge" />
        {/* No maximum-scale: keepers must be able to pinch-zoom (WCAG 1.4.4). */}
        <meta name="viewport" content="width=device-width, initial-scale=1, viewport-fit=cover" />
        <meta name="theme-color" content={colours.ink} />
        <ScrollViewStyleReset />
        <style dangerouslySetInnerHTML={{ __html: `html, body { background-color: ${colours.bg}; color: ${colours.ink}; }` }} />
      </head>
      <body>{children}</body>
    </html>
  );
}
