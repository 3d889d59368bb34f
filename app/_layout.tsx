import { useFonts } from 'expo-font';
import { StatusBar } from 'expo-status-bar';
import { useEffect, useState } from 'react';
import { createQueryClient } from '@/components/api/query-client';
import { RouteStack } from '@/components/nav/route-stack';
import { OfflineProvider } from '@/components/offline/offline-provider';
import { installFocusRing } from '@/components/theme/focus-ring';
import { fontFamily, tokens } from '@/components/theme/tokens';
import { ThemeContext } from '@/components/theme/use-theme';

export { ErrorView as ErrorBoundary } from '@/components/nav/error-view';

export default function RootLayout() {
  // The one typeface, shipped in assets/fonts (never a web font service).
  const [fontsLoaded, fontError] = useFonts({
    [fontFamily.regular]: require('../assets/fonts/AtkinsonHyperlegible-Regular.ttf'),
    [fontFamily.bold]: require('../assets/fonts/AtkinsonHyperlegible-Bold.ttf'),
    [fontFamily.italic]: require('../assets/fonts/AtkinsonHyperlegible-Italic.ttf'),
  });
  const [queryClient] = useState(createQueryClient);
  useEffect(installFocusRing, []);

  // Wait for the face rather than flash a fallback; a font error falls back to system text.
  if (!fontsLoaded && !fontError) return null;

  return (
    <ThemeContext.Provider value={tokens}>
      <OfflineProvider client={queryClient}>
        <StatusBar style="dark" />
        <RouteStack />
      </OfflineProvider>
    </ThemeContext.Provider>
  );
}
