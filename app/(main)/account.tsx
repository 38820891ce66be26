// Account: who is signed in, sign-out, teachers, how slowed-down playback sounds, e-mail, and the admin's user list.
import React from 'react';
import { useRouter } from 'expo-router';
import { View } from 'react-native';
import { Body, Button, Card, Heading, Screen, Small } from '@/components/ui';
import { RoleEditor } from '@/components/RoleEditor';
import { TeachersCard } from '@/components/TeachersCard';
import { MailSettings } from '@/components/MailSettings';
import { PlaybackSettings } from '@/components/PlaybackSettings';
import { space } from '@/components/theme';
import { signOut } from '@/client/auth';
import { clearCache, useMe } from '@/client/hooks';
import { ScreenTitle } from '@/components/ScreenTitle';

const roleNames = { player: 'Player', teacher: 'Teacher', admin: 'Admin' } as const;

export default function Account() {
  const { me } = useMe();
  const router = useRouter();
  if (!me) return null;
  return (
    <Screen testID="account">
      <ScreenTitle title="Account" />
      <Heading>Account</Heading>
      <Card>
        <Body style={{ fontWeight: '700' }}>{me.name}</Body>
        <Small>{me.email}</Small>
        <Small>Role: {roleNames[me.role]}</Small>
        <View style={{ flexDirection: 'row', marginTop: space.sm }}>
          <Button
            label="Sign out"
            kind="secondary"
            onPress={async () => {
              await signOut();
              await clearCache();
              router.replace('/sign-in');
            }}
          />
        </View>
      </Card>
      <TeachersCard />
      <PlaybackSettings />
      <MailSettings />
      {me.role === 'admin' ? <RoleEditor selfId={me.id} /> : null}
    </Screen>
  );
}
