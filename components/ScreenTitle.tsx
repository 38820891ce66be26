// The browser tab's title for a screen ("Copperline Reel · Tactus"), through Expo Router's <Head>.
import React from 'react';
import Head from 'expo-router/head';

export const screenTitle = (title?: string | null) => (title ? `${title} · Tactus` : 'Tactus');

export function ScreenTitle({ title }: { title?: string | null }) {
  return (
    <Head>
      <title>{screenTitle(title)}</title>
    </Head>
  );
}
