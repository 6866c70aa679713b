import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import type { Revision, RevisionStatus } from '../../api/revisions';
import { useSession } from '../../api/session';
import type { UnitSystem } from '../../api/types';
import { formatSignificant, significant } from '../../calc/format';
import { colors, radius, spacing } from '../../theme';
import { formatDateTime } from '../common/format';
import { ChoiceGroup, Icon, Text, type IconName } from '../ui';

const STATUS: Record<RevisionStatus, { word: string; icon: IconName; tone: 'pass' | 'caution'; bg: string }> = {
  prepared: { word: 'Awaiting check', icon: 'caution', tone: 'caution', bg: colors.cautionSoft },
  checked: { word: 'Awaiting approval', icon: 'caution', tone: 'caution', bg: colors.cautionSoft },
  issued: { word: 'Issued', icon: 'pass', tone: 'pass', bg: colors.passSoft },
};

/** Where a revision stands, in a word and an icon (never colour alone). */
export function RevisionStatusTag({ status, testID }: { status: RevisionStatus; testID?: string }) {
  const s = STATUS[status];
  return (
    <View style={[styles.tag, { backgroundColor: s.bg }]} testID={testID}>
      <Icon name={s.icon} tone={s.tone} size={16} />
      <Text variant="label" tone={s.tone}>
        {s.word}
      </Text>
    </View>
  );
}

/** "Rev B" */
export const revisionName = (r: Pick<Revision, 'number'>) => `Rev ${r.number}`;

/** Who prepared, checked and approved a revision, and when. */
export function SignatureList({ revision, testID }: { revision: Revision; testID?: string }) {
  const rows: [string, Revision['prepared'] | null][] = [
    ['Prepared', revision.prepared],
    ['Checked', revision.checked],
    ['Approved', revision.approved],
  ];
  return (
    <View role="list" style={styles.signatures} testID={testID}>
      {rows.map(([role, s]) => (
        <View key={role} role="listitem" style={styles.signature}>
          <Text variant="label" tone="textMuted" style={styles.signatureRole}>
            {role}
          </Text>
          <Text weight={s ? 'semibold' : 'regular'} tone={s ? 'text' : 'textMuted'} testID={testID ? `${testID}-${role.toLowerCase()}` : undefined}>
            {s ? `${s.name} · ${formatDateTime(s.at)}` : 'not yet signed'}
          </Text>
        </View>
      ))}
    </View>
  );
}

/** The unit system of downloads and comparisons: the reader's setting until they pick another. */
export function useUnitChoice(): [UnitSystem, (u: UnitSystem) => void] {
  const session = useSession();
  const [picked, setPicked] = useState<UnitSystem | null>(null);
  return [picked ?? session.data?.settings?.unitSystem ?? 'SI', setPicked];
}

export function UnitsChoice({ value, onChange, testID }: { value: UnitSystem; onChange: (u: UnitSystem) => void; testID?: string }) {
  return (
    <View style={styles.shrink}>
      <ChoiceGroup
        label="Units"
        value={value}
        onChange={onChange}
        compact
        testID={testID}
        choices={[
          { value: 'SI', label: 'SI (°C, mm)' },
          { value: 'US', label: 'US (°F, in)' },
        ]}
      />
    </View>
  );
}

/** Heat flow of a whole list: kW, or Btu/h in US units, three significant figures. */
export function totalHeatText(watts: number, units: UnitSystem): string {
  return units === 'SI' ? `${significant(watts / 1000)} kW` : formatSignificant('heatFlow', watts, 'US').text;
}

const styles = StyleSheet.create({
  tag: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.xs,
    paddingHorizontal: spacing.sm,
    paddingVertical: spacing.xxs,
    borderRadius: radius.pill,
    alignSelf: 'flex-start',
  },
  signatures: { gap: spacing.xs },
  signature: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'baseline' },
  signatureRole: { minWidth: 84 },
  shrink: { flexShrink: 1, maxWidth: '100%' },
});
