import { useCallback, useEffect, useId, useRef, useState } from 'react';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';

import { colors, radius, spacing } from '../../theme';
import { focusRing } from './button';
import { Text } from './text';
import { fieldBox } from './text-field';

export type SelectOption = { value: string; label: string; detail?: string };

export interface SelectFieldProps {
  label: string;
  value: string;
  options: readonly SelectOption[];
  onChange: (value: string) => void;
  /** testID of the toggle; options get `${testID}-option-${value}`. */
  testID?: string;
}

/** Closes the list that is open, so that opening another one never leaves two open at once. */
let closeOpenList: (() => void) | null = null;

type KeyEvent = { key: string; altKey?: boolean; preventDefault: () => void };

/** The DOM node of a react-native-web view (its ref), where there is one. */
const domNode = (ref: unknown): HTMLElement | null =>
  ref && typeof (ref as HTMLElement).contains === 'function' ? (ref as HTMLElement) : null;

/**
 * A labelled choice from a list that opens in place, following the WAI-ARIA select-only combobox pattern: the
 * field keeps focus while Up/Down, Home/End and typing move the active option, Enter, Space or Tab choose it,
 * Escape (or a click anywhere else) closes the list without a change, and only one list is open at a time.
 */
export function SelectField({ label, value, options, onChange, testID }: SelectFieldProps) {
  const [open, setOpen] = useState(false);
  const [active, setActive] = useState(0);
  const wrapRef = useRef<View>(null);
  const fieldRef = useRef<View>(null);
  const baseId = useId().replace(/[^A-Za-z0-9_-]/g, '');
  const listId = `select-${baseId}-list`;
  const labelId = `select-${baseId}-label`;
  const optionId = (i: number) => `select-${baseId}-option-${i}`;
  const selectedIndex = Math.max(0, options.findIndex((o) => o.value === value));
  const current = options.find((o) => o.value === value);

  const close = useCallback(() => setOpen(false), []);

  const openAt = (index: number) => {
    if (closeOpenList && closeOpenList !== close) closeOpenList();
    closeOpenList = close;
    setActive(Math.min(Math.max(index, 0), options.length - 1));
    setOpen(true);
  };

  const choose = (index: number) => {
    const o = options[index];
    if (o && o.value !== value) onChange(o.value);
    setOpen(false);
  };

  // While open: a press anywhere outside closes the list (and forget it when it closes or unmounts).
  useEffect(() => {
    if (!open) {
      if (closeOpenList === close) closeOpenList = null;
      return;
    }
    if (typeof document === 'undefined') return;
    const onPointerDown = (e: Event) => {
      const wrap = domNode(wrapRef.current);
      if (wrap && e.target instanceof Node && !wrap.contains(e.target)) setOpen(false);
    };
    document.addEventListener('pointerdown', onPointerDown, true);
    return () => document.removeEventListener('pointerdown', onPointerDown, true);
  }, [open, close]);
  useEffect(() => () => {
    if (closeOpenList === close) closeOpenList = null;
  }, [close]);

  // Keep the active option in view as the keys move it.
  useEffect(() => {
    if (!open || typeof document === 'undefined') return;
    const el = document.getElementById(optionId(active));
    el?.scrollIntoView?.({ block: 'nearest' });
    // optionId depends only on the stable baseId
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [open, active]);

  const onKeyDown = (e: KeyEvent) => {
    const { key } = e;
    const last = options.length - 1;
    if (!open) {
      if (key === 'ArrowDown' || key === 'ArrowUp' || key === ' ') {
        e.preventDefault();
        openAt(selectedIndex);
      } else if (key === 'Home' || key === 'End') {
        e.preventDefault();
        openAt(key === 'Home' ? 0 : last);
      } else if (key.length === 1 && /\S/.test(key)) {
        openAt(matchFrom(selectedIndex, key));
      }
      return;
    }
    switch (key) {
      case 'ArrowDown':
        e.preventDefault();
        setActive((a) => Math.min(a + 1, last));
        return;
      case 'ArrowUp':
        e.preventDefault();
        if (e.altKey) choose(active);
        else setActive((a) => Math.max(a - 1, 0));
        return;
      case 'Home':
      case 'PageUp':
        e.preventDefault();
        setActive(key === 'Home' ? 0 : Math.max(active - 10, 0));
        return;
      case 'End':
      case 'PageDown':
        e.preventDefault();
        setActive(key === 'End' ? last : Math.min(active + 10, last));
        return;
      case ' ':
        e.preventDefault();
        choose(active);
        return;
      case 'Escape':
        e.preventDefault();
        setOpen(false);
        return;
      case 'Tab':
        // Focus moves on as usual; the active option is taken, as a native select does.
        choose(active);
        return;
      default:
        if (key.length === 1 && /\S/.test(key)) setActive(matchFrom(active, key));
    }
  };

  /** The next option after `from` whose label starts with the typed character (or `from` when none does). */
  function matchFrom(from: number, ch: string): number {
    const c = ch.toLowerCase();
    for (let k = 1; k <= options.length; k++) {
      const i = (from + k) % options.length;
      if (options[i].label.toLowerCase().startsWith(c)) return i;
    }
    return from;
  }

  return (
    <View style={styles.wrap} ref={wrapRef}>
      <Text variant="label" aria-hidden nativeID={labelId}>
        {label}
      </Text>
      <Pressable
        ref={fieldRef}
        role="combobox"
        aria-label={`${label}: ${current?.label ?? 'none'}`}
        aria-haspopup="listbox"
        aria-expanded={open}
        aria-controls={listId}
        aria-activedescendant={open ? optionId(active) : undefined}
        testID={testID}
        // Enter arrives here as a press, as does a click: it opens the list, or takes the active option.
        onPress={(e) => {
          const viaKey = (e as unknown as { type?: string }).type === 'keyup';
          if (!open) openAt(selectedIndex);
          else if (viaKey) choose(active);
          else setOpen(false);
        }}
        // react-native-web passes key events to the element; React Native's types do not list them.
        {...({ onKeyDown } as object)}
        onBlur={(e) => {
          const next = (e as unknown as { relatedTarget?: unknown }).relatedTarget ?? (e.nativeEvent as unknown as { relatedTarget?: unknown })?.relatedTarget;
          const wrap = domNode(wrapRef.current);
          if (open && wrap && next instanceof Node && !wrap.contains(next)) setOpen(false);
        }}
        style={(state) => [styles.box, (state as { focused?: boolean }).focused && focusRing]}
      >
        <Text style={styles.value} numberOfLines={1}>
          {current?.label ?? 'Choose…'}
        </Text>
        <Text tone="textMuted" aria-hidden>
          {open ? '▲' : '▼'}
        </Text>
      </Pressable>
      {open ? (
        <ScrollView style={styles.list} nativeID={listId} {...({ role: 'listbox' } as object)} aria-labelledby={labelId} nestedScrollEnabled>
          {options.map((o, i) => {
            const selected = o.value === value;
            return (
              <Pressable
                key={o.value}
                nativeID={optionId(i)}
                {...({ role: 'option' } as object)}
                aria-selected={selected}
                tabIndex={-1}
                testID={testID ? `${testID}-option-${o.value}` : undefined}
                onHoverIn={() => setActive(i)}
                onPress={() => {
                  choose(i);
                  (fieldRef.current as unknown as { focus?: () => void } | null)?.focus?.();
                }}
                style={[styles.option, selected && styles.optionSelected, i === active && styles.optionActive]}
                {...({ dataSet: { active: i === active ? 'true' : 'false' } } as object)}
              >
                <Text weight={selected ? 'semibold' : 'regular'}>{selected ? `✓ ${o.label}` : o.label}</Text>
                {o.detail ? (
                  <Text variant="caption" tone="textMuted">
                    {o.detail}
                  </Text>
                ) : null}
              </Pressable>
            );
          })}
        </ScrollView>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs },
  box: { ...fieldBox, gap: spacing.sm, paddingHorizontal: spacing.md },
  value: { flex: 1 },
  list: { maxHeight: 260, borderWidth: 1, borderColor: colors.borderStrong, borderRadius: radius.md, backgroundColor: colors.surface },
  option: { paddingHorizontal: spacing.md, paddingVertical: spacing.sm, minHeight: 44, justifyContent: 'center', borderLeftWidth: 3, borderLeftColor: 'transparent' },
  optionSelected: { backgroundColor: colors.selectedSoft },
  optionActive: { borderLeftColor: colors.focus, backgroundColor: colors.surfaceSunk },
});
