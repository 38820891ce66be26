// Play along with the reference: the reference plays at the tempo set on the player while the microphone
// listens, and each beat played is shown against the reference's beat (the same live view as recording a take).
// At the end the take is offered to keep or discard, as on the song page; only a kept take is sent. The work is
// in usePlayAlong; this is layout.
import React from 'react';
import { View } from 'react-native';
import { Button, Card, Heading, Notice, Row, Small } from '@/components/ui';
import { ProgressBar } from '@/components/ProgressBar';
import { LiveBeatView } from '@/components/LiveBeatView';
import { space } from '@/components/theme';
import { formatBpm } from '@/shared/format';
import type { Song } from '@/shared/schemas';
import { TakeReview } from '@/components/TakeReview';
import type { AuditionSession } from './useAuditionSession';

export function PlayAlongCard({ s, song }: { s: AuditionSession; song: Song | undefined }) {
  const { audition, playAlong: along } = s;
  const running = along.phase === 'running';
  // While playing, the state and the marks come first (read from the music stand); the explanation and the
  // cautions are read before starting.
  if (along.phase === 'review' && along.take)
    return (
      <Card testID="play-along">
        <Heading level={3}>Play along</Heading>
        {song?.permissions.addTake ? (
          <TakeReview
            take={along.take}
            songId={song.id}
            defaultLabel={`Played along at ${formatBpm(audition.bpm)} BPM`}
            fileName={`Played along at ${formatBpm(audition.bpm)} BPM.wav`}
            onKept={() => along.done('The take was kept: it is analysed with the song’s recordings.')}
            onDiscarded={() => along.done('The take was discarded; nothing was sent.')}
          />
        ) : (
          <>
            <Small>Takes of this song are kept by its owner: this one stays here until you close it.</Small>
            <Button label="Close" kind="secondary" onPress={() => along.done(null)} testID="discard-take" />
          </>
        )}
      </Card>
    );
  if (along.phase !== 'idle')
    return (
      <Card testID="play-along">
        <Row>
          <Heading level={3}>Play along</Heading>
          <Button label="Stop" onPress={along.stop} busy={along.phase === 'starting'} testID="play-along-stop" />
        </Row>
        {running ? (
          <LiveBeatView marks={along.marks} placeOf={along.placeOf} beatWord="beat" />
        ) : (
          <Small>Opening the microphone…</Small>
        )}
        <View style={{ gap: space.xs }}>
          <ProgressBar value={Math.sqrt(along.level)} label="Input level" testID="play-along-level" />
          <Small>{along.level > 0.9 ? 'Input level: too loud, move back from the microphone' : 'Input level'}</Small>
        </View>
        <Small>
          At {formatBpm(audition.bpm)} BPM. Stop to listen back, then keep or discard: only a kept take leaves this
          browser.
        </Small>
      </Card>
    );
  return (
    <Card testID="play-along">
      <Heading level={3}>Play along</Heading>
      <Small>
        The recording plays at {formatBpm(audition.bpm)} BPM (set above) while the microphone listens: each beat you
        play is placed against the recording&apos;s beat, with your tempo over the last beats. At the end, listen back
        and keep the take (it joins the song&apos;s recordings and is analysed) or discard it: nothing leaves this
        browser unless you keep it.
      </Small>
      <Notice tone="caution">
        Use headphones: through speakers the recording and the click reach the microphone and are heard as your playing.
        Keep the level moderate, as long listening at high levels in headphones harms hearing (WHO–ITU H.870, safe
        listening), and take a break from long repetitive practice if your hands or ears tire.
      </Notice>
      <Small>
        {along.latencyMs !== null
          ? `Latency ${Math.round(along.latencyMs)} ms on this browser: your beats are shifted by it.`
          : 'Latency not measured on this browser yet (Measure latency on the song page): your beats may read a little late.'}
      </Small>
      <Row>
        <Button
          label="Start playing along"
          onPress={() => void along.start()}
          disabled={!audition.ready}
          testID="play-along-start"
        />
      </Row>
      {along.note ? <Notice tone="info">{along.note}</Notice> : null}
      {along.error ? <Notice tone="error">{along.error}</Notice> : null}
    </Card>
  );
}
