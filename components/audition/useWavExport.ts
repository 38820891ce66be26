// Export as WAV: the recording, or the looped passage, rendered at the tempo being heard (pitch kept) and handed
// to the browser as a download named after the song, the passage and the tempo.
import { useState } from 'react';
import { describePassage, type Passage } from '@/audio/practice/passage';
import { exportFileName } from '@/audio/playback/export';
import type { AuditionPlayerState } from './useAuditionPlayer';

/** Long enough for the browser to start saving the file before its object URL is let go. */
const REVOKE_AFTER_MS = 60_000;
/** Long enough for the button to be painted busy before the render, which blocks the page, begins. */
const PAINT_FIRST_MS = 30;

export function useWavExport({
  audition,
  downbeats,
  name,
}: {
  audition: AuditionPlayerState;
  downbeats: number[];
  name: string;
}) {
  const { player, bpm, setFailure } = audition;
  /** What is being rendered ("the recording", "bar 2"), or null. */
  const [exporting, setExporting] = useState<string | null>(null);

  const exportWav = async (passage: Passage | null) => {
    const p = player.current;
    if (!p) return;
    const label = passage ? describePassage(passage, downbeats) : null;
    setExporting(label ?? 'the recording');
    await new Promise((r) => setTimeout(r, PAINT_FIRST_MS));
    try {
      const wav = await p.renderWav(bpm, passage);
      const url = URL.createObjectURL(new Blob([wav as BlobPart], { type: 'audio/wav' }));
      const link = document.createElement('a');
      link.href = url;
      link.download = exportFileName(name, bpm, label);
      document.body.appendChild(link);
      link.click();
      link.remove();
      setTimeout(() => URL.revokeObjectURL(url), REVOKE_AFTER_MS);
    } catch (e) {
      setFailure(`The export failed: ${(e as Error).message}`);
    } finally {
      setExporting(null);
    }
  };

  return { exporting, exportWav };
}
