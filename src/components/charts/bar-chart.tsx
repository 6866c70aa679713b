import { useState } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { G, Line, Rect, Text as SvgText } from 'react-native-svg';

import { fixed } from '../../calc/format';
import { colors, fonts, spacing } from '../../theme';
import { Text } from '../ui';

import { ChartSummary } from './chart-summary';
import { linearScale, niceDomain, tickFormatter } from './scale';

export type Bar = { id: string; label: string; value: number; /** Shown at the bar's end ("12.3 kW"). */ valueText: string };

export interface BarChartProps {
  title: string;
  /** The value axis with its unit, e.g. "Heat loss (kW)". */
  xLabel: string;
  bars: Bar[];
  /** What the chart shows, in words, for screen readers. */
  summary: string;
  color?: string;
  testID?: string;
}

const ROW = 26;
const PAD = { top: 6, right: 72, bottom: 40 };
const TICK_FONT = 11;

/** Our horizontal bar chart: thin bars on a sunk plot area, a labelled value axis with its unit. */
export function BarChart({ title, xLabel, bars, summary, color = colors.heatLine, testID }: BarChartProps) {
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.round(e.nativeEvent.layout.width));
  const labelW = Math.min(200, Math.max(96, Math.round(width * 0.34)));
  const height = PAD.top + bars.length * ROW + PAD.bottom;
  const max = Math.max(0, ...bars.map((b) => b.value));
  const dom = niceDomain(0, max > 0 ? max : 1, width < 420 ? 3 : 5);
  const plotW = Math.max(10, width - labelW - PAD.right);
  const sx = linearScale(0, dom.max, labelW, labelW + plotW);
  const tf = tickFormatter(dom.ticks);
  // Whole thousands read with separators (12,000), as every other figure of the app.
  const fx = (v: number) => (Number.isInteger(v) && Math.abs(v) >= 1000 ? fixed(v, 0) : tf(v));
  const plotH = bars.length * ROW;

  return (
    <View style={styles.wrap} testID={testID}>
      <Text variant="label">{title}</Text>
      <View onLayout={onLayout} role="img" aria-label={`${title}. ${summary}`} style={{ height }}>
        {width > 0 && bars.length > 0 ? (
          <Svg width={width} height={height} aria-hidden>
            <Rect x={labelW} y={PAD.top} width={plotW} height={plotH} fill={colors.surfaceSunk} />
            {dom.ticks.map((t) => (
              <G key={`t${t}`}>
                <Line x1={sx(t)} x2={sx(t)} y1={PAD.top} y2={PAD.top + plotH} stroke={colors.border} strokeWidth={1} />
                <SvgText x={sx(t)} y={PAD.top + plotH + 15} fontSize={TICK_FONT} fontFamily={fonts.regular} fill={colors.textMuted} textAnchor="middle">
                  {fx(t)}
                </SvgText>
              </G>
            ))}
            {bars.map((b, i) => {
              const y = PAD.top + i * ROW;
              const w = Math.max(1, sx(Math.max(0, b.value)) - labelW);
              const name = b.label.length > 28 ? `${b.label.slice(0, 27)}…` : b.label;
              return (
                <G key={b.id}>
                  <SvgText x={labelW - 8} y={y + ROW / 2 + 4} fontSize={12} fontFamily={fonts.regular} fill={colors.text} textAnchor="end">
                    {name}
                  </SvgText>
                  <Rect x={labelW} y={y + 7} width={w} height={ROW - 14} fill={color} />
                  <SvgText x={labelW + w + 6} y={y + ROW / 2 + 4} fontSize={12} fontFamily={fonts.semibold} fill={colors.text} textAnchor="start">
                    {b.valueText}
                  </SvgText>
                </G>
              );
            })}
            <SvgText x={labelW + plotW / 2} y={height - 6} fontSize={12} fontFamily={fonts.regular} fill={colors.textMuted} textAnchor="middle">
              {xLabel}
            </SvgText>
          </Svg>
        ) : null}
      </View>
      <ChartSummary summary={summary} testID={testID} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs },
});
