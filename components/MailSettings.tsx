// Whether new notes on one's recordings arrive by e-mail (a digest, at most one every 15 minutes).
import React from 'react';
import { Card, Chip, Heading, Small } from './ui';
import { setPreferences, usePreferences } from '@/client/hooks';

export function MailSettings() {
  const { preferences } = usePreferences();
  if (!preferences) return null;
  const on = preferences.noteDigests;
  return (
    <Card testID="mail-settings">
      <Heading level={2}>E-mail</Heading>
      <Small>
        When your teacher writes notes on your recordings, Tactus can send you one e-mail with all new notes, at most
        every 15 minutes.
      </Small>
      <Chip
        label={on ? '✓ E-mail me new notes' : 'E-mail me new notes: off'}
        selected={on}
        onPress={() => setPreferences({ noteDigests: !on })}
        hint={on ? 'Turn the e-mail digest of new notes off' : 'Turn the e-mail digest of new notes on'}
        testID="note-digests"
      />
    </Card>
  );
}
