import { StyleSheet, View } from 'react-native';

import type { CalcResult, Warning } from '../../../shared/calc/types';
import { spacing } from '../../theme';
import { Banner, Card, Text } from '../ui';

/**
 * How the numbers were made, what to watch out for, and whose judgement governs. `warnings` are the calculation's
 * warnings in the form's words and units (see src/calc/calc-messages.ts).
 */
export function MethodPanel({ result, warnings = [] }: { result: CalcResult | null; warnings?: readonly Warning[] }) {
  const method = result?.method ?? [];
  return (
    <Card title="Method and cautions" testID="qs-method">
      {method.length > 0 ? (
        <View style={styles.list} testID="qs-method-list">
          <Text variant="label">Correlations and methods used</Text>
          {method.map((m, i) => (
            <Text key={i}>{`• ${m}`}</Text>
          ))}
        </View>
      ) : null}
      <View style={styles.list}>
        <Text variant="label">Cautions</Text>
        <Text>
          • These results are an aid to, not a substitute for, a competent engineer’s judgement, the plant’s specification and local codes.
        </Text>
        <Text>
          • Burn thresholds follow ISO 13732-1 (lower edge of its bands; between its contact times we interpolate on log time, which is our assumption) with the 5 s
          industrial contact basis of ASTM C1055 as the default. People react differently; children, older people and anyone who cannot pull away need lower limits.
        </Text>
        <Text>
          • Conductivities are specification values for generic material types; real products, ageing, moisture, gaps and damaged jackets change them. Fittings,
          supports and valves lose more heat than straight pipe.
        </Text>
        <Text>
          • Frost protection: the time to 0 °C counts the heat stored in the water and the pipe steel and the outer air film, so it is longer than the
          handbook estimate that leaves them out; it ignores freezing itself (latent heat), wind gusts and a sky colder than the air. Insulation only delays
          freezing of standing water; trace heating or flow prevents it.
        </Text>
        <Text>• Outdoors, a clear night sky can be much colder than the air: cold surfaces may run below the dew point even when this says otherwise.</Text>
      </View>
      {warnings.length > 0 ? (
        <Banner tone="caution" title="Check these" testID="qs-warnings">
          {warnings.map((w) => (
            <Text key={w.code + w.message} {...({ dataSet: { code: w.code } } as object)}>
              {`• ${w.message}`}
            </Text>
          ))}
        </Banner>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.xs },
});
