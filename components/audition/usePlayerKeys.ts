// The player's keys on a wide screen: space plays and pauses, ← → skip a bar, ↑ ↓ change the tempo by 1 BPM,
// 1–9 hop to a candidate tempo. Typing in a text field is left alone.
import { useEffect, useRef } from 'react';
import { Platform } from 'react-native';

export function usePlayerKeys({
  togglePlay,
  skip,
  bpm,
  setBpm,
  candidateBpms,
}: {
  togglePlay: () => void;
  skip: (dir: 1 | -1) => void;
  bpm: number;
  setBpm: (bpm: number) => void;
  /** The song's candidate tempos in the order shown; keys 1–9 pick the first nine. */
  candidateBpms: number[] | undefined;
}) {
  // One listener for the screen's life, reading the latest render's state through the ref.
  const keys = useRef<(e: KeyboardEvent) => void>(() => undefined);
  useEffect(() => {
    keys.current = (e: KeyboardEvent) => {
      const target = e.target as HTMLElement | null;
      if (target && (target.tagName === 'INPUT' || target.tagName === 'TEXTAREA' || target.isContentEditable)) return;
      const candidate = /^[1-9]$/.test(e.key) ? candidateBpms?.[Number(e.key) - 1] : undefined;
      if (e.key === ' ') togglePlay();
      else if (e.key === 'ArrowLeft') skip(-1);
      else if (e.key === 'ArrowRight') skip(1);
      else if (e.key === 'ArrowUp') setBpm(bpm + 1);
      else if (e.key === 'ArrowDown') setBpm(bpm - 1);
      else if (candidate !== undefined) setBpm(candidate);
      else return;
      // Space plays and pauses wherever the focus is (outside text fields), so it must not also press the
      // focused button: taken in the capture phase and stopped here.
      e.preventDefault();
      e.stopPropagation();
    };
  });
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const listener = (e: KeyboardEvent) => keys.current(e);
    window.addEventListener('keydown', listener, true);
    return () => window.removeEventListener('keydown', listener, true);
  }, []);
}
