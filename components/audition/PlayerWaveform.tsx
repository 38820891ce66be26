// The waveform as the player's map: beat grid and bar numbers (Waveform), the loop region, the playhead, and
// the surface itself to tap or drag on: to seek, or, while choosing a passage, to mark it.
import React, { memo, useEffect, useRef, useState } from 'react';
import { Platform, View, type GestureResponderEvent, type LayoutChangeEvent } from 'react-native';
import { Waveform } from '@/components/Waveform';
import { colors } from '@/components/theme';
import type { Passage } from '@/audio/practice/passage';

const StillWaveform = memo(Waveform);

export function PlayerWaveform({
  minMax,
  durationSec,
  beats,
  downbeats,
  getPosition,
  loop,
  selecting,
  onSeek,
  onSelect,
}: {
  minMax: number[];
  durationSec: number;
  beats: number[];
  downbeats: number[];
  /** Read ~20 times a second; only the playhead re-renders. */
  getPosition: () => number;
  loop: Passage | null;
  /** While true a drag marks a passage instead of seeking. */
  selecting: boolean;
  onSeek: (sec: number) => void;
  onSelect: (from: number, to: number) => void;
}) {
  const box = useRef<View>(null);
  const width = useRef(1);
  const dragFrom = useRef<number | null>(null);
  const [draft, setDraft] = useState<Passage | null>(null);

  // Seconds under the pointer. On the web the element's own rectangle is the reliable origin (the touch may
  // land on a child column); elsewhere locationX is already relative to the surface.
  const secondsAt = (e: GestureResponderEvent) => {
    let x = e.nativeEvent.locationX;
    const el = box.current as unknown as { getBoundingClientRect?: () => DOMRect } | null;
    if (Platform.OS === 'web' && el?.getBoundingClientRect) x = e.nativeEvent.pageX - el.getBoundingClientRect().left - window.scrollX;
    return Math.max(0, Math.min(durationSec, (x / width.current) * durationSec));
  };

  const pct = (t: number) => `${(t / durationSec) * 100}%` as const;
  const shown = draft ?? loop;
  return (
    <View
      ref={box}
      testID="player-waveform"
      accessibilityLabel={selecting ? 'Drag across the waveform to mark a passage' : 'Tap or drag on the waveform to move the playhead'}
      onLayout={(e: LayoutChangeEvent) => (width.current = Math.max(1, e.nativeEvent.layout.width))}
      onStartShouldSetResponder={() => true}
      onMoveShouldSetResponder={() => true}
      onResponderGrant={(e) => {
        const t = secondsAt(e);
        dragFrom.current = t;
        if (selecting) setDraft({ start: t, end: t });
        else onSeek(t);
      }}
      onResponderMove={(e) => {
        const t = secondsAt(e);
        if (selecting && dragFrom.current !== null) setDraft({ start: Math.min(dragFrom.current, t), end: Math.max(dragFrom.current, t) });
        else if (!selecting) onSeek(t);
      }}
      onResponderRelease={(e) => {
        const t = secondsAt(e);
        if (selecting && dragFrom.current !== null) onSelect(dragFrom.current, t);
        dragFrom.current = null;
        setDraft(null);
      }}
      style={{ position: 'relative', cursor: selecting ? 'crosshair' : 'pointer', userSelect: 'none' } as object}
    >
      <View pointerEvents="none">
        <StillWaveform minMax={minMax} durationSec={durationSec} beats={beats} downbeats={downbeats} height={110} testID="waveform" />
      </View>
      {shown ? (
        <View
          pointerEvents="none"
          testID="loop-region"
          style={{ position: 'absolute', top: 0, bottom: 0, left: pct(shown.start), width: pct(shown.end - shown.start), backgroundColor: colors.amber, opacity: 0.18, borderLeftWidth: 2, borderRightWidth: 2, borderColor: colors.amber }}
        />
      ) : null}
      <Playhead getPosition={getPosition} durationSec={durationSec} />
    </View>
  );
}

/** A value read from outside React (the audio clock) every `everyMs`; the latest `read` is always used. */
export function usePolled<T>(read: () => T, everyMs = 50): T {
  const [value, setValue] = useState(read);
  const latest = useRef(read);
  useEffect(() => {
    latest.current = read;
  });
  useEffect(() => {
    const id = setInterval(() => setValue(latest.current()), everyMs);
    return () => clearInterval(id);
  }, [everyMs]);
  return value;
}

function Playhead({ getPosition, durationSec }: { getPosition: () => number; durationSec: number }) {
  const position = usePolled(getPosition);
  return (
    <View pointerEvents="none" testID="playhead"
      style={{ position: 'absolute', top: 0, bottom: 0, left: `${(position / durationSec) * 100}%`, width: 2, marginLeft: -1, backgroundColor: colors.danger }} />
  );
}
