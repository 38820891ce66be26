// The one plotting layer of Tactus: lines of {x, y} points on react-native-svg, scaled by d3-scale and drawn by
// d3-shape, with labelled horizontal reference lines, shaded x-ranges and axis ticks thinned so their labels
// never touch. It measures its own width, so one chart serves a phone and a desktop. The tempo curve, the
// steadiness report and the practice charts are all drawn with it.
import React, { useMemo, useState } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import { scaleLinear } from 'd3-scale';
import { line } from 'd3-shape';
import { colors, fonts, space } from '@/components/theme';
import { Small } from '@/components/ui';

export interface Point {
  x: number;
  y: number;
}

export interface Series {
  id: string;
  /** Shown in the legend (when there is more than one series) and read out in the summary. */
  label: string;
  points: Point[];
  color?: string;
  /** SVG dash pattern ("6 4"); lines differ by dash as well as colour. */
  dash?: string;
  width?: number;
}

export interface ReferenceLine {
  y: number;
  /** Written beside the line, e.g. "goal 112". */
  label: string;
  color?: string;
  dash?: string;
}

export interface XRange {
  from: number;
  to: number;
  /** Written at the top of the band (e.g. "rushing"), so a band never means something by colour alone. */
  label?: string;
  color?: string;
}

export interface LineChartProps {
  series: Series[];
  referenceLines?: ReferenceLine[];
  ranges?: XRange[];
  /** Defaults to the data's extent. */
  xDomain?: [number, number];
  /** Defaults to the data's and reference lines' extent; rounded outward to nice ticks either way. */
  yDomain?: [number, number];
  /** Only whole-number x ticks (bars, days). */
  integerX?: boolean;
  /** Allowed x tick steps, smallest first, counted from `xTickOrigin` (see TickOptions). */
  xTickSteps?: number[];
  xTickOrigin?: number;
  formatX?: (x: number) => string;
  formatY?: (y: number) => string;
  /** Axis names, e.g. "bar" and "BPM". */
  xLabel?: string;
  yLabel?: string;
  height?: number;
  /** What a screen reader hears instead of the picture: say what the chart shows in words. */
  accessibilityLabel: string;
  testID?: string;
}

/** Tick and line labels: the small type size of the app, still readable on a phone. */
const FONT_SIZE = 12;
/** Average advance of a digit or lower-case letter in Manrope, as a share of the font size (from memory: most
 * sans faces set digits at 0.55–0.6 em; the larger figure errs on the side of more space). */
const CHAR_WIDTH_EM = 0.6;
/** Least empty space between two tick labels, in pixels. */
const LABEL_GAP = 10;
/** Width drawn before the first layout measurement arrives (and where there is none, as in tests). */
const INITIAL_WIDTH = 320;
/** Dots mark the points while they are at least this far apart; closer, they would only thicken the line. */
const DOT_SPACING = 14;
/** At most one point per this many pixels goes into a path; more are invisible and only weigh the page. */
const PX_PER_POINT = 2;

export const textWidth = (text: string, fontSize = FONT_SIZE) => text.length * fontSize * CHAR_WIDTH_EM;

const extent = (xs: number[]): [number, number] => [Math.min(...xs), Math.max(...xs)];

/** What fitTicks needs of a d3 linear scale. */
interface TickScale {
  (value: number): number;
  ticks(count: number): number[];
  domain(): number[];
}

export interface TickOptions {
  /** Only whole numbers (bars, days). */
  integer?: boolean;
  /** Allowed steps, smallest first, counted from `origin` (bars by phrase: 1, 2, 4, 8 … from bar 1). */
  steps?: number[];
  origin?: number;
}

/**
 * Ticks for a scale whose labels never touch: each label's centre at least half of both labels' measured widths
 * plus LABEL_GAP from the next. With `steps`, the smallest step that fits; otherwise d3's nice ticks for as many
 * as the length allows at the widest label's size, then every second, third … tick until they fit, so the
 * spacing stays even.
 */
export function fitTicks(
  scale: TickScale,
  length: number,
  labelSize: (v: number) => number,
  options: TickOptions = {},
): number[] {
  const fits = (ticks: number[]) =>
    ticks.every(
      (t, i) =>
        i === 0 ||
        Math.abs(scale(t) - scale(ticks[i - 1]!)) >= (labelSize(t) + labelSize(ticks[i - 1]!)) / 2 + LABEL_GAP,
    );
  const [lo, hi] = extent(scale.domain());
  if (options.steps?.length) {
    const origin = options.origin ?? 0;
    const at = (step: number) => {
      const out: number[] = [];
      for (let t = origin + Math.ceil((lo - origin) / step - 1e-9) * step; t <= hi + 1e-9; t += step) out.push(t);
      return out;
    };
    return options.steps.map(at).find(fits) ?? at(options.steps[options.steps.length - 1]!).slice(0, 1);
  }
  const whole = (ticks: number[]) => ticks.filter((t) => !options.integer || Number.isInteger(t));
  const widest = Math.max(FONT_SIZE, ...whole(scale.ticks(10)).map(labelSize));
  const candidates = whole(scale.ticks(Math.max(2, Math.floor(length / (widest + LABEL_GAP)))));
  for (let every = 1; every <= candidates.length; every++) {
    const kept = candidates.filter((_, i) => i % every === 0);
    if (fits(kept)) return kept;
  }
  return candidates.slice(0, 1);
}

/** Positions for labels wanted at `ys` (pixels) that keep them at least `gap` apart inside [top, bottom]. */
export function spreadLabels(ys: number[], gap: number, top: number, bottom: number): number[] {
  const order = ys.map((y, i) => ({ y, i })).sort((a, b) => a.y - b.y);
  const placed = order.map((o) => o.y);
  for (let k = 0; k < placed.length; k++) placed[k] = Math.max(placed[k]!, k === 0 ? top : placed[k - 1]! + gap);
  // Pushed past the bottom: slide the stack back up.
  for (let k = placed.length - 1; k >= 0; k--)
    placed[k] = Math.min(placed[k]!, k === placed.length - 1 ? bottom : placed[k + 1]! - gap);
  const out = new Array<number>(ys.length);
  order.forEach((o, k) => (out[o.i] = placed[k]!));
  return out;
}

/** One label over a shaded x-range: its centre and its row above the plot (0 is the row nearest to it). */
export interface RangeLabelPlace {
  x: number;
  row: number;
}

/**
 * Places the labels of shaded x-ranges (wanted centred at `centres`, `widths` wide) inside [minX, maxX] so none
 * touches another: each goes on the lowest row where it clears the labels already there, so neighbouring bands
 * ("rushes", "rubato", "rushes") all stay readable instead of printing over each other.
 */
export function placeRangeLabels(centres: number[], widths: number[], minX: number, maxX: number): RangeLabelPlace[] {
  const rows: { from: number; to: number }[][] = [];
  return centres.map((c, i) => {
    const half = widths[i]! / 2;
    const x = Math.min(Math.max(c, minX + half), Math.max(minX + half, maxX - half));
    const span = { from: x - half - LABEL_GAP / 2, to: x + half + LABEL_GAP / 2 };
    let row = rows.findIndex((taken) => taken.every((t) => span.to <= t.from || span.from >= t.to));
    if (row < 0) row = rows.push([]) - 1;
    rows[row]!.push(span);
    return { x, row };
  });
}

/** Points thinned to what `width` pixels can show: per column of PX_PER_POINT, the lowest and highest kept in order. */
export function thinPoints(points: Point[], toPx: (x: number) => number, width: number): Point[] {
  if (points.length <= width / PX_PER_POINT) return points;
  const out: Point[] = [];
  let column = NaN;
  let lo: Point | null = null;
  let hi: Point | null = null;
  const flush = () => {
    if (!lo || !hi) return;
    if (lo === hi) out.push(lo);
    else out.push(...(lo.x < hi.x ? [lo, hi] : [hi, lo]));
  };
  for (const p of points) {
    const c = Math.floor(toPx(p.x) / PX_PER_POINT);
    if (c !== column) {
      flush();
      column = c;
      lo = hi = p;
    } else {
      if (p.y < lo!.y) lo = p;
      if (p.y > hi!.y) hi = p;
    }
  }
  flush();
  return out;
}

export function LineChart({
  series,
  referenceLines = [],
  ranges = [],
  xDomain,
  yDomain,
  integerX,
  xTickSteps,
  xTickOrigin,
  formatX = String,
  formatY = String,
  xLabel,
  yLabel,
  height = 220,
  accessibilityLabel,
  testID,
}: LineChartProps) {
  const [width, setWidth] = useState(INITIAL_WIDTH);
  const onLayout = (e: LayoutChangeEvent) => {
    const w = Math.round(e.nativeEvent.layout.width);
    if (w > 0 && w !== width) setWidth(w);
  };

  const chart = useMemo(() => {
    const all = series.flatMap((s) => s.points);
    const [x0, x1] = xDomain ?? (all.length ? extent(all.map((p) => p.x)) : [0, 1]);
    const [y0, y1] =
      yDomain ??
      (all.length || referenceLines.length
        ? extent([...all.map((p) => p.y), ...referenceLines.map((r) => r.y)])
        : [0, 1]);
    // A single x or y value still needs a span to be drawn in the middle of.
    const xs: [number, number] = x1 > x0 ? [x0, x1] : [x0 - 0.5, x0 + 0.5];
    const ys: [number, number] = y1 > y0 ? [y0, y1] : [y0 - 1, y0 + 1];

    const y = scaleLinear().domain(ys).nice();
    const yTickProbe = y.ticks(10);
    const left =
      Math.ceil(Math.max(...yTickProbe.map((t) => textWidth(formatY(t))), textWidth(yLabel ?? ''))) + space.sm;
    const right = referenceLines.length
      ? Math.ceil(Math.max(...referenceLines.map((r) => textWidth(r.label)))) + space.sm * 2
      : space.md;
    const bottom = FONT_SIZE + space.md + (xLabel ? FONT_SIZE + space.xs : 0);
    const plotW = Math.max(40, width - left - right);
    const x = scaleLinear()
      .domain(xs)
      .range([left, left + plotW]);
    const labelled = ranges.filter((r) => r.label);
    const rangeLabels = placeRangeLabels(
      labelled.map((r) => (x(r.from) + x(r.to)) / 2),
      labelled.map((r) => textWidth(r.label!)),
      0,
      width,
    );
    const labelRows = rangeLabels.length ? Math.max(...rangeLabels.map((l) => l.row)) + 1 : 0;
    const top = FONT_SIZE + space.md + labelRows * (FONT_SIZE + space.xs);
    // Rows of range labels beyond the first add to the drawing's height rather than take it from the plot.
    const drawnHeight = height + Math.max(0, labelRows - 1) * (FONT_SIZE + space.xs);
    const plotH = Math.max(40, drawnHeight - top - bottom);
    y.range([top + plotH, top]);
    const xTicks = fitTicks(x, plotW, (t) => textWidth(formatX(t)), {
      integer: integerX,
      steps: xTickSteps,
      origin: xTickOrigin,
    });
    // Vertically a label needs its own line height, whatever its width.
    const yTicks = fitTicks(y, plotH, () => FONT_SIZE);

    const path = line<Point>()
      .x((p) => Math.round(x(p.x) * 10) / 10)
      .y((p) => Math.round(y(p.y) * 10) / 10)
      .defined((p) => Number.isFinite(p.y));
    const drawn = series.map((s) => {
      const points = thinPoints(s.points, x, plotW);
      return {
        ...s,
        d: path(points) ?? '',
        // A gap (a point without a value) has no dot.
        dots:
          s.points.length > 0 && plotW / s.points.length >= DOT_SPACING
            ? s.points.filter((p) => Number.isFinite(p.y))
            : [],
      };
    });
    const refYs = spreadLabels(
      referenceLines.map((r) => y(r.y)),
      FONT_SIZE + 2,
      top + FONT_SIZE / 2,
      top + plotH - FONT_SIZE / 2,
    );
    return { x, y, left, top, plotW, plotH, xTicks, yTicks, drawn, refYs, labelled, rangeLabels, drawnHeight };
  }, [
    series,
    referenceLines,
    ranges,
    xDomain,
    yDomain,
    integerX,
    xTickSteps,
    xTickOrigin,
    formatX,
    formatY,
    xLabel,
    yLabel,
    width,
    height,
  ]);

  const { x, y, left, top, plotW, plotH, xTicks, yTicks, drawn, refYs, labelled, rangeLabels, drawnHeight } = chart;
  const label = { fontFamily: fonts.body, fontSize: FONT_SIZE };

  return (
    <View style={{ width: '100%', gap: space.xs }}>
      <View
        onLayout={onLayout}
        style={{ width: '100%', height: drawnHeight }}
        role="img"
        accessibilityLabel={accessibilityLabel}
        testID={testID}
      >
        <Svg width={width} height={drawnHeight}>
          {ranges.map((r, i) => (
            <G key={`range-${i}`}>
              <Rect
                x={x(r.from)}
                y={top}
                width={Math.max(1, x(r.to) - x(r.from))}
                height={plotH}
                fill={r.color ?? colors.amberSoft}
                opacity={0.7}
              />
            </G>
          ))}
          {labelled.map((r, i) => (
            <SvgText
              key={`range-label-${i}`}
              x={rangeLabels[i]!.x}
              y={top - space.xs - rangeLabels[i]!.row * (FONT_SIZE + space.xs)}
              textAnchor="middle"
              fill={colors.muted}
              {...label}
            >
              {r.label}
            </SvgText>
          ))}
          {yTicks.map((t) => (
            <G key={`y-${t}`}>
              <Line x1={left} x2={left + plotW} y1={y(t)} y2={y(t)} stroke={colors.line} strokeWidth={1} />
              <SvgText x={left - space.xs} y={y(t) + FONT_SIZE / 3} textAnchor="end" fill={colors.muted} {...label}>
                {formatY(t)}
              </SvgText>
            </G>
          ))}
          <Line x1={left} x2={left + plotW} y1={top + plotH} y2={top + plotH} stroke={colors.muted} strokeWidth={1} />
          {xTicks.map((t) => (
            <G key={`x-${t}`}>
              <Line
                x1={x(t)}
                x2={x(t)}
                y1={top + plotH}
                y2={top + plotH + space.xs}
                stroke={colors.muted}
                strokeWidth={1}
              />
              <SvgText
                x={x(t)}
                y={top + plotH + space.xs + FONT_SIZE}
                textAnchor="middle"
                fill={colors.muted}
                {...label}
              >
                {formatX(t)}
              </SvgText>
            </G>
          ))}
          {yLabel ? (
            <SvgText x={left - space.xs} y={FONT_SIZE} textAnchor="end" fill={colors.muted} {...label}>
              {yLabel}
            </SvgText>
          ) : null}
          {xLabel ? (
            <SvgText x={left + plotW / 2} y={drawnHeight - space.xs} textAnchor="middle" fill={colors.muted} {...label}>
              {xLabel}
            </SvgText>
          ) : null}
          {referenceLines.map((r, i) => (
            <G key={`ref-${i}`} testID={`reference-line-${i}`}>
              <Line
                x1={left}
                x2={left + plotW}
                y1={y(r.y)}
                y2={y(r.y)}
                stroke={r.color ?? colors.muted}
                strokeWidth={1.5}
                strokeDasharray={r.dash}
              />
              <SvgText
                x={left + plotW + space.sm}
                y={refYs[i]! + FONT_SIZE / 3}
                fill={r.color ?? colors.muted}
                {...label}
              >
                {r.label}
              </SvgText>
            </G>
          ))}
          {drawn.map((s) => (
            <G key={s.id}>
              <Path
                testID={`series-${s.id}`}
                d={s.d}
                fill="none"
                stroke={s.color ?? colors.teal}
                strokeWidth={s.width ?? 2}
                strokeDasharray={s.dash}
                strokeLinejoin="round"
                strokeLinecap="round"
              />
              {s.dots.map((p, i) => (
                <Circle key={i} cx={x(p.x)} cy={y(p.y)} r={3} fill={s.color ?? colors.teal} />
              ))}
            </G>
          ))}
        </Svg>
      </View>
      {series.length > 1 ? (
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>
          {series.map((s) => (
            <View key={s.id} style={{ flexDirection: 'row', alignItems: 'center', gap: space.xs }}>
              <Svg width={24} height={FONT_SIZE}>
                <Line
                  x1={0}
                  x2={24}
                  y1={FONT_SIZE / 2}
                  y2={FONT_SIZE / 2}
                  stroke={s.color ?? colors.teal}
                  strokeWidth={s.width ?? 2}
                  strokeDasharray={s.dash}
                />
              </Svg>
              <Small>{s.label}</Small>
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}
