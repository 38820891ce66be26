// Any address the app does not know: say so in our own words and offer the way back.
import React from 'react';
import { useRouter } from 'expo-router';
import { Body, Button, Card, Heading, Screen } from '@/components/ui';
import { ScreenTitle } from '@/components/ScreenTitle';

export default function NotFound() {
  const router = useRouter();
  return (
    <Screen testID="not-found">
      <ScreenTitle title="Page not found" />
      <Card>
        <Heading>Nothing plays at this address</Heading>
        <Body>
          The page may have moved, or the link was copied only in part. Your songs and recordings are where you left
          them.
        </Body>
        <Button label="Go to your library" onPress={() => router.replace('/')} testID="not-found-home" />
      </Card>
    </Screen>
  );
}
