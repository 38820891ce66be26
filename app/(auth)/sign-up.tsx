import React, { useState } from 'react';
import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { Body, Button, Card, Field, Heading, Notice } from '@/components/ui';
import { space } from '@/components/theme';
import { signUp } from '@/client/auth';
import { useAction } from '@/client/useAction';
import { ScreenTitle } from '@/components/ScreenTitle';

export default function SignUp() {
  const router = useRouter();
  const { next } = useLocalSearchParams<{ next?: string }>();
  const [name, setName] = useState('');
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const {
    run: submit,
    busy,
    error,
  } = useAction(async () => {
    if (!name.trim()) throw new Error('Tell us the name your teacher and bandmates know you by.');
    if (password.length < 8) throw new Error('Use at least 8 characters for your password.');
    await signUp(name.trim(), email.trim(), password, next);
    router.replace({ pathname: '/check-email', params: { email: email.trim() } });
  });

  return (
    <Card>
      <ScreenTitle title="Create an account" />
      <Heading>Create your account</Heading>
      <View style={{ gap: space.md }}>
        <Field label="Name" value={name} onChangeText={setName} autoComplete="name" testID="name" />
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
          autoComplete="new-password"
          hint="At least 8 characters."
          onSubmitEditing={submit}
          testID="password"
        />
        {error ? <Notice tone="error">{error}</Notice> : null}
        <Button label="Create account" onPress={submit} busy={busy} testID="sign-up" />
      </View>
      <Body muted>
        Already have one? <Link href={{ pathname: '/sign-in', params: next ? { next } : {} }}>Sign in</Link>
      </Body>
    </Card>
  );
}
