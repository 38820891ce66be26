// Where an invitation mail leads: who invites, to which address, and the answer — signed in with that address.
// Signed out, it offers to sign in or create the account first and comes back here afterwards.
import React, { useEffect, useState } from 'react';
import { ScrollView, View } from 'react-native';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { Body, Button, Card, Heading, Loading, Notice, Row, Small } from '@/components/ui';
import { Wordmark } from '@/components/NavShell';
import { ScreenTitle } from '@/components/ScreenTitle';
import { colors, space } from '@/components/theme';
import { answerInvitation, useInvitationByToken, useMe } from '@/client/hooks';
import { formatDate } from '@/shared/format';

const answered: Record<string, string> = {
  accepted: 'This invitation has been accepted.',
  declined: 'This invitation was declined.',
  // Sending a new invitation to the same address also withdraws the pending one, so an older mail's link lands here.
  withdrawn:
    'This link no longer works: the teacher withdrew the invitation or sent a newer one. Use the link in their latest e-mail.',
  expired: 'This invitation has expired. Ask your teacher to send a new one.',
};

export default function InvitationScreen() {
  const { token, accept } = useLocalSearchParams<{ token: string; accept?: string }>();
  const router = useRouter();
  const { me, signedOut } = useMe();
  const { invitation: inv, error, isLoading } = useInvitationByToken(token);
  const [done, setDone] = useState<'accept' | 'decline' | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const here = `/invitations/${token}`;

  const answer = async (a: 'accept' | 'decline') => {
    try {
      await answerInvitation(inv!.id, a, token);
      setDone(a);
    } catch (e) {
      setProblem((e as Error).message);
    }
  };

  // Back from creating the account through this invitation, signed in with the invited address: link now.
  const autoAccept = accept === '1' && inv?.status === 'pending' && inv.forYou === true && done === null;
  useEffect(() => {
    if (!autoAccept) return;
    answerInvitation(inv!.id, 'accept', token).then(
      () => setDone('accept'),
      (e: Error) => setProblem(e.message),
    );
    // Once, when the invitation and the signed-in account are known.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [autoAccept]);

  let body: React.ReactNode;
  if (isLoading) body = <Loading />;
  else if (error || !inv)
    body = <Notice tone="error">This invitation link is not valid. Check that the whole link was copied.</Notice>;
  else if (done === 'accept')
    body = (
      <>
        <Notice tone="success">
          You are now {inv.teacherName}’s student. You can end this at any time on your Account page.
        </Notice>
        <Button label="Go to your library" onPress={() => router.replace('/')} testID="to-library" />
      </>
    );
  else if (done === 'decline') body = <Notice>You declined. {inv.teacherName} sees nothing of yours.</Notice>;
  else if (inv.status !== 'pending') body = <Notice>{answered[inv.status]}</Notice>;
  else
    body = (
      <>
        <Body>
          <Body style={{ fontWeight: '700' }}>{inv.teacherName}</Body> invites{' '}
          <Body style={{ fontWeight: '700' }}>{inv.email}</Body> to be their student on Tactus. Your teacher would see
          your songs, takes and practice log, leave notes on your takes and set working and goal tempos for you. Nothing
          is shared unless you accept, and you can end it at any time.
        </Body>
        <Small>This invitation works until {formatDate(inv.expiresAt)}.</Small>
        {signedOut ? (
          <Row>
            <Button
              label="Sign in to answer"
              onPress={() => router.push({ pathname: '/sign-in', params: { next: here } })}
              testID="invitation-sign-in"
            />
            <Button
              label="Create an account"
              kind="secondary"
              // Creating the account from the invitation is the answer: it is accepted once the address is confirmed.
              onPress={() => router.push({ pathname: '/sign-up', params: { next: `${here}?accept=1` } })}
              testID="invitation-sign-up"
            />
          </Row>
        ) : inv.forYou === false ? (
          <Notice tone="caution">
            You are signed in as {me?.email}. This invitation is for {inv.email}: sign out and sign in with that address
            to answer it.
          </Notice>
        ) : (
          <Row>
            <Button
              label={`Accept ${inv.teacherName} as my teacher`}
              onPress={() => answer('accept')}
              testID="accept-invitation"
            />
            <Button label="Decline" kind="quiet" onPress={() => answer('decline')} testID="decline-invitation" />
          </Row>
        )}
        {problem ? <Notice tone="error">{problem}</Notice> : null}
      </>
    );

  return (
    <ScrollView
      style={{ flex: 1, backgroundColor: colors.paper }}
      contentContainerStyle={{ padding: space.lg, paddingTop: space.xxl }}
    >
      <ScreenTitle title="An invitation" />
      <View style={{ width: '100%', maxWidth: 520, alignSelf: 'center', gap: space.lg }}>
        <Wordmark />
        <Card testID="invitation">
          <Heading>An invitation from a teacher</Heading>
          {body}
        </Card>
      </View>
    </ScrollView>
  );
}
