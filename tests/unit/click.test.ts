// Click scheduling (audio/playback/click.ts): clicks on the beat grid at the playback tempo, count-in, the
// metronome's timeline; on grids whose truth is exact by construction.
import { beatsPerBar, clicksBetween, countIn, MetronomeTimeline, PlaybackMap } from '@/audio/playback/click';

describe('click scheduling', () => {
  const beats = Array.from({ length: 600 }, (_, i) => 0.25 + i * 0.5); // 120 BPM for 5 minutes
  const downbeats = beats.filter((_, i) => i % 4 === 0);

  test('at 75 % every beat of a 5-minute grid maps to its playback time and back within 5 ms', () => {
    const map = new PlaybackMap(10, 0, 0.75);
    const clicks = clicksBetween(map, beats, downbeats, 10, 10 + 300 / 0.75 + 1);
    expect(clicks).toHaveLength(beats.length);
    for (const c of clicks) {
      expect(Math.abs(c.time - (10 + beats[c.beat]! / 0.75))).toBeLessThan(0.005);
      expect(Math.abs(map.recordingTime(c.time) - beats[c.beat]!)).toBeLessThan(0.005);
    }
    expect(clicks.filter((c) => c.accent)).toHaveLength(150);
  });

  test('a tempo change part-way keeps the musical position and the clicks on the beats', () => {
    const map = new PlaybackMap(0, 0, 1);
    map.changeSpeed(60, 0.8); // at one minute, slow to 96 BPM
    expect(map.recordingTime(60)).toBeCloseTo(60, 9);
    const clicks = clicksBetween(map, beats, downbeats, 0, 400);
    expect(clicks).toHaveLength(beats.length);
    const after = clicks.filter((c) => c.time > 60);
    // Beats after the change are 0.5 / 0.8 = 0.625 s apart.
    for (let i = 1; i < after.length; i++) expect(after[i]!.time - after[i - 1]!.time).toBeCloseTo(0.625, 6);
    for (const c of clicks) expect(Math.abs(map.recordingTime(c.time) - beats[c.beat]!)).toBeLessThan(0.005);
  });

  test.each([
    ['3/4', 3],
    ['4/4', 4],
  ])(
    'the count-in before %s is one bar: %p clicks, the first accented, a beat apart, ending a beat before the start',
    (meter, n) => {
      const clicks = countIn(5, beatsPerBar(meter), 90);
      expect(clicks).toHaveLength(n);
      expect(clicks[0]!.accent).toBe(true);
      expect(clicks.slice(1).every((c) => !c.accent)).toBe(true);
      expect(5 - clicks[n - 1]!.time).toBeCloseTo(60 / 90, 9);
      expect(clicks[1]!.time - clicks[0]!.time).toBeCloseTo(60 / 90, 9);
    },
  );

  test('compound meters count in dotted beats (common practice): 6/8 → 2, 12/8 → 4; 7/8 stays 7', () => {
    expect(beatsPerBar('6/8')).toBe(2);
    expect(beatsPerBar('12/8')).toBe(4);
    expect(beatsPerBar('7/8')).toBe(7);
    expect(beatsPerBar(null)).toBe(4);
  });

  test('click-only mode is a plain metronome: 150 BPM in 3/4 clicks 0.4 s apart, accenting every third', () => {
    const clicks = new MetronomeTimeline(1, 150, 3).clicksBetween(0, 1 + 4.8 - 1e-6);
    expect(clicks).toHaveLength(12);
    expect(clicks.filter((c) => c.accent).map((c) => c.time)).toEqual(
      [1, 1 + 1.2, 1 + 2.4, 1 + 3.6].map((t) => expect.closeTo(t, 9)),
    );
  });

  test('the metronome changes tempo from the next beat, scheduled in slices, dropping and doubling nothing', () => {
    const m = new MetronomeTimeline(0, 120, 4);
    const heard = [...m.clicksBetween(0, 1.1)]; // beats at 0, 0.5, 1.0
    m.change(1.1, 60); // the next beat (1.5 s) is the first at 60 BPM
    heard.push(...m.clicksBetween(1.1, 2.6), ...m.clicksBetween(2.6, 5.6));
    expect(heard.map((c) => c.time)).toEqual([0, 0.5, 1, 1.5, 2.5, 3.5, 4.5, 5.5].map((t) => expect.closeTo(t, 9)));
    // The bar keeps counting across the change: beats 0 and 4 are accented.
    expect(heard.map((c) => c.accent)).toEqual([true, false, false, false, true, false, false, false]);
    m.change(5.6, 60, 3); // a new meter starts its bar on the next beat (6.5 s)
    expect(m.clicksBetween(5.6, 9.6).map((c) => c.accent)).toEqual([true, false, false, true]);
  });
});
