// The audition player's life on the recording screen: an AuditionPlayer (client/player.ts) made and loaded for
// the recording, disposed with the screen, and the state the screen shows of it: loaded or failed, playing,
// tempo, loop, count-in, click and levels. Every change goes to the player and to that state together.
import { useCallback, useEffect, useRef, useState } from 'react';
import { Platform } from 'react-native';
import { AuditionPlayer, MAX_SPEED, MIN_SPEED, type PlayerGrid } from '@/client/player';
import { DEFAULT_CLICK_GAIN } from '@/client/click-sound';
import { skipBar, type Grid, type Passage } from '@/audio/practice/passage';
import { tenth } from '@/shared/format';
import { usePreferences } from '@/client/hooks';

export type AuditionPlayerState = ReturnType<typeof useAuditionPlayer>;

export function useAuditionPlayer(audioUrl: string, grid: PlayerGrid & Grid) {
  const { originalBpm } = grid;
  const player = useRef<AuditionPlayer | null>(null);
  /** The grid the player now has (the one it was made with, or the last correction). */
  const madeWith = useRef(grid);
  /** Called at each pass through the loop (the step-up run listens here). */
  const onLoopPassRef = useRef<(() => void) | null>(null);
  const [ready, setReady] = useState(false);
  const [failure, setFailure] = useState<string | null>(null);
  const [playing, setPlaying] = useState(false);
  const [bpm, setBpmState] = useState(tenth(originalBpm));
  const [loop, setLoopState] = useState<Passage | null>(null);
  const [countInOn, setCountInState] = useState(false);
  const [clickOn, setClickOnState] = useState(true);
  const [clickLevel, setClickLevelState] = useState(DEFAULT_CLICK_GAIN);
  const [musicLevel, setMusicLevelState] = useState(1);
  // The stretch method is the person's preference (Account); the player waits for it rather than load twice.
  const stretchMethod = usePreferences().preferences?.stretchMethod;

  // Web Audio exists only in the browser, and only after the first render (static rendering has no window).
  useEffect(() => {
    if (Platform.OS !== 'web' || !stretchMethod) return;
    const p = new AuditionPlayer(
      audioUrl,
      { beats: grid.beats, downbeats: grid.downbeats, originalBpm, meter: grid.meter },
      stretchMethod,
    );
    player.current = p;
    madeWith.current = grid;
    p.load().then(
      () => setReady(true),
      (e: Error) => setFailure(e.message),
    );
    p.onEnded = () => setPlaying(false);
    p.onLoopPass = () => onLoopPassRef.current?.();
    // The player benchmark (fixtures/bench-player.ts) reads the player's figures from here.
    (window as unknown as { tactusAudition?: AuditionPlayer }).tactusAudition = p;
    return () => {
      p.dispose();
      // A new player (another stretch method, say) is not ready until it has loaded.
      setReady(false);
    };
    // The grid the player starts with; a correction reaches it through setGrid below, without decoding again.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [audioUrl, stretchMethod]);

  // A corrected grid (beat level, bar one, nudge): the same player takes it; what is heard keeps its speed, so
  // the tempo shown is that speed on the new grid's tempo (twice the number at the doubled beat level).
  useEffect(() => {
    const p = player.current;
    if (!p || madeWith.current === grid) return;
    madeWith.current = grid;
    p.setGrid({ beats: grid.beats, downbeats: grid.downbeats, originalBpm, meter: grid.meter });
    setBpmState(tenth(p.playbackSpeed * originalBpm));
  }, [grid, originalBpm]);

  const getPosition = useCallback(() => player.current?.position() ?? 0, []);
  const getCountInBeat = useCallback(() => player.current?.countInBeat() ?? null, []);

  /** Playback tempo in BPM, within the player's range, to a tenth. */
  const setBpm = useCallback(
    (next: number) => {
      const v = tenth(Math.max(originalBpm * MIN_SPEED, Math.min(originalBpm * MAX_SPEED, next)));
      setBpmState(v);
      player.current?.setBpm(v);
    },
    [originalBpm],
  );

  const play = useCallback(() => {
    const p = player.current;
    if (!p || p.playing) return;
    void p.play();
    setPlaying(true);
  }, []);
  /** Plays with the music starting at context time `at` (play-along starts it a margin after the microphone). */
  const playAt = useCallback(async (at: number) => {
    const p = player.current;
    if (!p || p.playing) return;
    setPlaying(true);
    await p.play(at);
  }, []);
  const pause = useCallback(() => {
    player.current?.pause();
    setPlaying(false);
  }, []);
  const togglePlay = useCallback(() => {
    const p = player.current;
    if (!p || !ready) return;
    if (p.playing) pause();
    else play();
  }, [ready, play, pause]);

  // Seeking outside the loop ends it (the player drops it; the screen follows).
  const seek = useCallback((sec: number) => {
    player.current?.seek(sec);
    if (player.current && !player.current.loopRegion) setLoopState(null);
  }, []);
  const skip = (dir: 1 | -1) => seek(skipBar(getPosition(), grid, dir));

  const setLoop = useCallback((p: Passage | null) => {
    setLoopState(p);
    player.current?.setLoop(p);
  }, []);

  /** A short listen with the click on another grid (another beat level): play for `seconds`, then back. */
  const listenTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const listen = (clickGrid: { beats: number[]; downbeats: number[] }, seconds: number) => {
    const p = player.current;
    if (!p || !ready) return;
    if (listenTimer.current) clearTimeout(listenTimer.current);
    p.clickOnGrid(clickGrid);
    play();
    listenTimer.current = setTimeout(() => {
      pause();
      p.clickOnGrid(null);
    }, seconds * 1000);
  };
  useEffect(
    () => () => {
      if (listenTimer.current) clearTimeout(listenTimer.current);
    },
    [],
  );

  const setCountIn = (on: boolean) => {
    if (player.current) player.current.countInOn = on;
    setCountInState(on);
  };
  const setClickOn = (on: boolean) => {
    if (player.current) player.current.clickOn = on;
    setClickOnState(on);
  };
  const setClickLevel = (v: number) => {
    player.current?.setClickVolume(v);
    setClickLevelState(v);
  };
  const setMusicLevel = (v: number) => {
    player.current?.setMusicVolume(v);
    setMusicLevelState(v);
  };

  return {
    player,
    onLoopPassRef,
    ready,
    failure,
    setFailure,
    playing,
    play,
    playAt,
    pause,
    togglePlay,
    getPosition,
    getCountInBeat,
    seek,
    skip,
    bpm,
    setBpm,
    loop,
    setLoop,
    listen,
    countInOn,
    setCountIn,
    clickOn,
    setClickOn,
    clickLevel,
    setClickLevel,
    musicLevel,
    setMusicLevel,
  };
}
