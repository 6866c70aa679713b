import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import type { TableConfidence } from '../../../shared/calc/library/materials';
import { can } from '../../../shared/schemas/permissions';
import { useDeleteTeamFinish, useDeleteTeamMaterial, useLibrary } from '../../api/library';
import { useSession } from '../../api/session';
import type { LibraryFinish, LibraryMaterial, TeamFinish, TeamMaterial } from '../../api/types';
import { fixed, formatSignificant } from '../../calc/format';
import type { UnitSystem } from '../../calc/units';
import { colors, radius, spacing } from '../../theme';
import { formatDate } from '../common/format';
import { Loading, QueryError } from '../common/query-state';
import { ConfirmDelete } from '../lines/confirm-delete';
import { listTemperature } from '../lines/row-format';
import { Button, Card, EmptyState, Icon, Screen, Text, TextLink, type IconName } from '../ui';

import { CONTACT_GROUPS, FinishForm } from './finish-form';
import { MaterialForm, fitQuality } from './material-form';

/** How well a built-in table is known, in words and an icon. */
export const CONFIDENCE: Record<TableConfidence, { word: string; icon: IconName; tone: 'pass' | 'caution' | 'fail'; note: string }> = {
  confirmed: { word: 'Confirmed', icon: 'pass', tone: 'pass', note: 'Every table point checked against the published source.' },
  partlyConfirmed: { word: 'Partly confirmed', icon: 'caution', tone: 'caution', note: 'Points marked ✓ checked; the others recalled from the specification.' },
  recalled: { word: 'Recalled, not checked', icon: 'caution', tone: 'caution', note: 'Values recalled from the specification; check against its current edition.' },
  approximate: { word: 'Approximate', icon: 'fail', tone: 'fail', note: 'Recalled only approximately; indicative until checked.' },
};

const contactWord = (c: string | undefined) => CONTACT_GROUPS.find((g) => g.value === c)?.label ?? '—';

function PointsTable({ points, system, checked, testID }: { points: { meanTemperatureC: number; conductivityWPerMK: number; confirmed?: boolean }[]; system: UnitSystem; checked?: boolean; testID?: string }) {
  return (
    <View role="table" style={styles.table} testID={testID}>
      <View role="row" style={[styles.tr, styles.th]}>
        <Text variant="caption" weight="semibold" style={styles.td}>
          Mean temperature
        </Text>
        <Text variant="caption" weight="semibold" style={styles.td}>
          k
        </Text>
        {checked ? (
          <Text variant="caption" weight="semibold" style={styles.td}>
            Checked
          </Text>
        ) : null}
      </View>
      {points.map((p, i) => (
        <View key={i} role="row" style={styles.tr}>
          <Text style={styles.td}>{listTemperature(p.meanTemperatureC, system)}</Text>
          <Text style={styles.td}>{formatSignificant('conductivity', p.conductivityWPerMK, system).text}</Text>
          {checked ? (
            <Text style={styles.td} tone={p.confirmed ? 'pass' : 'textMuted'}>
              {p.confirmed ? '✓ confirmed' : 'recalled'}
            </Text>
          ) : null}
        </View>
      ))}
    </View>
  );
}

function BuiltInMaterial({ m, system }: { m: LibraryMaterial; system: UnitSystem }) {
  const [open, setOpen] = useState(false);
  const c = CONFIDENCE[m.confidence];
  const confirmed = m.tablePoints.filter((p) => p.confirmed).length;
  return (
    <View style={styles.entry} testID={`builtin-material-${m.id}`}>
      <Text weight="semibold">{m.name}</Text>
      <Text variant="caption" tone="textMuted">{`${m.specification} · ${listTemperature(m.minServiceTemperatureC, system)} to ${listTemperature(m.maxServiceTemperatureC, system)}`}</Text>
      <View style={styles.confidence}>
        <Icon name={c.icon} tone={c.tone} size={18} />
        <Text variant="caption" weight="semibold" tone={c.tone}>
          {c.word}
        </Text>
        <Text variant="caption" tone="textMuted">{`${confirmed} of ${m.tablePoints.length} points confirmed. ${c.note}`}</Text>
      </View>
      <Button label={open ? 'Hide the table and source' : 'Show the table and source'} variant="quiet" onPress={() => setOpen((o) => !o)} aria-expanded={open} />
      {open ? (
        <>
          <PointsTable points={m.tablePoints} system={system} checked />
          <Text variant="caption" tone="textMuted">{`Source: ${m.source}`}</Text>
        </>
      ) : null}
    </View>
  );
}

function BuiltInFinish({ f }: { f: LibraryFinish }) {
  return (
    <View style={styles.entry} testID={`builtin-finish-${f.id}`}>
      <Text weight="semibold">{f.name}</Text>
      <Text variant="caption" tone="textMuted">{`Emissivity ${f.emissivity.toFixed(2)} (credible ${f.emissivityRange[0].toFixed(2)}–${f.emissivityRange[1].toFixed(2)}) · burn check as ${contactWord(f.contactMaterial).toLowerCase()}`}</Text>
      <Text variant="caption" tone="textMuted">{`Source: ${f.source}`}</Text>
    </View>
  );
}

function TeamMaterialEntry({ m, system, canEdit, onEdit }: { m: TeamMaterial; system: UnitSystem; canEdit: boolean; onEdit: () => void }) {
  const del = useDeleteTeamMaterial();
  const q = fitQuality(m.fitMaxErrorPct);
  return (
    <View style={styles.entry} testID={`team-material-${m.id}`}>
      <Text weight="semibold">{m.name}</Text>
      <Text variant="caption" tone="textMuted">{`${listTemperature(m.minServiceTemperatureC, system)} to ${listTemperature(m.maxServiceTemperatureC, system)} · ${m.tablePoints.length} datasheet points · added ${formatDate(m.createdAt)}`}</Text>
      <Text variant="caption" tone={q.tone}>{`${q.word}: largest error ${fixed(m.fitMaxErrorPct, 1)} % against the datasheet`}</Text>
      <Text variant="caption" tone="textMuted">{`Source: ${m.source}`}</Text>
      <PointsTable points={m.tablePoints} system={system} />
      {m.notes ? <Text variant="caption">{m.notes}</Text> : null}
      {canEdit ? (
        <View style={styles.actions}>
          <Button label="Edit" variant="secondary" onPress={onEdit} testID={`team-material-${m.id}-edit`} />
          <ConfirmDelete
            label="Delete"
            question={`Delete ${m.name}?`}
            consequence="Only a material no build-up uses can go."
            keepLabel="Keep it"
            busy={del.isPending}
            remove={() => del.mutateAsync(m.id)}
            testID={`team-material-${m.id}-delete`}
          />
        </View>
      ) : null}
    </View>
  );
}

function TeamFinishEntry({ f, canEdit, onEdit }: { f: TeamFinish; canEdit: boolean; onEdit: () => void }) {
  const del = useDeleteTeamFinish();
  return (
    <View style={styles.entry} testID={`team-finish-${f.id}`}>
      <Text weight="semibold">{f.name}</Text>
      <Text variant="caption" tone="textMuted">{`Emissivity ${f.emissivity.toFixed(2)} (credible ${f.emissivityRange[0].toFixed(2)}–${f.emissivityRange[1].toFixed(2)}) · burn check as ${contactWord(f.contactMaterial).toLowerCase()}`}</Text>
      <Text variant="caption" tone="textMuted">{`Source: ${f.source}`}</Text>
      {canEdit ? (
        <View style={styles.actions}>
          <Button label="Edit" variant="secondary" onPress={onEdit} testID={`team-finish-${f.id}-edit`} />
          <ConfirmDelete
            label="Delete"
            question={`Delete ${f.name}?`}
            consequence="Only a finish no build-up uses can go."
            keepLabel="Keep it"
            busy={del.isPending}
            remove={() => del.mutateAsync(f.id)}
            testID={`team-finish-${f.id}-delete`}
          />
        </View>
      ) : null}
    </View>
  );
}

type Editing = { kind: 'material'; id: number | null } | { kind: 'finish'; id: number | null } | null;

/**
 * The library: the team's own materials and finishes (owners and engineers add them from datasheets)
 * and the built-in ones with their sources and how well each table is known.
 */
export function LibraryScreen({ fromSite }: { fromSite?: string }) {
  const session = useSession();
  const system: UnitSystem = session.data?.settings?.unitSystem ?? 'SI';
  const canEdit = can(session.data?.role, 'library.edit');
  const library = useLibrary();
  const [editing, setEditing] = useState<Editing>(null);
  const lib = library.data;

  return (
    <Screen title="Library" intro="Insulation materials and outer finishes that build-ups draw on: built in, with their published sources, and your team’s own." testID="library-screen">
      {fromSite ? <TextLink href={`/sites/${encodeURIComponent(fromSite)}`}>Back to the site</TextLink> : null}
      {library.isPending ? (
        <Loading label="Loading the library…" />
      ) : library.isError ? (
        <QueryError error={library.error} onRetry={() => void library.refetch()} title="Could not load the library" />
      ) : lib ? (
        <>
          <Card title="Team materials" subtitle="Materials from your suppliers’ datasheets; offered in every build-up beside the built-in ones." testID="team-materials">
            {editing?.kind === 'material' ? (
              <MaterialForm system={system} material={lib.teamMaterials.find((m) => m.id === editing.id)} onDone={() => setEditing(null)} />
            ) : null}
            {lib.teamMaterials.length === 0 && editing?.kind !== 'material' ? (
              <EmptyState
                title="No team materials yet"
                message="Add a material from its datasheet: the table of conductivity at mean temperatures, fitted to a curve as you type, with its service range and the datasheet as its source."
                actionLabel={canEdit ? 'Add a material' : undefined}
                onAction={canEdit ? () => setEditing({ kind: 'material', id: null }) : undefined}
                note={canEdit ? undefined : 'An owner or engineer adds team materials.'}
                testID="team-materials-empty"
              />
            ) : (
              <>
                {lib.teamMaterials.map((m) => (
                  <TeamMaterialEntry key={m.id} m={m} system={system} canEdit={canEdit} onEdit={() => setEditing({ kind: 'material', id: m.id })} />
                ))}
                {canEdit && editing?.kind !== 'material' ? (
                  <Button label="Add a material" icon="plus" variant="secondary" onPress={() => setEditing({ kind: 'material', id: null })} testID="add-material" />
                ) : null}
              </>
            )}
          </Card>

          <Card title="Team finishes" subtitle="Jackets and coatings of your own, with their emissivity." testID="team-finishes">
            {editing?.kind === 'finish' ? <FinishForm finish={lib.teamFinishes.find((f) => f.id === editing.id)} onDone={() => setEditing(null)} /> : null}
            {lib.teamFinishes.length === 0 && editing?.kind !== 'finish' ? (
              <EmptyState
                title="No team finishes yet"
                message="Add a jacket or coating with its typical emissivity, its credible range and the surface it presents to a hand."
                actionLabel={canEdit ? 'Add a finish' : undefined}
                onAction={canEdit ? () => setEditing({ kind: 'finish', id: null }) : undefined}
                note={canEdit ? undefined : 'An owner or engineer adds team finishes.'}
                testID="team-finishes-empty"
              />
            ) : (
              <>
                {lib.teamFinishes.map((f) => (
                  <TeamFinishEntry key={f.id} f={f} canEdit={canEdit} onEdit={() => setEditing({ kind: 'finish', id: f.id })} />
                ))}
                {canEdit && editing?.kind !== 'finish' ? (
                  <Button label="Add a finish" icon="plus" variant="secondary" onPress={() => setEditing({ kind: 'finish', id: null })} testID="add-finish" />
                ) : null}
              </>
            )}
          </Card>

          <Card title="Built-in materials" subtitle="Generic types with k(T) fitted to the maximum conductivity tables of their ASTM specifications." testID="builtin-materials">
            {lib.materials.map((m) => (
              <BuiltInMaterial key={m.id} m={m} system={system} />
            ))}
          </Card>

          <Card title="Built-in finishes" subtitle="Typical emissivity and its credible range; touch safety uses the low end for metals." testID="builtin-finishes">
            {lib.finishes.map((f) => (
              <BuiltInFinish key={f.id} f={f} />
            ))}
          </Card>
          <Text variant="caption" tone="textMuted">
            Specification values are maxima; real products, ageing and moisture change them. Check every value against the plant’s specification before relying on it.
          </Text>
        </>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  entry: { gap: spacing.xxs, paddingVertical: spacing.md, borderTopWidth: 1, borderTopColor: colors.border },
  confidence: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.xs },
  table: { borderWidth: 1, borderColor: colors.border, borderRadius: radius.sm, marginVertical: spacing.xs, maxWidth: 520 },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.border },
  th: { backgroundColor: colors.surfaceSunk },
  td: { flex: 1, paddingHorizontal: spacing.sm, paddingVertical: spacing.xxs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, marginTop: spacing.xs },
});
