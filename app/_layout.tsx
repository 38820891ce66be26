// Root: ship our fonts, share one SWR cache, render the active route group.
import React from 'react';
import { Slot } from 'expo-router';
import { SWRConfig } from 'swr';
import { useFonts } from 'expo-font';
import { Manrope_400Regular } from '@expo-google-fonts/manrope/400Regular';
import { Manrope_600SemiBold } from '@expo-google-fonts/manrope/600SemiBold';
import { Manrope_700Bold } from '@expo-google-fonts/manrope/700Bold';
import { SpaceGrotesk_600SemiBold } from '@expo-google-fonts/space-grotesk/600SemiBold';
import { SpaceGrotesk_700Bold } from '@expo-google-fonts/space-grotesk/700Bold';
import { View } from 'react-native';
import { colors } from '@/components/theme';
import { fetcher } from '@/client/api';

export default function RootLayout() {
  const [loaded, fontError] = useFonts({
    Manrope_400Regular,
    Manrope_600SemiBold,
    Manrope_700Bold,
    SpaceGrotesk_600SemiBold,
    SpaceGrotesk_700Bold,
  });
  // Fonts are bundled, so this is a blink; on failure the system face is used rather than a blank page.
  if (!loaded && !fontError) return <View style={{ flex: 1, backgroundColor: colors.paper }} />;
  return (
    <SWRConfig value={{ fetcher, revalidateOnFocus: false }}>
      <Slot />
    </SWRConfig>
  );
}
