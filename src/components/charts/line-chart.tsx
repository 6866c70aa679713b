import { useState } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';

import { colors, fonts, spacing } from '../../theme';
import { Text } from '../ui';

import { linearScale, niceDomain, tickFormatter } from './scale';

export type ChartPoint = { x: number; y: number };
export type ChartSeries = { id: string; points: ChartPoint[]; color?: string; label?: string };

export interface LineChartProps {
  title: string;
  xLabel: string;
  yLabel: string;
  series: ChartSeries[];
  /** A limit drawn as a dashed horizontal line in the heat or cold accent. */
  limit?: { y: number; label: string; tone: 'heat' | 'cold' } | null;
  /** The chosen value drawn as a marker with its label. */
  marker?: { x: number; y: number; label: string } | null;
  /** Thin vertical guides (layer faces). */
  guides?: { x: number; label?: string }[];
  /** Data points drawn as small open circles (e.g. the table a curve was fitted to). */
  dots?: ChartPoint[];
  formatX?: (x: number) => string;
  formatY?: (y: number) => string;
  /** What the chart shows, in words, for screen readers (and shown to nobody else). */
  summary: string;
  height?: number;
  testID?: string;
}

const PAD = { left: 52, right: 16, top: 14, bottom: 42 };
const TICK_FONT = 11;

/**
 * Our line chart: thin lines on a sunk plot area, the limit dashed in an accent, the chosen point
 * marked with its value, labelled axes with units. It sizes itself to its container.
 */
export function LineChart({ title, xLabel, yLabel, series, limit, marker, guides, dots, formatX, formatY, summary, height = 220, testID }: LineChartProps) {
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.round(e.nativeEvent.layout.width));

  const xs = series.flatMap((s) => s.points.map((p) => p.x));
  const ys = series.flatMap((s) => s.points.map((p) => p.y));
  for (const p of dots ?? []) {
    xs.push(p.x);
    ys.push(p.y);
  }
  if (limit) ys.push(limit.y);
  if (marker) {
    xs.push(marker.x);
    ys.push(marker.y);
  }
  const xDom = niceDomain(Math.min(...xs), Math.max(...xs), width < 420 ? 4 : 7);
  const yDom = niceDomain(Math.min(...ys), Math.max(...ys), 5);
  const plotW = Math.max(10, width - PAD.left - PAD.right);
  const plotH = height - PAD.top - PAD.bottom;
  const sx = linearScale(xDom.min, xDom.max, PAD.left, PAD.left + plotW);
  const sy = linearScale(yDom.min, yDom.max, PAD.top + plotH, PAD.top);
  const accent = limit?.tone === 'cold' ? colors.cold : colors.heat;
  const fx = formatX ?? tickFormatter(xDom.ticks);
  const fy = formatY ?? tickFormatter(yDom.ticks);
  // The marker's label sits above its point; the limit's label moves below its line when they would meet.
  const markerLabelY = marker ? Math.max(PAD.top + 12, sy(marker.y) - 8) : -100;
  const limitLabelBelow = limit ? Math.abs(sy(limit.y) - 5 - markerLabelY) < 16 || sy(limit.y) - 5 < PAD.top + 10 : false;

  const path = (pts: ChartPoint[]) =>
    pts
      .filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y))
      .map((p, i) => `${i === 0 ? 'M' : 'L'}${sx(p.x).toFixed(1)},${sy(p.y).toFixed(1)}`)
      .join(' ');

  const hasData = xs.length > 0 && ys.every(Number.isFinite);

  return (
    <View style={styles.wrap} testID={testID}>
      <Text variant="label">{title}</Text>
      <View onLayout={onLayout} role="img" aria-label={`${title}. ${summary}`} style={{ height }}>
        {width > 0 && hasData ? (
          <Svg width={width} height={height} aria-hidden>
            <Rect x={PAD.left} y={PAD.top} width={plotW} height={plotH} fill={colors.surfaceSunk} />
            {yDom.ticks.map((t) => (
              <G key={`y${t}`}>
                <Line x1={PAD.left} x2={PAD.left + plotW} y1={sy(t)} y2={sy(t)} stroke={colors.border} strokeWidth={1} />
                <SvgText x={PAD.left - 6} y={sy(t) + 4} fontSize={TICK_FONT} fontFamily={fonts.regular} fill={colors.textMuted} textAnchor="end">
                  {fy(t)}
                </SvgText>
              </G>
            ))}
            {xDom.ticks.map((t) => (
              <SvgText key={`x${t}`} x={sx(t)} y={PAD.top + plotH + 15} fontSize={TICK_FONT} fontFamily={fonts.regular} fill={colors.textMuted} textAnchor="middle">
                {fx(t)}
              </SvgText>
            ))}
            {(guides ?? []).map((g, i) => (
              <Line key={`g${i}`} x1={sx(g.x)} x2={sx(g.x)} y1={PAD.top} y2={PAD.top + plotH} stroke={colors.borderStrong} strokeWidth={1} />
            ))}
            {limit ? (
              <G>
                <Line x1={PAD.left} x2={PAD.left + plotW} y1={sy(limit.y)} y2={sy(limit.y)} stroke={accent} strokeWidth={1.5} strokeDasharray="6 4" />
                <SvgText x={PAD.left + plotW - 4} y={limitLabelBelow ? sy(limit.y) + 14 : sy(limit.y) - 5} fontSize={TICK_FONT} fontFamily={fonts.semibold} fill={accent} textAnchor="end">
                  {limit.label}
                </SvgText>
              </G>
            ) : null}
            {series.map((s) => (
              <Path key={s.id} d={path(s.points)} stroke={s.color ?? colors.text} strokeWidth={1.5} fill="none" strokeLinejoin="round" />
            ))}
            {(dots ?? []).filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y)).map((p, i) => (
              <Circle key={`d${i}`} cx={sx(p.x)} cy={sy(p.y)} r={3.5} fill={colors.surface} stroke={colors.text} strokeWidth={1.5} />
            ))}
            {marker && Number.isFinite(marker.x) && Number.isFinite(marker.y) ? (
              <G>
                <Line x1={sx(marker.x)} x2={sx(marker.x)} y1={PAD.top} y2={PAD.top + plotH} stroke={colors.text} strokeWidth={1} strokeDasharray="2 3" />
                <Circle cx={sx(marker.x)} cy={sy(marker.y)} r={4.5} fill={colors.surface} stroke={colors.text} strokeWidth={1.5} />
                <SvgText
                  x={sx(marker.x) + (sx(marker.x) > PAD.left + plotW * 0.7 ? -8 : 8)}
                  y={markerLabelY}
                  fontSize={12}
                  fontFamily={fonts.semibold}
                  fill={colors.text}
                  textAnchor={sx(marker.x) > PAD.left + plotW * 0.7 ? 'end' : 'start'}
                >
                  {marker.label}
                </SvgText>
              </G>
            ) : null}
            <SvgText x={PAD.left + plotW / 2} y={height - 6} fontSize={12} fontFamily={fonts.regular} fill={colors.textMuted} textAnchor="middle">
              {xLabel}
            </SvgText>
            <SvgText
              x={12}
              y={PAD.top + plotH / 2}
              fontSize={12}
              fontFamily={fonts.regular}
              fill={colors.textMuted}
              textAnchor="middle"
              transform={`rotate(-90 12 ${PAD.top + plotH / 2})`}
            >
              {yLabel}
            </SvgText>
          </Svg>
        ) : null}
      </View>
      <Text variant="caption" style={styles.visuallyHidden} testID={testID ? `${testID}-summary` : undefined}>
        {summary}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs },
  // Kept in the accessibility tree, out of sight (the chart itself carries the same words as its label).
  visuallyHidden: {
    position: 'absolute',
    width: 1,
    height: 1,
    overflow: 'hidden',
    opacity: 0,
  },
});
