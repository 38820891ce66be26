import React, { useState } from 'react';
import { Link } from 'expo-router';
import { View } from 'react-native';
import { Body, Button, Card, Field, Heading, Notice } from '@/components/ui';
import { space } from '@/components/theme';
import { requestPasswordReset } from '@/client/auth';
import { useAction } from '@/client/useAction';
import { ScreenTitle } from '@/components/ScreenTitle';

export default function ForgotPassword() {
  const [email, setEmail] = useState('');
  const [sent, setSent] = useState(false);
  const {
    run: submit,
    busy,
    error,
  } = useAction(async () => {
    await requestPasswordReset(email.trim());
    setSent(true);
  });

  return (
    <Card>
      <ScreenTitle title="Forgotten password" />
      <Heading>Reset your password</Heading>
      {sent ? (
        <Notice tone="success">
          If an account uses that address, a reset link is on its way. It works for one hour.
        </Notice>
      ) : (
        <View style={{ gap: space.md }}>
          <Field
            label="E-mail"
            value={email}
            onChangeText={setEmail}
            inputMode="email"
            autoCapitalize="none"
            testID="email"
          />
          {error ? <Notice tone="error">{error}</Notice> : null}
          <Button label="Send reset link" onPress={submit} busy={busy} />
        </View>
      )}
      <Body muted>
        <Link href="/sign-in">Back to sign in</Link>
      </Body>
    </Card>
  );
}
