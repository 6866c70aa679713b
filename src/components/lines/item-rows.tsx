import { Link } from 'expo-router';
import { memo } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import type { Item, ItemKind, ListSortKey } from '../../api/types';
import type { UnitSystem } from '../../calc/units';
import { colors, radius, spacing } from '../../theme';
import { Icon, Text, TextLink } from '../ui';

import { Checkbox } from './checkbox';
import { formatRow, type RowCells, type RowStatus } from './row-format';

/** Fixed heights, so the list can place any row without measuring it (FlatList getItemLayout). */
export const TABLE_ROW_HEIGHT = 52;
export const CARD_HEIGHT = 124;

export type Column = { key: keyof RowCells; label: string; sort?: ListSortKey; flex: number; numeric?: boolean };

export function columnsFor(kind: ItemKind): Column[] {
  return [
    { key: 'tag', label: 'Tag', sort: 'tag', flex: 1.4 },
    { key: 'service', label: 'Service', sort: 'service', flex: 1.4 },
    { key: 'size', label: kind === 'line' ? 'Size' : 'Diameter', sort: 'outerDiameterM', flex: 0.9 },
    { key: 'length', label: 'Length', sort: 'lengthM', flex: 0.8, numeric: true },
    { key: 'temperature', label: 'Operating', sort: 'operatingTemperatureC', flex: 0.8, numeric: true },
    { key: 'location', label: 'Location', sort: 'location', flex: 0.8 },
    { key: 'purposes', label: 'Purposes (governing first)', sort: 'governingPurpose', flex: 1.5 },
    { key: 'thickness', label: 'Thickness', sort: 'totalThicknessM', flex: 1, numeric: true },
    { key: 'heatLoss', label: kind === 'line' ? 'Heat loss per length' : 'Heat loss', sort: 'heatLoss', flex: 1, numeric: true },
    { key: 'surface', label: 'Surface', sort: 'surfaceTemperatureC', flex: 0.8, numeric: true },
    { key: 'status', label: 'State (by sizing date)', sort: 'sizedAt', flex: 1.5 },
  ];
}

export const itemHref = (kind: ItemKind, id: number) => `/${kind === 'line' ? 'lines' : 'vessels'}/${id}`;

/** The row's state: an icon and a word, and what fails (never colour alone). */
export function StatusMark({ status, testID }: { status: RowStatus; testID?: string }) {
  return (
    <View style={styles.status} testID={testID} {...({ dataSet: { state: status.state } } as object)}>
      <Icon name={status.icon} tone={status.tone} size={18} />
      <Text variant="caption" weight="semibold" tone={status.tone} numberOfLines={1} style={styles.statusWord}>
        {status.word}
      </Text>
      {status.detail ? (
        <Text variant="caption" tone="textMuted" numberOfLines={1} style={styles.statusDetail}>
          {status.detail}
        </Text>
      ) : null}
    </View>
  );
}

/** Governing purpose first, then the others. */
function purposesText(item: Item, cells: RowCells): string {
  if (!item.sizing?.governingPurpose) return cells.purposes;
  const others = cells.purposes.split(', ').filter((p) => p !== cells.governing);
  return [cells.governing, ...others].join(', ');
}

export interface RowProps {
  item: Item;
  kind: ItemKind;
  system: UnitSystem;
  columns: Column[];
  selectable: boolean;
  selected: boolean;
  onToggle: (id: number) => void;
  striped: boolean;
}

/** One row of the wide table. */
export const TableRow = memo(function TableRow({ item, kind, system, columns, selectable, selected, onToggle, striped }: RowProps) {
  const cells = formatRow(item, kind, system);
  return (
    <View style={[styles.row, striped && styles.striped, selected && styles.selected]} testID={`row-${item.tag}`} role="row">
      {selectable ? (
        <View style={styles.selectCell}>
          <Checkbox label={`Select ${item.tag}`} labelHidden checked={selected} onChange={() => onToggle(item.id)} testID={`select-${item.tag}`} />
        </View>
      ) : null}
      {columns.map((c) => (
        <View key={c.key} style={[styles.cell, { flex: c.flex }, c.numeric && styles.numeric]} role="cell">
          {c.key === 'tag' ? (
            <TextLink href={itemHref(kind, item.id)} testID={`open-${item.tag}`}>
              {cells.tag}
            </TextLink>
          ) : c.key === 'status' ? (
            <StatusMark status={cells.status} testID={`state-${item.tag}`} />
          ) : (
            <Text numberOfLines={1} weight={c.key === 'thickness' ? 'semibold' : 'regular'} testID={c.key === 'thickness' ? `thickness-${item.tag}` : undefined}>
              {c.key === 'purposes' ? purposesText(item, cells) : cells[c.key] as string}
            </Text>
          )}
        </View>
      ))}
    </View>
  );
});

/** One card of the phone list. */
export const ItemCard = memo(function ItemCard({ item, kind, system, selectable, selected, onToggle }: Omit<RowProps, 'columns' | 'striped'>) {
  const cells = formatRow(item, kind, system);
  return (
    <View style={styles.cardSlot} testID={`row-${item.tag}`}>
      <View style={[styles.card, selected && styles.selected]}>
        {selectable ? (
          <Checkbox label={`Select ${item.tag}`} labelHidden checked={selected} onChange={() => onToggle(item.id)} testID={`select-${item.tag}`} />
        ) : null}
        <Link href={itemHref(kind, item.id)} asChild>
          <Pressable role="link" aria-label={`${item.tag}: ${cells.status.word}`} style={StyleSheet.flatten(styles.cardBody)} testID={`open-${item.tag}`}>
            <View style={styles.cardTop}>
              <Text weight="semibold" numberOfLines={1} style={styles.cardTag}>
                {cells.tag}
              </Text>
              <StatusMark status={{ ...cells.status, detail: undefined }} testID={`state-${item.tag}`} />
            </View>
            <Text variant="caption" tone="textMuted" numberOfLines={1}>
              {[cells.service, cells.size, cells.length].join(' · ')}
            </Text>
            <Text variant="caption" tone="textMuted" numberOfLines={1}>
              {[cells.temperature, cells.location, purposesText(item, cells)].join(' · ')}
            </Text>
            <View style={styles.cardFigures}>
              <Text weight="semibold" numberOfLines={1} testID={`thickness-${item.tag}`}>
                {cells.thickness}
              </Text>
              <Text numberOfLines={1}>{cells.heatLoss}</Text>
              <Text numberOfLines={1}>{cells.surface === '—' ? '' : `surface ${cells.surface}`}</Text>
            </View>
            {cells.status.detail ? (
              <Text variant="caption" tone="fail" numberOfLines={1}>
                {cells.status.state === 'failing' ? `Fails ${cells.status.detail}` : `Stale; ${cells.status.detail}`}
              </Text>
            ) : null}
          </Pressable>
        </Link>
      </View>
    </View>
  );
});

export interface HeaderProps {
  columns: Column[];
  sort: ListSortKey;
  descending: boolean;
  onSort: (key: ListSortKey) => void;
  selectable: boolean;
  allSelected: boolean;
  onToggleAll: (on: boolean) => void;
}

/** The table's head: every column sorts (press again to reverse); the arrow is spoken as well. */
export function TableHeader({ columns, sort, descending, onSort, selectable, allSelected, onToggleAll }: HeaderProps) {
  return (
    <View style={styles.header} role="row">
      {selectable ? (
        <View style={styles.selectCell}>
          <Checkbox label="Select every row shown" labelHidden checked={allSelected} onChange={onToggleAll} testID="select-all" />
        </View>
      ) : null}
      {columns.map((c) => {
        const active = c.sort === sort;
        const dir = active ? (descending ? 'descending' : 'ascending') : null;
        return (
          <Pressable
            key={c.key}
            role="columnheader"
            aria-label={`${c.label}${dir ? `, sorted ${dir}` : ''}. Sort by ${c.label.toLowerCase()}`}
            onPress={() => c.sort && onSort(c.sort)}
            style={[styles.cell, styles.headCell, { flex: c.flex }, c.numeric && styles.numeric]}
            testID={`sort-${c.sort ?? c.key}`}
          >
            <Text variant="caption" weight={active ? 'bold' : 'semibold'} tone={active ? 'text' : 'textMuted'} numberOfLines={2}>
              {`${c.label}${dir ? (descending ? ' ↓' : ' ↑') : ''}`}
            </Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { height: TABLE_ROW_HEIGHT, flexDirection: 'row', alignItems: 'center', borderBottomWidth: 1, borderBottomColor: colors.border, backgroundColor: colors.surface },
  striped: { backgroundColor: colors.background },
  selected: { backgroundColor: colors.heatSoft },
  header: { minHeight: 48, flexDirection: 'row', alignItems: 'center', borderBottomWidth: 2, borderBottomColor: colors.borderStrong, backgroundColor: colors.surfaceSunk },
  headCell: { minHeight: 48, justifyContent: 'center' },
  selectCell: { width: 48, alignItems: 'center' },
  cell: { paddingHorizontal: spacing.sm, minWidth: 0, justifyContent: 'center' },
  numeric: { alignItems: 'flex-end' },
  status: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs, minWidth: 0 },
  statusWord: { flexShrink: 0 },
  statusDetail: { flexShrink: 1 },
  cardSlot: { height: CARD_HEIGHT, paddingBottom: spacing.sm },
  card: {
    flex: 1,
    flexDirection: 'row',
    alignItems: 'flex-start',
    gap: spacing.xs,
    paddingLeft: spacing.xs,
    borderWidth: 1,
    borderColor: colors.border,
    borderRadius: radius.lg,
    backgroundColor: colors.surface,
    overflow: 'hidden',
  },
  cardBody: { flex: 1, gap: 2, paddingVertical: spacing.sm, paddingRight: spacing.md, paddingLeft: spacing.xs, minWidth: 0 },
  cardTop: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: spacing.sm },
  cardTag: { flexShrink: 1 },
  cardFigures: { flexDirection: 'row', gap: spacing.md, flexWrap: 'nowrap' },
});
