import { Link, useRouter } from 'expo-router';
import { useCallback, useMemo, useRef, useState } from 'react';
import { FlatList, Modal, Pressable, ScrollView, StyleSheet, useWindowDimensions, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';

import { can } from '../../../shared/schemas/permissions';
import { ApiProblemError } from '../../api/client';
import { useLibrary } from '../../api/library';
import { useItemList } from '../../api/lines';
import { useSession } from '../../api/session';
import { useSite } from '../../api/sites';
import type { Item, ItemKind, ListFilters, ListSortKey, ListStatus, Purpose } from '../../api/types';
import type { UnitSystem } from '../../calc/units';
import { breakpoints, colors, radius, spacing } from '../../theme';
import { Loading, QueryError } from '../common/query-state';
import { useHydrated } from '../common/use-hydrated';
import { finishOptions, materialOptions } from '../library/library-options';
import { OptionChips } from '../quick-sizing/option-chips';
import { SelectField } from '../ui/select-field';
import { SiteSectionTabs } from '../sites/site-section-nav';
import { Banner, Button, EmptyState, PageTitle, Text, TextField } from '../ui';

import { BulkEdit } from './bulk-edit';
import { CARD_HEIGHT, columnsFor, ItemCard, TABLE_ROW_HEIGHT, TableHeader, TableRow } from './item-rows';
import { KIND_WORDS, PURPOSE_LABELS, purposesFor, SORT_LABELS, STATUS_FILTERS } from './labels';
import { SizeAll, SizingStatus } from './size-all';

const SEARCH_DELAY_MS = 250;

type Filters = Required<Pick<ListFilters, 'sort' | 'descending'>> & Omit<ListFilters, 'sort' | 'descending'>;

const NO_FILTERS: Filters = { sort: 'tag', descending: false };

const activeFilterCount = (f: Filters) => [f.q, f.purpose, f.status, f.location].filter(Boolean).length;

/**
 * A site's lines or vessels: a sortable table on wide screens, cards on a phone; search and filters run
 * on the server, pages arrive as the list scrolls (rows have fixed heights, so even 10,000 scroll
 * smoothly). Owners and engineers select rows for a bulk edit and add items.
 */
export function ItemListScreen({ siteId, kind, initialStatus }: { siteId: string; kind: ItemKind; /** From the address (?status=failing), e.g. a count on the overview. */ initialStatus?: string }) {
  const { width } = useWindowDimensions();
  const hydrated = useHydrated();
  const wide = hydrated && width >= breakpoints.wide;
  const insets = useSafeAreaInsets();
  const router = useRouter();
  const session = useSession();
  const system: UnitSystem = session.data?.settings?.unitSystem ?? 'SI';
  const canEdit = can(session.data?.role, 'lines.edit');
  const site = useSite(siteId);
  const words = KIND_WORDS[kind];

  const [filters, setFilters] = useState<Filters>(() => (STATUS_FILTERS.some((f) => f.value === initialStatus) ? { ...NO_FILTERS, status: initialStatus as ListStatus } : NO_FILTERS));
  const [search, setSearch] = useState('');
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const [showFilters, setShowFilters] = useState(false);
  const [selected, setSelected] = useState<ReadonlySet<number>>(new Set());
  const [bulkOpen, setBulkOpen] = useState(false);
  const [notice, setNotice] = useState<string | null>(null);

  const list = useItemList(siteId, kind, filters);
  const items = useMemo(() => (list.data?.pages ?? []).flatMap((p) => p.items) as Item[], [list.data]);
  const library = useLibrary();
  const materials = useMemo(() => materialOptions(library.data, system), [library.data, system]);
  const finishes = useMemo(() => finishOptions(library.data), [library.data]);
  const columns = useMemo(() => columnsFor(kind), [kind]);

  const onSearch = (text: string) => {
    setSearch(text);
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => setFilters((f) => ({ ...f, q: text.trim() || undefined })), SEARCH_DELAY_MS);
  };
  const patch = (p: Partial<Filters>) => setFilters((f) => ({ ...f, ...p }));
  const onSort = useCallback((key: ListSortKey) => setFilters((f) => ({ ...f, sort: key, descending: f.sort === key ? !f.descending : false })), []);
  const onToggle = useCallback(
    (id: number) =>
      setSelected((s) => {
        const next = new Set(s);
        if (next.has(id)) next.delete(id);
        else next.add(id);
        return next;
      }),
    [],
  );
  const allSelected = items.length > 0 && items.every((i) => selected.has(i.id));
  const onToggleAll = (on: boolean) => setSelected(on ? new Set(items.map((i) => i.id)) : new Set());
  const clearFilters = () => {
    setSearch('');
    setFilters(NO_FILTERS);
  };

  const loadMore = () => {
    if (list.hasNextPage && !list.isFetchingNextPage) void list.fetchNextPage();
  };

  const rowHeight = wide ? TABLE_ROW_HEIGHT : CARD_HEIGHT;
  const getItemLayout = useCallback((_: ArrayLike<Item> | null | undefined, index: number) => ({ length: rowHeight, offset: rowHeight * index, index }), [rowHeight]);
  const renderItem = useCallback(
    ({ item, index }: { item: Item; index: number }) =>
      wide ? (
        <TableRow item={item} kind={kind} system={system} columns={columns} selectable={canEdit} selected={selected.has(item.id)} onToggle={onToggle} striped={index % 2 === 1} />
      ) : (
        <ItemCard item={item} kind={kind} system={system} selectable={canEdit} selected={selected.has(item.id)} onToggle={onToggle} />
      ),
    [wide, kind, system, columns, canEdit, selected, onToggle],
  );

  const filtered = activeFilterCount(filters) > 0;
  const missing = site.isError && site.error instanceof ApiProblemError && site.error.problem.kind === 'not-found';
  const newHref = `/sites/${encodeURIComponent(siteId)}/${kind === 'line' ? 'lines' : 'vessels'}/new`;

  const filterPanel = (
    <View style={[styles.filters, wide && styles.filtersWide]} testID="list-filters">
      <View style={styles.filterItem}>
        <SelectField
          label="Purpose"
          value={filters.purpose ?? 'any'}
          options={[{ value: 'any', label: 'Any purpose' }, ...purposesFor(kind).map((p) => ({ value: p, label: PURPOSE_LABELS[p].label }))]}
          onChange={(v) => patch({ purpose: v === 'any' ? undefined : (v as Purpose) })}
          testID="filter-purpose"
        />
      </View>
      <OptionChips<ListStatus | 'any'>
        label="State"
        value={filters.status ?? 'any'}
        options={[{ value: 'any', label: 'Any' }, ...STATUS_FILTERS]}
        onChange={(v) => patch({ status: v === 'any' ? undefined : v })}
        testID="filter-status"
      />
      <OptionChips<'any' | 'indoor' | 'outdoor'>
        label="Location"
        value={filters.location ?? 'any'}
        options={[
          { value: 'any', label: 'Anywhere' },
          { value: 'indoor', label: 'Indoor' },
          { value: 'outdoor', label: 'Outdoor' },
        ]}
        onChange={(v) => patch({ location: v === 'any' ? undefined : v })}
        testID="filter-location"
      />
      {!wide ? (
        <View style={styles.filterRow}>
          <View style={styles.filterItem}>
            <SelectField
              label="Sort by"
              value={filters.sort}
              options={(Object.keys(SORT_LABELS) as ListSortKey[]).map((k) => ({ value: k, label: SORT_LABELS[k] }))}
              onChange={(v) => patch({ sort: v as ListSortKey })}
              testID="sort-by"
            />
          </View>
          <OptionChips<'asc' | 'desc'>
            label="Order"
            value={filters.descending ? 'desc' : 'asc'}
            options={[
              { value: 'asc', label: 'Ascending' },
              { value: 'desc', label: 'Descending' },
            ]}
            onChange={(v) => patch({ descending: v === 'desc' })}
            testID="sort-order"
          />
        </View>
      ) : null}
    </View>
  );

  const head = (
    <View style={[styles.head, { paddingTop: insets.top + spacing.lg }]}>
      <SiteSectionTabs siteId={siteId} siteName={site.data?.name} current={kind === 'line' ? 'lines' : 'vessels'} />
      <View style={wide ? styles.titleRow : styles.column}>
        <PageTitle title={`${words.Many}${site.data ? ` · ${site.data.name}` : ''}`} />
        <View style={styles.actions}>
        <View role="group" aria-label="Show" style={styles.segments}>
          {(['line', 'vessel'] as const).map((k) => (
            <Link key={k} href={`/sites/${encodeURIComponent(siteId)}/${k === 'line' ? 'lines' : 'vessels'}`} asChild>
              <Pressable role="link" aria-current={k === kind ? 'page' : undefined} style={StyleSheet.flatten([styles.segment, k === kind && styles.segmentOn])} testID={`segment-${k}`}>
                <Text weight={k === kind ? 'semibold' : 'regular'} tone={k === kind ? 'heat' : 'text'}>
                  {k === kind ? `✓ ${KIND_WORDS[k].Many}` : KIND_WORDS[k].Many}
                </Text>
              </Pressable>
            </Link>
          ))}
        </View>
        {canEdit ? <Button label={wide ? `Add a ${words.one}` : 'Add'} aria-label={`Add a ${words.one}`} icon="plus" variant="secondary" onPress={() => router.push(newHref)} testID="add-item" /> : null}
        <SizeAll siteId={siteId} compact />
        </View>
      </View>
      <SizingStatus siteId={siteId} />
      {notice ? (
        <Banner tone="pass" title="Changed" testID="list-notice">
          <Text>{notice}</Text>
          <Button label="Dismiss" variant="quiet" onPress={() => setNotice(null)} />
        </Banner>
      ) : null}
      <View style={styles.searchRow}>
        <View style={[styles.search, wide && styles.searchWide]}>
          <TextField label="Search tags and services" value={search} onChangeText={onSearch} testID="list-search" autoCapitalize="none" />
        </View>
        {!wide ? (
          <Button
            label={showFilters ? 'Hide filters' : `Filters and sort${activeFilterCount(filters) > 0 ? ` (${activeFilterCount(filters)})` : ''}`}
            variant="secondary"
            onPress={() => setShowFilters((s) => !s)}
            aria-expanded={showFilters}
            style={styles.endAligned}
            testID="toggle-filters"
          />
        ) : null}
        {wide ? filterPanel : null}
      </View>
      {!wide && showFilters ? filterPanel : null}
      <View style={styles.countRow}>
        <Text variant="caption" tone="textMuted" testID="list-count">
          {list.isPending ? 'Loading…' : list.isPlaceholderData ? 'Updating…' : `${items.length.toLocaleString('en-US')}${list.hasNextPage ? '+' : ''} ${items.length === 1 ? words.one : words.many}${filtered ? ' match' : ''}`}
        </Text>
        {filtered ? <Button label="Clear filters" variant="quiet" onPress={clearFilters} testID="clear-filters" /> : null}
        {canEdit && selected.size > 0 ? (
          <View style={styles.selectionBar} testID="selection-bar">
            <Text weight="semibold">{`${selected.size.toLocaleString('en-US')} selected`}</Text>
            <Button label="Edit purposes and build-up" onPress={() => setBulkOpen(true)} testID="bulk-open" />
            <Button label="Clear selection" variant="quiet" onPress={() => setSelected(new Set())} />
          </View>
        ) : null}
      </View>
    </View>
  );

  const empty = list.isPending ? (
    <Loading label={`Loading the ${words.many}…`} />
  ) : list.isError ? (
    <QueryError error={list.error} onRetry={() => void list.refetch()} title={`Could not load the ${words.many}`} />
  ) : filtered ? (
    <EmptyState
      title={`No ${words.many} match`}
      message={`No ${words.one} of this site matches the search and filters. Clear them to see the whole list.`}
      actionLabel="Clear filters"
      onAction={clearFilters}
      testID="list-no-match"
    />
  ) : (
    <EmptyState
      icon="sites"
      title={`No ${words.many} yet`}
      message={
        kind === 'line'
          ? 'The line list holds the site’s pipes: tag, service, size, length, operating temperature and what each insulation is for. They are sized together against the site’s design bases.'
          : 'Vessels are the site’s tanks, drums and columns: diameter, length, heads, operating temperature and what the insulation is for.'
      }
      actionLabel={canEdit ? `Add a ${words.one}` : undefined}
      onAction={canEdit ? () => router.push(newHref) : undefined}
      note={canEdit ? undefined : `An owner or engineer adds ${words.many}.`}
      testID="list-empty"
    />
  );

  if (missing) {
    return (
      <View style={[styles.root, styles.pad]}>
        <PageTitle title="Site not found" />
        <Text tone="textMuted">This site is not in your team, or it was deleted, or you have not been invited to it.</Text>
      </View>
    );
  }

  return (
    <View style={styles.root} testID={`${kind}-list-screen`}>
      {head}
      <View style={styles.listWrap}>
        {wide && items.length > 0 ? (
          <TableHeader columns={columns} sort={filters.sort} descending={filters.descending} onSort={onSort} selectable={canEdit} allSelected={allSelected} onToggleAll={onToggleAll} />
        ) : null}
        <FlatList
          data={items}
          keyExtractor={(i) => String(i.id)}
          renderItem={renderItem}
          getItemLayout={getItemLayout}
          extraData={selected}
          initialNumToRender={wide ? 20 : 8}
          maxToRenderPerBatch={30}
          windowSize={9}
          onEndReached={loadMore}
          onEndReachedThreshold={3}
          ListEmptyComponent={<View style={styles.emptyWrap}>{empty}</View>}
          ListFooterComponent={list.isFetchingNextPage ? <Loading label="Loading more…" /> : null}
          style={[styles.list, list.isPlaceholderData && styles.updating]}
          contentContainerStyle={[!wide && styles.cards, { paddingBottom: insets.bottom + spacing.xl }]}
          testID="item-list"
        />
      </View>
      <Modal visible={bulkOpen} transparent animationType="fade" onRequestClose={() => setBulkOpen(false)}>
        <View style={styles.scrim}>
          <ScrollView contentContainerStyle={styles.modalBody} style={styles.modal}>
            <BulkEdit
              siteId={siteId}
              kind={kind}
              ids={[...selected]}
              system={system}
              materials={materials}
              finishes={finishes}
              onCancel={() => setBulkOpen(false)}
              onDone={(message) => {
                setBulkOpen(false);
                setSelected(new Set());
                setNotice(message);
              }}
            />
          </ScrollView>
        </View>
      </Modal>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: colors.background },
  pad: { padding: spacing.lg, gap: spacing.md },
  head: { paddingHorizontal: spacing.lg, gap: spacing.md, paddingBottom: spacing.sm },
  segments: { flexDirection: 'row', gap: spacing.xxs, borderWidth: 1, borderColor: colors.borderStrong, borderRadius: radius.md, padding: spacing.xxs, backgroundColor: colors.surface },
  segment: { minHeight: 40, paddingHorizontal: spacing.md, justifyContent: 'center', borderRadius: radius.sm },
  segmentOn: { backgroundColor: colors.heatSoft },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'flex-start' },
  searchRow: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'flex-end' },
  search: { flexGrow: 1, flexBasis: 180 },
  endAligned: { alignSelf: 'flex-end' },
  searchWide: { flexGrow: 0, flexBasis: 260 },
  titleRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: spacing.md },
  column: { gap: spacing.md },
  filters: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, alignItems: 'flex-start' },
  filtersWide: { flexGrow: 1, flexBasis: 600, flexWrap: 'nowrap' },
  filterRow: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, alignItems: 'flex-end' },
  filterItem: { minWidth: 200, flexGrow: 1, flexBasis: 200 },
  countRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.md, minHeight: 32 },
  selectionBar: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm },
  listWrap: { flex: 1, marginHorizontal: spacing.lg, borderTopWidth: 1, borderTopColor: colors.border },
  list: { flex: 1 },
  updating: { opacity: 0.6 },
  cards: { paddingTop: spacing.sm },
  emptyWrap: { paddingVertical: spacing.lg },
  scrim: { flex: 1, backgroundColor: 'rgba(30, 42, 51, 0.45)', alignItems: 'center', justifyContent: 'center', padding: spacing.md },
  modal: { width: '100%', maxWidth: 640, maxHeight: '100%' },
  modalBody: { paddingVertical: spacing.md },
});
