// A player's side of teaching: invitations waiting for an answer, and the teachers who can see their songs,
// each link one tap (and one confirmation) from ending.
import React, { useState } from 'react';
import { View } from 'react-native';
import { Body, Button, Card, Heading, Notice, Row, Small } from './ui';
import { space } from './theme';
import { answerInvitation, leaveTeacher, useReceivedInvitations, useTeachers } from '@/client/hooks';
import { formatDate } from '@/shared/format';
import type { Teacher } from '@/shared/schemas';

/** `invitationsOnly`: just the invitations waiting for an answer (the library shows them too). */
export function TeachersCard({ invitationsOnly = false }: { invitationsOnly?: boolean }) {
  const { invitations } = useReceivedInvitations();
  const { teachers } = useTeachers();
  const [problem, setProblem] = useState<string | null>(null);
  const answer = (id: string, a: 'accept' | 'decline') =>
    answerInvitation(id, a).catch((e: Error) => setProblem(e.message));
  if (!invitations?.length && (invitationsOnly || !teachers?.length)) return null;
  return (
    <Card testID="teachers">
      <Heading level={2}>{invitationsOnly ? 'An invitation' : 'Teachers'}</Heading>
      {invitations?.map((i) => (
        <View key={i.id} style={{ gap: space.sm }} testID="received-invitation">
          <Body>
            <Body style={{ fontWeight: '700' }}>{i.teacherName}</Body> invites you to be their student. They would see
            your songs, takes and practice log, leave notes on your takes and set tempos for you.
          </Body>
          <Row>
            <Button label="Accept" onPress={() => answer(i.id, 'accept')} testID="accept-invitation" />
            <Button label="Decline" kind="quiet" onPress={() => answer(i.id, 'decline')} />
          </Row>
        </View>
      ))}
      {problem ? <Notice tone="error">{problem}</Notice> : null}
      {invitationsOnly ? null : teachers?.map((t) => <TeacherRow key={t.id} teacher={t} />)}
    </Card>
  );
}

function TeacherRow({ teacher: t }: { teacher: Teacher }) {
  const [confirming, setConfirming] = useState(false);
  return (
    <View style={{ gap: space.xs }}>
      <Body style={{ fontWeight: '700' }}>{t.name}</Body>
      <Small>
        {t.email} · your teacher since {formatDate(t.since)}
      </Small>
      {confirming ? (
        <Row>
          <Small muted={false}>{t.name} will no longer see your songs and takes.</Small>
          <Button label="End the link" kind="secondary" onPress={() => leaveTeacher(t.id)} />
          <Button label="Keep" kind="quiet" onPress={() => setConfirming(false)} />
        </Row>
      ) : (
        <Button label="End the link…" kind="quiet" onPress={() => setConfirming(true)} />
      )}
    </View>
  );
}
