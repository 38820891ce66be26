import React, { useState } from 'react';
import { Link, useLocalSearchParams, useRouter, type Href } from 'expo-router';
import { View } from 'react-native';
import { Body, Button, Card, Field, Heading, Notice } from '@/components/ui';
import { space } from '@/components/theme';
import { safeNext, signIn } from '@/client/auth';
import { clearCache } from '@/client/hooks';
import { useAction } from '@/client/useAction';
import { ScreenTitle } from '@/components/ScreenTitle';

export default function SignIn() {
  const router = useRouter();
  const params = useLocalSearchParams<{ confirmed?: string; reset?: string; error?: string; next?: string }>();
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const {
    run: submit,
    busy,
    error,
  } = useAction(async () => {
    await signIn(email.trim(), password);
    await clearCache();
    const next = safeNext(params.next);
    if (next) router.replace(next as Href);
    else router.replace('/');
  });

  return (
    <Card>
      <ScreenTitle title="Sign in" />
      <Heading>Sign in</Heading>
      {params.confirmed ? (
        <Notice tone="success">Your e-mail is confirmed. Sign in to open your library.</Notice>
      ) : null}
      {params.reset ? <Notice tone="success">Your password is changed. Sign in with the new one.</Notice> : null}
      {params.error ? (
        <Notice tone="error">That link has expired or was already used. Sign in to get a new one.</Notice>
      ) : null}
      <View style={{ gap: space.md }}>
        <Field
          label="E-mail"
          value={email}
          onChangeText={setEmail}
          autoComplete="email"
          inputMode="email"
          autoCapitalize="none"
          testID="email"
        />
        <Field
          label="Password"
          value={password}
          onChangeText={setPassword}
          secureTextEntry
          autoComplete="current-password"
          onSubmitEditing={submit}
          testID="password"
        />
        {error ? <Notice tone="error">{error}</Notice> : null}
        <Button label="Sign in" onPress={submit} busy={busy} testID="sign-in" />
      </View>
      <Body muted>
        New here?{' '}
        <Link href={{ pathname: '/sign-up', params: params.next ? { next: params.next } : {} }}>Create an account</Link>{' '}
        · <Link href="/forgot-password">Forgot your password?</Link>
      </Body>
    </Card>
  );
}
