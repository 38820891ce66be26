// Students: a teacher's studio. Only teachers (and admins) see this screen; the server enforces it too.
import React, { useState } from 'react';
import { View } from 'react-native';
import { plural } from '@/shared/format';
import { Body, Button, Card, EmptyState, Field, Heading, Loading, Notice, Screen, Small } from '@/components/ui';
import { space } from '@/components/theme';
import { addStudent, useMe, useStudents } from '@/client/hooks';
import { useAction } from '@/client/useAction';
import { ScreenTitle } from '@/components/ScreenTitle';

export default function Students() {
  const { me } = useMe();
  const allowed = me?.role === 'teacher' || me?.role === 'admin';
  const { students, isLoading } = useStudents(allowed);
  const [email, setEmail] = useState('');
  const { run: submit, busy, error } = useAction(async () => {
    await addStudent(email.trim());
    setEmail('');
  });

  if (!allowed) {
    return (
      <Screen>
        <Notice>This page is for teachers. Ask an admin to give your account the teacher role.</Notice>
      </Screen>
    );
  }

  return (
    <Screen testID="students">
      <ScreenTitle title="Students" />
      <Heading>Students</Heading>
      {isLoading ? <Loading /> : null}
      {students && students.length === 0 ? (
        <EmptyState title="No students yet">
          Add a student by the e-mail address they signed up with. You will then see their songs and takes, and can set tempos for
          them.
        </EmptyState>
      ) : null}
      {students?.map((s) => (
        <Card key={s.id}>
          <Body style={{ fontWeight: '700' }}>{s.name}</Body>
          <Small>
            {s.email} · {plural(s.songCount, 'song')}
          </Small>
        </Card>
      ))}
      <Card>
        <View style={{ gap: space.md }}>
          <Field label="Add a student by e-mail" value={email} onChangeText={setEmail} inputMode="email" autoCapitalize="none" error={error} />
          <Button label="Add student" onPress={submit} busy={busy} disabled={!email.trim()} />
        </View>
      </Card>
    </Screen>
  );
}
