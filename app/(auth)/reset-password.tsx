import React, { useState } from 'react';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { Button, Card, Field, Heading, Notice } from '@/components/ui';
import { space } from '@/components/theme';
import { resetPassword } from '@/client/auth';
import { useAction } from '@/client/useAction';
import { ScreenTitle } from '@/components/ScreenTitle';

export default function ResetPassword() {
  const router = useRouter();
  const { token, error: linkError } = useLocalSearchParams<{ token?: string; error?: string }>();
  const [password, setPassword] = useState('');
  const {
    run: submit,
    busy,
    error,
  } = useAction(async () => {
    if (!token) return;
    await resetPassword(token, password);
    router.replace({ pathname: '/sign-in', params: { reset: '1' } });
  });

  return (
    <Card>
      <ScreenTitle title="New password" />
      <Heading>Choose a new password</Heading>
      {!token || linkError ? (
        <Notice tone="error">
          This reset link has expired or was already used. Ask for a new one from the sign-in page.
        </Notice>
      ) : (
        <View style={{ gap: space.md }}>
          <Field
            label="New password"
            value={password}
            onChangeText={setPassword}
            secureTextEntry
            hint="At least 8 characters."
            testID="password"
          />
          {error ? <Notice tone="error">{error}</Notice> : null}
          <Button label="Save password" onPress={submit} busy={busy} />
        </View>
      )}
    </Card>
  );
}
