// Signed-out screens: one centred card under the wordmark.
import React from 'react';
import { Slot } from 'expo-router';
import { ScrollView, View } from 'react-native';
import { Wordmark } from '@/components/NavShell';
import { Small } from '@/components/ui';
import { colors, space } from '@/components/theme';

export default function AuthLayout() {
  return (
    <ScrollView
      style={{ flex: 1, backgroundColor: colors.paper }}
      contentContainerStyle={{ padding: space.lg, paddingTop: space.xxl }}
    >
      <View style={{ width: '100%', maxWidth: 420, alignSelf: 'center', gap: space.lg }}>
        <Wordmark />
        <Small>Find the tempo each piece wants, practise toward it, and play it again tomorrow.</Small>
        <Slot />
      </View>
    </ScrollView>
  );
}
