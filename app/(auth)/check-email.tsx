import React from 'react';
import { Link, useLocalSearchParams } from 'expo-router';
import { Body, Card, Heading } from '@/components/ui';
import { ScreenTitle } from '@/components/ScreenTitle';

export default function CheckEmail() {
  const { email } = useLocalSearchParams<{ email?: string }>();
  return (
    <Card testID="check-email">
      <ScreenTitle title="Check your e-mail" />
      <Heading>Check your e-mail</Heading>
      <Body>
        We sent a confirmation link to {email ? <Body style={{ fontWeight: '700' }}>{email}</Body> : 'your address'}.
        Open it, then sign in.
      </Body>
      <Body muted>
        Nothing after a few minutes? Look in your spam folder, or <Link href="/sign-in">sign in</Link> to have it sent
        again.
      </Body>
    </Card>
  );
}
