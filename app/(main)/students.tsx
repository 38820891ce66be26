// Students: a teacher's studio. A student is linked only after accepting the teacher's invitation; either side
// can end the link. Each student's card flags the takes and notes that wait for the teacher's answer. Only teachers (and admins) see this screen; the server enforces it too.
import React, { useState } from 'react';
import { Pressable, View } from 'react-native';
import { useRouter } from 'expo-router';
import {
  Body,
  Button,
  Card,
  Chip,
  EmptyState,
  Field,
  Heading,
  Loading,
  Notice,
  Row,
  Screen,
  Small,
} from '@/components/ui';
import { ProgressToGoal } from '@/components/TempoProgress';
import { AwaitingFlag, notesChipLabel, takeChipLabel } from '@/components/AwaitingAnswer';
import { colors, space } from '@/components/theme';
import {
  inviteStudent,
  removeStudent,
  useMe,
  useSentInvitations,
  useStudents,
  withdrawInvitation,
} from '@/client/hooks';
import { useAction } from '@/client/useAction';
import { ScreenTitle } from '@/components/ScreenTitle';
import { formatDate, plural } from '@/shared/format';
import type { Student } from '@/shared/schemas';

export default function Students() {
  const { me } = useMe();
  const allowed = me?.role === 'teacher' || me?.role === 'admin';
  const { students, isLoading } = useStudents(allowed);
  const { invitations } = useSentInvitations(allowed);
  const [email, setEmail] = useState('');
  const [sentTo, setSentTo] = useState<string | null>(null);
  const {
    run: submit,
    busy,
    error,
  } = useAction(async () => {
    await inviteStudent(email.trim());
    setSentTo(email.trim());
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
          Invite a student by e-mail. Once they accept, you see their songs, takes and practice log here.
        </EmptyState>
      ) : null}
      {students?.map((s) => (
        <StudentCard key={s.id} student={s} />
      ))}
      <Card testID="invite-student">
        <Heading level={3}>Invite a student</Heading>
        <Small>
          They get an e-mail with a link that works for 7 days. Nothing of theirs is shared with you unless they accept,
          and either of you can end it at any time.
        </Small>
        <View style={{ gap: space.md }}>
          <Field
            label="Their e-mail address"
            value={email}
            onChangeText={setEmail}
            inputMode="email"
            autoCapitalize="none"
            error={error}
            testID="invite-email"
          />
          <Button
            label="Send invitation"
            onPress={submit}
            busy={busy}
            disabled={!email.trim()}
            testID="send-invitation"
          />
          {sentTo ? <Notice tone="success">Invitation sent to {sentTo}.</Notice> : null}
        </View>
      </Card>
      {invitations && invitations.length > 0 ? (
        <Card testID="pending-invitations">
          <Heading level={3}>Waiting for an answer</Heading>
          {invitations.map((i) => (
            <Row key={i.id} align="center">
              <View style={{ flex: 1 }}>
                <Body>{i.email}</Body>
                <Small>
                  {i.status === 'expired'
                    ? 'Expired: send a new one'
                    : `Sent ${formatDate(i.createdAt)} · works until ${formatDate(i.expiresAt)}`}
                </Small>
              </View>
              <Button label="Withdraw" kind="quiet" onPress={() => withdrawInvitation(i.id)} />
            </Row>
          ))}
        </Card>
      ) : null}
    </Screen>
  );
}

function StudentCard({ student: s }: { student: Student }) {
  const [confirming, setConfirming] = useState(false);
  const router = useRouter();
  return (
    <Card testID={`student-${s.id}`}>
      <Body style={{ fontWeight: '700' }}>{s.name}</Body>
      <Small>
        {s.email} · {plural(s.songCount, 'song')}
      </Small>
      <AwaitingFlag awaiting={s.awaiting} />
      {s.songCount === 0 ? (
        <Small muted={false}>No songs yet: their songs, takes and practice show here once they add one.</Small>
      ) : null}
      {s.songs.map((song) => (
        <View key={song.id} style={{ gap: space.xs, paddingVertical: space.xs }} testID="student-song">
          <Pressable
            role="link"
            onPress={() => router.navigate(`/songs/${song.id}`)}
            accessibilityLabel={`Open ${song.title}`}
          >
            <Body style={{ fontWeight: '700', color: colors.teal }}>{song.title}</Body>
          </Pressable>
          {song.goalBpm ? (
            <ProgressToGoal working={song.workingBpm} goal={song.goalBpm} />
          ) : (
            <Small>No goal tempo yet</Small>
          )}
          <Small>
            {song.lastPracticedAt
              ? `Last practised ${formatDate(song.lastPracticedAt)}`
              : 'Not practised in Tactus yet'}
          </Small>
          {song.recentTakes.length || song.notesAwaiting.length ? (
            <Row>
              {song.recentTakes.map((t) => (
                <Chip
                  key={t.id}
                  label={takeChipLabel(t)}
                  hint={t.awaitingAnswer ? `${takeChipLabel(t)}: waits for your answer` : undefined}
                  onPress={() => router.navigate(`/recordings/${t.id}`)}
                  testID="student-take"
                />
              ))}
              {song.notesAwaiting.map((n) => (
                <Chip
                  key={n.recordingId}
                  label={notesChipLabel(n)}
                  onPress={() => router.navigate(`/recordings/${n.recordingId}`)}
                  testID="student-notes-awaiting"
                />
              ))}
            </Row>
          ) : null}
        </View>
      ))}
      {confirming ? (
        <Row>
          <Small muted={false}>Stop teaching {s.name} in Tactus? You lose access to their songs at once.</Small>
          <Button label="End the link" kind="secondary" onPress={() => removeStudent(s.id)} />
          <Button label="Keep" kind="quiet" onPress={() => setConfirming(false)} />
        </Row>
      ) : (
        <Button label="End the link…" kind="quiet" onPress={() => setConfirming(true)} />
      )}
    </Card>
  );
}
