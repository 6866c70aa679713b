import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { StyleSheet, View, useWindowDimensions } from 'react-native';

import { useSession } from '../../api/session';
import { decodeCaseQuery, encodeCaseQuery } from '../../calc/case-url';
import { typicalConditions } from '../../calc/examples';
import { present } from '../../calc/present';
import { defaultDraft, draftFromCase, draftOptions, standardSeriesId, type Draft } from '../../calc/quick-case';
import type { UnitSystem } from '../../calc/units';
import { useLiveCalc } from '../../calc/use-live-calc';
import { breakpoints, spacing } from '../../theme';
import { useHydrated } from '../common/use-hydrated';
import { SaveToSite } from '../save-to-site';
import { Banner, Button, Screen, Text, TextLink } from '../ui';

import { ChartsPanel } from './charts-panel';
import { InputsPanel } from './inputs-panel';
import { MethodPanel } from './method-panel';
import { OptionChips } from './option-chips';
import { ResultsPanel } from './results-panel';
import { SummaryBar } from './summary-bar';

const SUMMARY_BAR_SPACE = 112;

const UNIT_OPTIONS = [
  { value: 'SI', label: 'SI' },
  { value: 'US', label: 'US customary' },
] as const;

/**
 * Quick sizing: one pipe, vessel or wall, sized or checked without a site. Everything runs in the
 * browser; the case lives in the page link (as SI), so a shared link opens the same case.
 */
export function QuickSizingScreen() {
  const { width } = useWindowDimensions();
  // The static page is rendered for a phone without a URL; the client's own view (wide layout, the
  // link's case) takes over right after hydration, so server and client markup agree.
  const hydrated = useHydrated();
  const large = hydrated && width >= breakpoints.large;
  const session = useSession();
  const signedIn = Boolean(session.data?.user);
  const [override, setOverride] = useState<UnitSystem | null>(null);
  const system: UnitSystem = override ?? session.data?.settings?.unitSystem ?? 'SI';

  const [draft, setDraft] = useState<Draft>(defaultDraft);
  const [linkProblem, setLinkProblem] = useState<string | null>(null);
  const [linkRead, setLinkRead] = useState(false);
  const [copied, setCopied] = useState(false);
  const lastQuery = useRef<string | null>(null);
  // The thickness series follows the unit system (millimetre steps in SI, half-inch steps in US customary)
  // until the person picks one, or a link without units names one.
  const [series, setSeries] = useState<{ follows: boolean; alignedFor: UnitSystem }>({ follows: true, alignedFor: 'SI' });

  // The link is read once, on the client (static pages are rendered without a URL).
  if (hydrated && !linkRead && typeof window !== 'undefined') {
    const decoded = decodeCaseQuery(window.location.search);
    if (decoded.kind === 'ok') {
      setDraft(draftFromCase(decoded.case, decoded.options));
      if (decoded.units) {
        setOverride(decoded.units);
        setSeries({ follows: true, alignedFor: decoded.units });
      } else {
        setSeries({ follows: false, alignedFor: system });
      }
    } else if (decoded.kind === 'invalid') setLinkProblem(decoded.message);
    setLinkRead(true);
  }
  if (linkRead && series.follows && series.alignedFor !== system) {
    const from = standardSeriesId(series.alignedFor);
    setSeries({ follows: true, alignedFor: system });
    setDraft((d) => (d.energy.seriesId === from ? { ...d, energy: { ...d.energy, seriesId: standardSeriesId(system) } } : d));
  }

  const { output, pending, forDraft } = useLiveCalc(draft, system);
  // Worked out once per change, for both the results panel and the pinned summary.
  const presentation = useMemo(() => (output.kind === 'ok' ? present(draft, output, system) : null), [draft, output, system]);

  // Keep the link in step with the case (replace, not push: typing should not fill the history).
  useEffect(() => {
    // Only a result of the current draft may write the link (a shared link is not overwritten by the
    // starting case while its own result is on its way).
    if (!linkRead || typeof window === 'undefined' || output.kind === 'invalid' || forDraft !== draft) return;
    const query = encodeCaseQuery(output.case, draftOptions(draft), system);
    if (query === lastQuery.current) return;
    lastQuery.current = query;
    window.history.replaceState(window.history.state, '', `${window.location.pathname}?${query}`);
  }, [output, draft, forDraft, linkRead, system]);

  const currentSeries = draft.energy.seriesId;
  const onChange = useCallback(
    (patch: Partial<Draft>) => {
      setCopied(false);
      // A series picked by hand stays, whatever the units.
      if (patch.energy && patch.energy.seriesId !== currentSeries) setSeries((s) => ({ ...s, follows: false }));
      setDraft((d) => ({ ...d, ...patch }));
    },
    [currentSeries],
  );

  const copyLink = async () => {
    try {
      const query = output.kind === 'invalid' ? '' : `?${encodeCaseQuery(output.case, draftOptions(draft), system)}`;
      await navigator.clipboard.writeText(`${window.location.origin}${window.location.pathname}${query}`);
      setCopied(true);
    } catch {
      setCopied(false);
    }
  };

  const errors = output.kind === 'invalid' ? output.errors : {};
  const inputs = (
    <View style={styles.stack}>
      <InputsPanel draft={draft} system={system} errors={errors} onChange={onChange} serviceLimits={presentation?.serviceLimits} />
      <Button
        label="Use typical conditions for this purpose"
        variant="secondary"
        testID="qs-typical"
        onPress={() => onChange(typicalConditions(draft.purpose))}
      />
    </View>
  );
  const results = (
    <View style={styles.stack}>
      <ResultsPanel output={output} presentation={presentation} pending={pending} />
      <SaveToSite draft={draft} system={system} calculable={output.kind !== 'invalid'} />
      {output.kind === 'ok' ? <ChartsPanel draft={draft} output={output} system={system} wide={large} /> : null}
      <MethodPanel result={output.kind === 'ok' ? output.result : null} warnings={presentation?.warnings} />
    </View>
  );

  return (
    <View style={styles.root} testID="qs-screen" {...({ dataSet: { system, ready: linkRead ? 'true' : 'false' } } as object)}>
      <Screen
        title="Quick sizing"
        intro="One pipe, vessel or wall, sized or checked without a site. Results follow as you type."
        bottomInset={large ? 0 : SUMMARY_BAR_SPACE}
        testID="qs-scroll"
      >
        <View style={[styles.toolbar, large && styles.toolbarWide]}>
          <OptionChips
            label="Units"
            value={system}
            testID="qs-units"
            options={UNIT_OPTIONS}
            onChange={setOverride}
          />
          <View style={styles.links}>
            <Button label={copied ? 'Link copied' : 'Copy link to this case'} variant="quiet" testID="qs-copy-link" onPress={() => void copyLink()} />
            {signedIn ? <TextLink href="/sites">Your sites</TextLink> : <TextLink href="/">Sign in</TextLink>}
          </View>
        </View>
        {linkProblem ? (
          <Banner tone="caution" title="The shared link could not be opened" testID="qs-link-problem">
            <Text>{`${linkProblem} The page shows a starting case instead.`}</Text>
          </Banner>
        ) : null}
        {large ? (
          <View style={styles.sideBySide}>
            <View style={styles.inputsCol}>{inputs}</View>
            <View style={styles.resultsCol}>{results}</View>
          </View>
        ) : (
          <View style={styles.stack}>
            {inputs}
            {results}
          </View>
        )}
      </Screen>
      {!large ? <SummaryBar output={output} presentation={presentation} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1 },
  stack: { gap: spacing.lg },
  toolbar: { gap: spacing.sm },
  toolbarWide: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-end' },
  links: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, flexWrap: 'wrap' },
  sideBySide: { flexDirection: 'row', gap: spacing.xl, alignItems: 'flex-start' },
  inputsCol: { width: 440, flexShrink: 0 },
  resultsCol: { flex: 1, minWidth: 0 },
});
