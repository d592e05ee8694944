import { useState } from 'react';
import { Slot } from 'expo-router';
import { QueryClientProvider } from '@tanstack/react-query';
import { createQueryClient } from '../components/queries/client';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { installAppFonts } from '../components/fonts/installAppFonts';
import '../components/csp/zod-jitless'; // before any schema parses: no eval probe under our CSP

installAppFonts(); // @font-face rules with font-display: swap; the first screen never waits for fonts

/** Root: fonts (components/fonts), the query client, safe areas. */
export default function RootLayout() {
  const [queryClient] = useState(createQueryClient);
  return (
    <SafeAreaProvider>
      <QueryClientProvider client={queryClient}>
        <Slot />
      </QueryClientProvider>
    </SafeAreaProvider>
  );
}
