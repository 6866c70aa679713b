import { useRef } from 'react';
import type { View } from 'react-native';

type KeyEvent = { key: string; preventDefault: () => void };

export interface RadioKeys {
  /** Ref callback for the radio at index i (its element receives focus from the arrow keys). */
  ref: (i: number) => (el: View | null) => void;
  /** Roving tab stop: only the checked radio (or the first available one) is reached with Tab. */
  tabIndex: (i: number) => 0 | -1;
  onKeyDown: (i: number) => (e: KeyEvent) => void;
}

/**
 * Keyboard handling of a radio group after the WAI-ARIA radio-group pattern: Tab reaches the group once (at the
 * checked radio); the arrow keys move to the next or previous available radio, wrapping, and check it; Space
 * checks the focused radio. Unavailable radios are skipped.
 */
export function useRadioKeys<T extends string>(
  options: readonly { value: T; disabled?: boolean }[],
  value: T | null,
  onChange: (value: T) => void,
  groupDisabled = false,
): RadioKeys {
  const els = useRef<(View | null)[]>([]);
  const available = (i: number) => !groupDisabled && !options[i]?.disabled;
  const checked = options.findIndex((o) => o.value === value);
  const firstAvailable = options.findIndex((_, i) => available(i));
  const stop = checked >= 0 && available(checked) ? checked : firstAvailable;

  const move = (from: number, step: 1 | -1) => {
    const n = options.length;
    for (let k = 1; k <= n; k++) {
      const j = (((from + step * k) % n) + n) % n;
      if (available(j)) {
        (els.current[j] as unknown as { focus?: () => void } | null)?.focus?.();
        if (options[j].value !== value) onChange(options[j].value);
        return;
      }
    }
  };

  return {
    ref: (i) => (el) => {
      els.current[i] = el;
    },
    tabIndex: (i) => (i === stop ? 0 : -1),
    onKeyDown: (i) => (e) => {
      switch (e.key) {
        case 'ArrowRight':
        case 'ArrowDown':
          e.preventDefault();
          move(i, 1);
          return;
        case 'ArrowLeft':
        case 'ArrowUp':
          e.preventDefault();
          move(i, -1);
          return;
        case ' ':
        case 'Spacebar':
          e.preventDefault();
          if (available(i) && options[i].value !== value) onChange(options[i].value);
          return;
        default:
      }
    },
  };
}
