import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { conductivityCoefficientsFromDisplay, conductivityCoefficientsToDisplay, formatInputNumber, parseNumber, unitOf, type UnitSystem } from '../../calc/units';
import { spacing } from '../../theme';
import { Text, TextField } from '../ui';

export interface CoefficientFieldsProps {
  /** Layer number shown to people (1-based). */
  layer: number;
  system: UnitSystem;
  /** SI coefficients [W/(m·K)], T in °C (null where a field does not hold a number). */
  value: (number | null)[];
  onChange: (si: (number | null)[]) => void;
  errors: (string | undefined)[];
  testID?: string;
}

const sameArr = (a: (number | null)[], b: (number | null)[]) =>
  a.length === b.length && a.every((x, i) => x === b[i] || (x !== null && b[i] !== null && Math.abs(x - b[i]!) <= 1e-15 + 1e-12 * Math.abs(x)));

/**
 * Custom k(T) = c0 + c1·T + c2·T². In US units the polynomial is carried to °F and Btu·in/(h·ft²·°F) as a
 * whole (each coefficient depends on all of them), from the SI coefficients kept as the source of truth.
 */
export function CoefficientFields({ layer, system, value, onChange, errors, testID }: CoefficientFieldsProps) {
  const toTexts = (si: (number | null)[]) => {
    if (si.some((c) => c === null)) return null;
    return conductivityCoefficientsToDisplay(system, si as number[]).map((c) => formatInputNumber(c, 6));
  };
  const [shown, setShown] = useState(() => ({ si: value, system, texts: toTexts(value) ?? value.map(() => '') }));
  if (shown.system !== system || !sameArr(shown.si, value)) {
    setShown({ si: value, system, texts: toTexts(value) ?? shown.texts });
  }
  const texts = shown.texts;

  const kUnit = unitOf('conductivity', system);
  const tUnit = unitOf('temperature', system);
  const k = kUnit.suffix;
  const T = tUnit.suffix;
  const pow = (j: number) => (j === 1 ? '' : j === 2 ? '²' : j === 3 ? '³' : `^${j}`);
  const spokenPow = (j: number) => (j === 1 ? '' : j === 2 ? ' squared' : j === 3 ? ' cubed' : ` to the power ${j}`);
  const labels = texts.map((_, j) => (j === 0 ? `Conductivity at 0 ${T} (c0)` : `c${j}, per ${T}${pow(j)}`));
  const units = texts.map((_, j) => (j === 0 ? k : `${k}/${T}${pow(j)}`));
  const unitsSpoken = texts.map((_, j) => (j === 0 ? kUnit.spoken : `${kUnit.spoken} per ${tUnit.spoken}${spokenPow(j)}`));

  return (
    <View style={styles.wrap}>
      <Text variant="caption" tone="textMuted">
        {`Conductivity k = c0 + c1·T + c2·T²${texts.length > 3 ? ' + …' : ''}, T in ${T}. The calculation integrates k over each layer's temperature span.`}
      </Text>
      <View style={styles.row}>
        {texts.map((text, j) => (
          <View key={j} style={styles.cell}>
            <TextField
              label={`${labels[j]}, layer ${layer}`}
              unit={units[j]}
              unitSpoken={unitsSpoken[j]}
              value={text}
              inputMode="decimal"
              error={errors[j]}
              testID={testID ? `${testID}-c${j}` : undefined}
              onChangeText={(t) => {
                const next = texts.map((x, i) => (i === j ? t : x));
                const parsed = next.map(parseNumber);
                let si: (number | null)[];
                if (parsed.some((p) => p === null)) {
                  // In SI each coefficient stands alone; in US units they depend on each other, so the
                  // ones that still parse keep their previous SI values until every field is a number.
                  si = system === 'SI' ? parsed : parsed.map((p, i) => (p === null ? null : shown.si[i]));
                } else {
                  si = conductivityCoefficientsFromDisplay(system, parsed as number[]);
                }
                setShown({ si, system, texts: next });
                onChange(si);
              }}
            />
          </View>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  cell: { flexGrow: 1, flexBasis: 160 },
});
