import { StyleSheet, View } from 'react-native';

import { formatSignificant, formatTemperature, formatThickness } from '../../calc/format';
import type { LiveOutput } from '../../calc/live';
import { heatQuantity, touchSafetyOf } from '../../calc/present';
import { limitValue, type Draft } from '../../calc/quick-case';
import { type UnitSystem, toDisplay, unitOf } from '../../calc/units';
import { colors, spacing } from '../../theme';
import { LineChart } from '../charts';
import { Card } from '../ui';

type Ok = Extract<LiveOutput, { kind: 'ok' }>;

export interface ChartsPanelProps {
  draft: Draft;
  output: Ok;
  system: UnitSystem;
  /** Charts side by side (wide screens). */
  wide?: boolean;
}

/** The main output: how surface temperature and heat loss fall with thickness, and the profile through the layers. */
export function ChartsPanel({ draft: d, output: o, system, wide }: ChartsPanelProps) {
  const tUnit = unitOf('temperature', system);
  const xUnit = unitOf('thickness', system);
  const q = heatQuantity(d.kind);
  const qUnit = unitOf(q, system);
  const x = (m: number) => toDisplay('thickness', system, m);
  const T = (c: number) => toDisplay('temperature', system, c);
  const H = (w: number) => toDisplay(q, system, Math.abs(w));
  const lim = limitValue(d);
  const chosen = o.chosenThicknessM;
  const sweep = o.sweep;

  let surfaceLimit: { y: number; label: string; tone: 'heat' | 'cold' } | null = null;
  if (d.purpose === 'personnel' && lim !== null) {
    // The limit that governs the touch verdict: the one entered, or a stricter burn threshold.
    const touch = touchSafetyOf(d, o.result, system).verdict;
    const governing = touch.regime === 'hot' ? touch.limitC : lim;
    const why = touch.regime === 'hot' && touch.governs === 'burnThreshold' ? ' (burn threshold)' : '';
    surfaceLimit = { y: T(governing), label: `limit ${formatTemperature(governing, system).text}${why}`, tone: 'heat' };
  }
  if (d.purpose === 'condensation' && lim !== null && o.result.dewPointC !== undefined) {
    surfaceLimit = { y: T(o.result.dewPointC + lim), label: `dew point + margin ${formatTemperature(o.result.dewPointC + lim, system).text}`, tone: 'cold' };
  }
  const heatLimit = d.purpose === 'conservation' && lim !== null ? { y: H(lim), label: `limit ${formatSignificant(q, lim, system).text}`, tone: 'heat' as const } : null;

  const first = sweep[0];
  const last = sweep[sweep.length - 1];
  const chosenText = chosen !== null ? formatThickness(chosen, system).text : 'none';
  const surfaceSummary =
    first && last
      ? `From ${formatTemperature(first.surfaceTemperatureC, system).text} at ${formatThickness(first.thicknessM, system).text} to ${formatTemperature(last.surfaceTemperatureC, system).text} at ${formatThickness(last.thicknessM, system).text}.${surfaceLimit ? ` Limit line: ${surfaceLimit.label}.` : ''} Chosen thickness ${chosenText}: ${formatTemperature(o.result.surfaceTemperatureC, system).text}.`
      : 'No curve: the build-up has no layer to vary.';
  const heatSummary =
    first && last
      ? `From ${formatSignificant(q, Math.abs(first.heatFlow), system).text} at ${formatThickness(first.thicknessM, system).text} to ${formatSignificant(q, Math.abs(last.heatFlow), system).text} at ${formatThickness(last.thicknessM, system).text}.${heatLimit ? ` Limit line: ${heatLimit.label}.` : ''} Chosen thickness ${chosenText}: ${formatSignificant(q, Math.abs(o.heatFlow), system).text}.`
      : 'No curve: the build-up has no layer to vary.';
  const profileSummary = `${o.boundaries.map((b) => `${b.label} at ${formatThickness(b.positionM, system).text}: ${formatTemperature(b.temperatureC, system).text}`).join('; ')}. Air ${formatTemperature(d.airTemperatureC ?? NaN, system).text}.`;

  const chosenOnCurve = chosen !== null && chosen > 0;
  const layout = wide ? styles.grid : styles.column;
  const cell = wide ? styles.cellWide : null;

  return (
    <Card title="How thickness changes things" subtitle="Each curve re-runs the calculation at every thickness of the series range." testID="qs-charts">
      <View style={layout}>
        <View style={cell}>
          <LineChart
            title="Surface temperature against thickness"
            xLabel={`Thickness of the ${d.layers.length > 1 ? 'outer layer' : 'insulation'} (${xUnit.suffix})`}
            yLabel={`Surface (${tUnit.suffix})`}
            series={[{ id: 'surface', points: sweep.map((p) => ({ x: x(p.thicknessM), y: T(p.surfaceTemperatureC) })), color: colors.text }]}
            limit={surfaceLimit}
            marker={chosenOnCurve ? { x: x(chosen), y: T(o.result.surfaceTemperatureC), label: `${chosenText}: ${formatTemperature(o.result.surfaceTemperatureC, system).text}` } : null}
            summary={surfaceSummary}
            testID="qs-chart-surface"
          />
        </View>
        <View style={cell}>
          <LineChart
            title={`${o.heatFlow < 0 ? 'Heat gain' : 'Heat loss'} against thickness`}
            xLabel={`Thickness of the ${d.layers.length > 1 ? 'outer layer' : 'insulation'} (${xUnit.suffix})`}
            yLabel={`${o.heatFlow < 0 ? 'Gain' : 'Loss'} (${qUnit.suffix})`}
            series={[{ id: 'heat', points: sweep.map((p) => ({ x: x(p.thicknessM), y: H(p.heatFlow) })), color: colors.heatLine }]}
            limit={heatLimit}
            marker={chosenOnCurve ? { x: x(chosen), y: H(o.heatFlow), label: `${chosenText}: ${formatSignificant(q, Math.abs(o.heatFlow), system).text}` } : null}
            summary={heatSummary}
            testID="qs-chart-heat"
          />
        </View>
        <View style={cell}>
          <LineChart
            title="Temperature through the layers"
            xLabel={`Distance out from the ${d.kind === 'wall' ? 'wall' : d.kind === 'vessel' ? 'shell' : 'pipe'} surface (${xUnit.suffix})`}
            yLabel={`Temperature (${tUnit.suffix})`}
            series={[{ id: 'profile', points: o.profile.map((p) => ({ x: x(p.positionM), y: T(p.temperatureC) })), color: colors.heatLine }]}
            guides={o.boundaries.slice(1, -1).map((b) => ({ x: x(b.positionM) }))}
            limit={d.purpose === 'personnel' ? surfaceLimit : null}
            marker={{ x: x(o.boundaries[o.boundaries.length - 1].positionM), y: T(o.result.surfaceTemperatureC), label: `surface ${formatTemperature(o.result.surfaceTemperatureC, system).text}` }}
            summary={profileSummary}
            testID="qs-chart-profile"
          />
        </View>
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.xl },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xl },
  cellWide: { flexBasis: 300, flexGrow: 1 },
});
