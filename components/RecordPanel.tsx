// Recording a take against the click, with live feedback while playing: the count-in, the click in the
// headphones, the input level, each beat's offset from the click, the running tempo and steady / rushing /
// dragging. Stop, listen back, keep (uploaded and analysed like any take) or discard. The latency measurement
// lives here too, kept per browser. The audio work is in client/live-session.ts; this is layout and state.
import React, { useEffect, useRef, useState } from 'react';
import { Platform, Text, View } from 'react-native';
import { Button, Card, Chip, Heading, Notice, Row, Small } from './ui';
import { ProgressBar } from './ProgressBar';
import { colors, space, type } from './theme';
import { Level } from '@/components/audition/SoundLevels';
import { beatsPerBar } from '@/audio/playback/click';
import type { BeatMark } from '@/audio/live/feedback';
import { LiveBeatView } from './LiveBeatView';
import { TakeReview } from './TakeReview';
import { CALIBRATION_CLICKS } from '@/audio/live/calibration';
import { endRun, LiveSession, type RecordedTake } from '@/client/live-session';
import { keepCalibration, readCalibration, type StoredCalibration } from '@/client/latency';
import { DEFAULT_CLICK_GAIN } from '@/client/click-sound';
import { audioContext } from '@/client/audio-context';
import { formatBpm, formatDate, tenth } from '@/shared/format';
import type { Recording, Song } from '@/shared/schemas';

type Phase = 'idle' | 'calibrating' | 'recording' | 'review';

/** Bar and beat after the count-in (bar 1, beat 1 is the first beat played), from the grid's beat number. */
function barBeat(beat: number, perBar: number) {
  const played = beat - perBar;
  return { bar: Math.floor(played / perBar) + 1, beat: (played % perBar) + 1 };
}

/** What the browser test and the benchmark read: the delay from each onset to its mark on screen. */
interface LiveProbe {
  delaysMs: number[];
  /** The capture worklet's time figures of the last run. */
  stats?: { busyMs: number; audioMs: number; blocks: number; maxBlockMs: number };
}
const probe = (): LiveProbe | null =>
  Platform.OS === 'web' ? ((window as unknown as { tactusLive?: LiveProbe }).tactusLive ??= { delaysMs: [] }) : null;

export function RecordPanel({ song, onKept }: { song: Song; onKept: (r: Recording) => void }) {
  const [bpm, setBpm] = useState(song.workingBpm ?? song.chosenBpm ?? song.goalBpm ?? 100);
  const perBar = beatsPerBar(song.meter);
  const [clickVolume, setClickVolume] = useState(DEFAULT_CLICK_GAIN);
  const [phase, setPhase] = useState<Phase>('idle');
  const [error, setError] = useState<string | null>(null);
  const [note, setNote] = useState<string | null>(null);
  const [level, setLevel] = useState(0);
  const [marks, setMarks] = useState<(BeatMark & { receivedAt: number; onset: number })[]>([]);
  const [calibration, setCalibration] = useState<StoredCalibration | null>(readCalibration);
  const [take, setTake] = useState<RecordedTake | null>(null);
  const session = useRef<LiveSession | null>(null);

  useEffect(() => {
    return () => session.current?.dispose();
  }, []);

  // The delay from an onset (on the audio clock) to its mark being on screen, for the benchmark.
  const lastMark = marks[marks.length - 1];
  useEffect(() => {
    if (!lastMark || Platform.OS !== 'web') return;
    requestAnimationFrame(() => probe()?.delaysMs.push((audioContext().currentTime - lastMark.onset) * 1000));
  }, [lastMark]);

  const newSession = () =>
    new LiveSession({
      level: setLevel,
      stats: (st) => {
        const p = probe();
        if (p) p.stats = st;
      },
      mark: (m, onset) => setMarks((ms) => [...ms, { ...m, receivedAt: onset.receivedAt, onset: onset.time }]),
      calibrated: (r) => {
        setPhase('idle');
        setLevel(0);
        if (r.ok) {
          setCalibration(keepCalibration(r.calibration));
          setNote(`Latency measured: ${Math.round(r.calibration.latencyMs)} ms. Takes and marks are shifted by it.`);
        } else setError(r.reason);
      },
    });

  const begin = async (calibrating: boolean) => {
    setError(null);
    setNote(null);
    setMarks([]);
    setTake(null);
    const s = newSession();
    session.current = s;
    setPhase(calibrating ? 'calibrating' : 'recording');
    try {
      await s.start({
        bpm,
        beatsPerBar: perBar,
        clickVolume,
        latencySec: calibrating ? 0 : (calibration?.latencyMs ?? 0) / 1000,
        calibration: calibrating,
      });
    } catch (e) {
      s.dispose();
      setPhase('idle');
      setError((e as Error).message);
    }
  };

  const stop = async () => {
    const s = session.current;
    if (!s) return;
    const end = await endRun(s);
    setLevel(0);
    setTake(end.take);
    setNote(end.note);
    setPhase(end.take ? 'review' : 'idle');
  };

  const discarded = () => {
    setTake(null);
    setPhase('idle');
    setNote('The take was discarded; nothing was sent.');
  };

  const kept = (r: Recording) => {
    setTake(null);
    setPhase('idle');
    onKept(r);
  };

  const busy = phase === 'calibrating' || phase === 'recording';
  return (
    <Card testID="record-panel">
      <Heading level={3}>Record a take</Heading>
      <Notice tone="caution">
        Use headphones: through speakers the click is recorded with you. Keep the click moderate, as long listening at
        high levels in headphones harms hearing (WHO–ITU H.870, safe listening), and take a break from long repetitive
        practice if your hands or ears tire.
      </Notice>
      <Row align="baseline">
        <Text style={[type.h2, { color: colors.ink }]} testID="record-bpm">
          {formatBpm(bpm)} BPM
        </Text>
        <Small>{song.meter} · count-in of one bar</Small>
      </Row>
      <Row>
        <Chip label="−5" disabled={busy} onPress={() => setBpm((b) => tenth(Math.max(30, b - 5)))} />
        <Chip label="−1" disabled={busy} onPress={() => setBpm((b) => tenth(Math.max(30, b - 1)))} />
        <Chip label="+1" disabled={busy} onPress={() => setBpm((b) => tenth(Math.min(300, b + 1)))} />
        <Chip label="+5" disabled={busy} onPress={() => setBpm((b) => tenth(Math.min(300, b + 5)))} />
        <Level label="Click" value={clickVolume} onChange={setClickVolume} testID="record-click-level" />
      </Row>

      <View style={{ gap: space.xs }}>
        <Text style={[type.label, { color: colors.ink }]}>Latency</Text>
        <Text style={[type.small, { color: colors.muted }]} testID="latency">
          {calibration
            ? `${Math.round(calibration.latencyMs)} ms on this browser (measured ${formatDate(calibration.at)})`
            : 'Not measured on this browser yet: marks and takes may sit a little late.'}
        </Text>
        <Small>
          To measure it, press Measure, then hold a headphone to the microphone (or tap along on the desk) for{' '}
          {CALIBRATION_CLICKS} clicks after the count-in.
        </Small>
      </View>

      <Row>
        {phase === 'recording' ? (
          <Button label="Stop" onPress={() => void stop()} testID="record-stop" />
        ) : (
          <Button
            label="Start recording"
            onPress={() => void begin(false)}
            disabled={busy || phase === 'review'}
            testID="record-start"
          />
        )}
        <Button
          label={phase === 'calibrating' ? 'Measuring…' : 'Measure latency'}
          kind="secondary"
          onPress={() => void begin(true)}
          disabled={busy || phase === 'review'}
          testID="calibrate"
        />
      </Row>

      {busy ? (
        <View style={{ gap: space.xs }}>
          <ProgressBar value={Math.sqrt(level)} label="Input level" testID="input-level" />
          <Small>{level > 0.9 ? 'Input level: too loud, move back from the microphone' : 'Input level'}</Small>
        </View>
      ) : null}

      {phase === 'recording' ? <LiveBeatView marks={marks} placeOf={(m) => barBeat(m.beat, perBar)} /> : null}

      {take && phase === 'review' ? (
        <TakeReview
          take={take}
          songId={song.id}
          defaultLabel={`Recorded at ${formatBpm(bpm)} BPM`}
          fileName={`Take at ${formatBpm(bpm)} BPM.wav`}
          onKept={kept}
          onDiscarded={discarded}
        />
      ) : null}

      {note ? <Notice tone="info">{note}</Notice> : null}
      {error ? <Notice tone="error">{error}</Notice> : null}
    </Card>
  );
}
