// The waveform as the player's map, for a recording of any length: an overview strip of the whole recording
// (playhead, loop, saved passages, the part shown below) and a detail view that follows the playhead, zoomed with
// pinch, the wheel or buttons from the whole recording down to about two bars. In the detail view a tap moves the
// playhead, a drag marks a passage (snapped by the screen) and the loop's edges are handles to adjust it.
import React, { useEffect, useMemo, useRef, useState } from 'react';
import { Platform, Text, View, type GestureResponderEvent, type LayoutChangeEvent } from 'react-native';
import { Chip, Field, Row } from '@/components/ui';
import { colors, space, type } from '@/components/theme';
import { WaveCanvas, LABEL_STRIP } from '@/components/waveform/WaveCanvas';
import { peakPyramid, windowAround, zoomLimits } from '@/components/waveform/view';
import type { Passage } from '@/audio/practice/passage';

const DETAIL_HEIGHT = 120;
const OVERVIEW_HEIGHT = 36;
/** A pointer that moves less than this is a tap (seek), more a drag (mark): about a fingertip's wobble. */
const DRAG_FROM_PX = 8;
/** A press this close to a loop edge takes the edge (a handle), wide enough for a finger (common practice: 44 px
 * targets, half each side of the line ≈ 14 px plus the line). */
const HANDLE_PX = 16;
/** Each zoom step halves or doubles the time shown. */
const ZOOM_STEP = 2;
/** While playing, the view turns a page when the playhead passes this share of it, and puts it back here. */
const PAGE_AT = 0.9;
const PAGE_TO = 0.1;

export interface MarkedRegion extends Passage {
  id: string;
  name: string;
}

/** A note on the recording: at a moment (`end` null) or on a stretch of it. */
export interface NoteMark {
  id: string;
  start: number;
  end: number | null;
}

/** Notes sit at the foot of both views in ink: a tick for a moment, a bar for a stretch. */
const NOTE_MARK_HEIGHT = 6;

export function PlayerWaveform({
  minMax,
  durationSec,
  beats,
  downbeats,
  getPosition,
  loop,
  passages,
  notes = [],
  onSeek,
  onSelect,
}: {
  minMax: number[];
  durationSec: number;
  beats: number[];
  downbeats: number[];
  /** Read ~10 times a second; only the playheads and page turns re-render. */
  getPosition: () => number;
  loop: Passage | null;
  /** Saved passages of this recording, shown on the overview. */
  passages: MarkedRegion[];
  /** Notes on this recording, marked on the overview and the detail view. */
  notes?: NoteMark[];
  onSeek: (sec: number) => void;
  /** A passage marked or adjusted (unsnapped times; the screen snaps them). */
  onSelect: (from: number, to: number) => void;
}) {
  const levels = useMemo(() => peakPyramid(minMax, durationSec), [minMax, durationSec]);
  const limits = useMemo(() => zoomLimits(durationSec, downbeats), [durationSec, downbeats]);
  const [width, setWidth] = useState(0);
  // A first view of about 16 bars: enough to see where one is, near enough to mark a passage.
  const [span, setSpan] = useState(() => Math.max(limits.min, Math.min(limits.max, 8 * limits.min)));
  const [from, setFrom] = useState(0);
  const to = Math.min(durationSec, from + span);
  // The window as the timers and DOM listeners read it (they outlive a render).
  const view = useRef({ from, span, dragging: false });
  useEffect(() => {
    view.current.from = from;
    view.current.span = span;
  }, [from, span]);

  // The view follows the playhead a page at a time (a moving picture would be hard to aim a drag at).
  useEffect(() => {
    const id = setInterval(() => {
      const { from: f, span: s, dragging } = view.current;
      if (dragging) return;
      const p = getPosition();
      if (p < f || p > f + s * PAGE_AT) setFrom(windowAround(p, s, durationSec, PAGE_TO).from);
    }, 100);
    return () => clearInterval(id);
  }, [getPosition, durationSec]);

  const zoomTo = (next: number, anchor?: number) => {
    const s = Math.max(limits.min, Math.min(limits.max, next));
    const { from: f, span: old } = view.current;
    const p = getPosition();
    const at = anchor ?? (p >= f && p <= f + old ? p : f + old / 2);
    // The anchor keeps its place on screen.
    const share = old > 0 ? (at - f) / old : 0.5;
    setSpan(s);
    setFrom(windowAround(at, s, durationSec, share).from);
  };

  // Wheel and pinch come from the DOM on the web (React Native's responder has neither).
  const detail = useRef<View>(null);
  const zoomRef = useRef(zoomTo);
  useEffect(() => {
    zoomRef.current = zoomTo;
  });
  useEffect(() => {
    const el = detail.current as unknown as HTMLElement | null;
    if (Platform.OS !== 'web' || !el?.addEventListener) return;
    const timeAt = (clientX: number) => {
      const r = el.getBoundingClientRect();
      return view.current.from + ((clientX - r.left) / Math.max(1, r.width)) * view.current.span;
    };
    const wheel = (e: WheelEvent) => {
      e.preventDefault();
      // About a factor of 2 per notch of a mouse wheel (100 px of deltaY).
      zoomRef.current(view.current.span * Math.pow(2, e.deltaY / 100), timeAt(e.clientX));
    };
    let pinch: { dist: number; span: number; at: number } | null = null;
    const dist = (t: TouchList) => Math.abs(t[0]!.clientX - t[1]!.clientX) + Math.abs(t[0]!.clientY - t[1]!.clientY);
    const touchStart = (e: TouchEvent) => {
      if (e.touches.length === 2)
        pinch = {
          dist: Math.max(1, dist(e.touches)),
          span: view.current.span,
          at: timeAt((e.touches[0]!.clientX + e.touches[1]!.clientX) / 2),
        };
    };
    const touchMove = (e: TouchEvent) => {
      if (!pinch || e.touches.length !== 2) return;
      e.preventDefault();
      zoomRef.current(pinch.span * (pinch.dist / Math.max(1, dist(e.touches))), pinch.at);
    };
    const touchEnd = (e: TouchEvent) => {
      if (e.touches.length < 2) pinch = null;
    };
    el.addEventListener('wheel', wheel, { passive: false });
    el.addEventListener('touchstart', touchStart, { passive: true });
    el.addEventListener('touchmove', touchMove, { passive: false });
    el.addEventListener('touchend', touchEnd);
    return () => {
      el.removeEventListener('wheel', wheel);
      el.removeEventListener('touchstart', touchStart);
      el.removeEventListener('touchmove', touchMove);
      el.removeEventListener('touchend', touchEnd);
    };
  }, [width]);

  // ── Gestures in the detail view ──
  const gesture = useRef<{ x0: number; t0: number; kind: 'tap' | 'mark' | 'start' | 'end' } | null>(null);
  const [draft, setDraft] = useState<Passage | null>(null);
  const xAt = (e: GestureResponderEvent, el: View | null) => {
    const node = el as unknown as { getBoundingClientRect?: () => DOMRect } | null;
    // On the web the element's own rectangle is the reliable origin (the touch may land on a child).
    if (Platform.OS === 'web' && node?.getBoundingClientRect)
      return e.nativeEvent.pageX - node.getBoundingClientRect().left - window.scrollX;
    return e.nativeEvent.locationX;
  };
  const secAt = (x: number) => Math.max(0, Math.min(durationSec, from + (x / Math.max(1, width)) * span));
  const xOf = (t: number) => ((t - from) / span) * width;

  const detailHandlers = {
    onStartShouldSetResponder: (e: GestureResponderEvent) => (e.nativeEvent.touches?.length ?? 1) < 2,
    onMoveShouldSetResponder: (e: GestureResponderEvent) => (e.nativeEvent.touches?.length ?? 1) < 2,
    onResponderTerminationRequest: () => false,
    onResponderGrant: (e: GestureResponderEvent) => {
      const x = xAt(e, detail.current);
      let kind: 'tap' | 'start' | 'end' = 'tap';
      if (loop && Math.abs(x - xOf(loop.end)) < HANDLE_PX) kind = 'end';
      else if (loop && Math.abs(x - xOf(loop.start)) < HANDLE_PX) kind = 'start';
      gesture.current = { x0: x, t0: secAt(x), kind };
      view.current.dragging = true;
    },
    onResponderMove: (e: GestureResponderEvent) => {
      const g = gesture.current;
      if (!g) return;
      const x = xAt(e, detail.current);
      const t = secAt(x);
      if (g.kind === 'tap' && Math.abs(x - g.x0) >= DRAG_FROM_PX) g.kind = 'mark';
      if (g.kind === 'mark') setDraft({ start: Math.min(g.t0, t), end: Math.max(g.t0, t) });
      else if (g.kind === 'start' && loop) setDraft({ start: Math.min(t, loop.end), end: loop.end });
      else if (g.kind === 'end' && loop) setDraft({ start: loop.start, end: Math.max(t, loop.start) });
    },
    onResponderRelease: (e: GestureResponderEvent) => {
      const g = gesture.current;
      gesture.current = null;
      view.current.dragging = false;
      const t = secAt(xAt(e, detail.current));
      if (!g) return;
      if (g.kind === 'tap') onSeek(g.t0);
      else if (g.kind === 'mark') onSelect(g.t0, t);
      else if (g.kind === 'start' && loop) onSelect(Math.min(t, loop.end), loop.end);
      else if (g.kind === 'end' && loop) onSelect(loop.start, Math.max(t, loop.start));
      setDraft(null);
    },
    onResponderTerminate: () => {
      gesture.current = null;
      view.current.dragging = false;
      setDraft(null);
    },
  };

  // ── The overview: tap or drag to go there ──
  const overview = useRef<View>(null);
  const overviewSec = (e: GestureResponderEvent) =>
    Math.max(0, Math.min(durationSec, (xAt(e, overview.current) / Math.max(1, width)) * durationSec));
  const shown = draft ?? loop;
  const pct = (t: number) => `${(t / durationSec) * 100}%` as const;

  const [goTo, setGoTo] = useState('');
  const whole = useRef<View>(null);
  const goToBar = () => {
    const n = Math.round(Number(goTo));
    const t = downbeats[n - 1];
    if (t === undefined) return;
    onSeek(t);
    setFrom(windowAround(t, span, durationSec, PAGE_TO).from);
    // Typing in the field (and a phone's keyboard) scrolls the screen down to it, which can leave the top of the
    // waveform and its bar numbers out of sight: close the keyboard and bring the whole waveform back into view,
    // the least scroll that does it, to see the bar just gone to. On the web a View is its DOM element.
    if (typeof document !== 'undefined') (document.activeElement as HTMLElement | null)?.blur?.();
    (whole.current as unknown as HTMLElement | null)?.scrollIntoView?.({ block: 'nearest' });
  };

  return (
    <View
      ref={whole}
      style={{ gap: space.sm }}
      onLayout={(e: LayoutChangeEvent) => setWidth(Math.max(1, Math.floor(e.nativeEvent.layout.width)))}
    >
      {width > 0 ? (
        <>
          <View
            ref={overview}
            testID="waveform-overview"
            accessibilityLabel="The whole recording: tap to go there"
            onStartShouldSetResponder={() => true}
            onMoveShouldSetResponder={() => true}
            onResponderGrant={(e) => onSeek(overviewSec(e))}
            onResponderMove={(e) => onSeek(overviewSec(e))}
            style={
              {
                height: OVERVIEW_HEIGHT,
                borderRadius: 4,
                backgroundColor: colors.paper,
                cursor: 'pointer',
                userSelect: 'none',
              } as object
            }
          >
            <View pointerEvents="none">
              <WaveCanvas
                levels={levels}
                from={0}
                to={durationSec}
                width={width}
                height={OVERVIEW_HEIGHT}
                beats={[]}
                downbeats={[]}
                showLabels={false}
              />
            </View>
            {passages.map((p) => (
              <View
                key={p.id}
                pointerEvents="none"
                style={{
                  position: 'absolute',
                  top: 0,
                  height: 6,
                  left: pct(p.start),
                  width: pct(p.end - p.start),
                  minWidth: 2,
                  backgroundColor: colors.teal,
                }}
              />
            ))}
            {notes.map((n) => (
              <View
                key={n.id}
                pointerEvents="none"
                testID="overview-note"
                style={{
                  position: 'absolute',
                  bottom: 0,
                  height: NOTE_MARK_HEIGHT,
                  left: pct(n.start),
                  width: n.end === null ? 3 : pct(n.end - n.start),
                  minWidth: 3,
                  backgroundColor: colors.ink,
                }}
              />
            ))}
            {shown ? (
              <View
                pointerEvents="none"
                style={{
                  position: 'absolute',
                  top: 0,
                  bottom: 0,
                  left: pct(shown.start),
                  width: pct(shown.end - shown.start),
                  minWidth: 2,
                  backgroundColor: colors.amber,
                  opacity: 0.35,
                }}
              />
            ) : null}
            <View
              pointerEvents="none"
              testID="overview-window"
              style={{
                position: 'absolute',
                top: 0,
                bottom: 0,
                left: pct(from),
                width: pct(to - from),
                borderWidth: 1.5,
                borderColor: colors.ink,
                borderRadius: 3,
              }}
            />
            <Playhead getPosition={getPosition} x={(p) => pct(p)} />
          </View>

          <View
            ref={detail}
            testID="player-waveform"
            accessibilityLabel="Tap to move the playhead, drag to mark a passage; drag the loop’s edges to adjust it"
            {...detailHandlers}
            style={{ position: 'relative', cursor: 'crosshair', userSelect: 'none', touchAction: 'pan-y' } as object}
          >
            <View pointerEvents="none">
              <WaveCanvas
                levels={levels}
                from={from}
                to={to}
                width={width}
                height={DETAIL_HEIGHT}
                beats={beats}
                downbeats={downbeats}
                testID="waveform"
              />
            </View>
            {shown && shown.end > from && shown.start < to ? (
              <View
                pointerEvents="none"
                testID="loop-region"
                style={{
                  position: 'absolute',
                  top: LABEL_STRIP,
                  bottom: 0,
                  left: Math.max(0, xOf(shown.start)),
                  width: Math.min(width, xOf(shown.end)) - Math.max(0, xOf(shown.start)),
                  backgroundColor: colors.amber,
                  opacity: 0.2,
                }}
              />
            ) : null}
            {loop && !draft
              ? [loop.start, loop.end].map((t, i) =>
                  t >= from && t <= to ? (
                    <View
                      key={i}
                      pointerEvents="none"
                      testID={i === 0 ? 'loop-start-handle' : 'loop-end-handle'}
                      style={{
                        position: 'absolute',
                        top: LABEL_STRIP,
                        bottom: 0,
                        left: xOf(t) - 2,
                        width: 4,
                        backgroundColor: colors.amber,
                      }}
                    >
                      <View
                        style={{
                          position: 'absolute',
                          top: DETAIL_HEIGHT / 2 - 14,
                          left: -6,
                          width: 16,
                          height: 28,
                          borderRadius: 5,
                          backgroundColor: colors.amber,
                        }}
                      />
                    </View>
                  ) : null,
                )
              : null}
            {notes
              .filter((n) => (n.end ?? n.start) >= from && n.start <= to)
              .map((n) => (
                <View
                  key={n.id}
                  pointerEvents="none"
                  testID="detail-note"
                  style={{
                    position: 'absolute',
                    bottom: 0,
                    height: NOTE_MARK_HEIGHT,
                    left: Math.max(0, xOf(n.start)) - (n.end === null ? 1.5 : 0),
                    width: n.end === null ? 3 : Math.min(width, xOf(n.end)) - Math.max(0, xOf(n.start)),
                    backgroundColor: colors.ink,
                  }}
                />
              ))}
            <Playhead getPosition={getPosition} x={(p) => (p < from || p > to ? null : xOf(p))} top={LABEL_STRIP} />
          </View>
        </>
      ) : null}
      <Row>
        <Chip
          label="−"
          hint="Zoom out: show more of the recording"
          onPress={() => zoomTo(span * ZOOM_STEP)}
          testID="zoom-out"
        />
        <Chip label="+" hint="Zoom in: show fewer bars" onPress={() => zoomTo(span / ZOOM_STEP)} testID="zoom-in" />
        <Chip
          label="Whole song"
          selected={span >= limits.max - 1e-6}
          onPress={() => zoomTo(limits.max)}
          testID="zoom-all"
        />
        <View style={{ width: 96 }}>
          <Field
            label="Go to bar"
            value={goTo}
            onChangeText={setGoTo}
            inputMode="numeric"
            onSubmitEditing={goToBar}
            testID="go-to-bar"
          />
        </View>
        <Text style={[type.small, { color: colors.muted }]} testID="zoom-readout">
          {Math.round(to - from)} s shown
        </Text>
      </Row>
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

function Playhead({
  getPosition,
  x,
  top = 0,
}: {
  getPosition: () => number;
  x: (sec: number) => number | `${number}%` | null;
  top?: number;
}) {
  const left = x(usePolled(getPosition));
  if (left === null) return null;
  return (
    <View
      pointerEvents="none"
      testID="playhead"
      style={{ position: 'absolute', top, bottom: 0, left, width: 2, marginLeft: -1, backgroundColor: colors.danger }}
    />
  );
}
