import { StyleSheet, View } from 'react-native';

import type { LiveOutput } from '../../calc/live';
import type { Presentation } from '../../calc/present';
import { spacing } from '../../theme';
import { Banner, Card, Text } from '../ui';

import { ResultValue, VerdictBadge } from './result-value';

export interface ResultsPanelProps {
  output: LiveOutput;
  /** The output in display units and words; null unless the output is a result. */
  presentation: Presentation | null;
  pending: boolean;
}

/** The numbers: verdict, headline results large with units, then the details and the year's energy. */
export function ResultsPanel({ output, presentation: p, pending }: ResultsPanelProps) {
  if (output.kind === 'invalid') {
    const entries = Object.entries(output.errors);
    return (
      <Banner tone="fail" title="Some inputs need fixing" testID="qs-invalid">
        <Text>Results appear as soon as every field holds a usable value:</Text>
        {entries.map(([field, message]) => (
          <Text key={field} {...({ dataSet: { field } } as object)}>{`• ${message}`}</Text>
        ))}
      </Banner>
    );
  }
  if (output.kind === 'error') {
    return (
      <Banner tone="fail" title="The calculation refused this case" testID="qs-calc-error" {...({ dataSet: { code: output.code, field: output.formField ?? '' } } as object)}>
        <Text>{output.message}</Text>
      </Banner>
    );
  }
  if (!p) return null;
  const shortfall = output.kind === 'ok' ? output.shortfall : null;
  return (
    <View style={styles.col} testID="qs-results" {...({ dataSet: { pending: pending ? 'true' : 'false' } } as object)}>
      <Card title="Results" subtitle={pending ? 'Updating…' : 'Live: they follow every change.'}>
        <VerdictBadge state={p.verdict.state} text={p.verdict.text} testID="qs-verdict" />
        {shortfall ? (
          <View style={styles.list} testID="qs-shortfall" {...({ dataSet: { code: shortfall.code } } as object)}>
            <Text weight="semibold">What would help:</Text>
            {shortfall.advice.map((a) => (
              <Text key={a}>{`• ${a}`}</Text>
            ))}
            <Text tone="textMuted">The figures below and the charts are for the best build-up within reach.</Text>
          </View>
        ) : null}
        {p.serviceLimits.map((b) => (
          <VerdictBadge key={`${b.layerIndex}-${b.kind}`} state="fail" text={b.text} testID={`qs-service-limit-${b.layerIndex}`} />
        ))}
        <View style={styles.grid}>
          {p.headline.map((s) => (
            <ResultValue key={s.testID} label={s.label} value={s.value} si={s.si} note={s.note} testID={s.testID} />
          ))}
        </View>
        <View style={styles.list}>
          {p.touch ? <VerdictBadge state={p.touch.state} text={`Touch safety: ${p.touch.text}`} testID="qs-touch" /> : null}
          <View style={styles.grid} testID="qs-touch-facts">
            {p.touchFacts.map((s) => (
              <ResultValue key={s.testID} size="medium" label={s.label} value={s.value} si={s.si} note={s.note} testID={s.testID} />
            ))}
          </View>
        </View>
        <View style={styles.grid}>
          {p.details.map((s) => (
            <ResultValue key={s.testID} size="medium" label={s.label} value={s.value} si={s.si} note={s.note} testID={s.testID} />
          ))}
        </View>
      </Card>
      {p.energy.length > 0 ? (
        <Card title="Over a year" subtitle={`Energy, cost and CO₂ ${p.energyBasis}, from the assumptions you set.`} testID="qs-energy">
          <View style={styles.grid}>
            {p.energy.map((s) => (
              <ResultValue key={s.testID} size="medium" label={s.label} value={s.value} si={s.si} note={s.note} testID={s.testID} />
            ))}
          </View>
        </Card>
      ) : (
        <Banner tone="info" title="No yearly figures">
          Fill in the energy and money assumptions to see energy, cost and CO₂.
        </Banner>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  col: { gap: spacing.lg },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.lg },
  list: { gap: spacing.sm },
});
