import { useState } from 'react';

import { type Quantity, type UnitSystem, formatInputValue, parseNumber, unitOf } from '../../calc/units';
import { TextField } from '../ui';

export interface NumberFieldProps {
  label: string;
  quantity: Quantity;
  system: UnitSystem;
  /** SI value (the source of truth), or null when the field does not hold a number. */
  value: number | null;
  onChange: (si: number | null) => void;
  error?: string | null;
  hint?: string;
  /** Prefix to the unit suffix, e.g. a currency symbol. */
  unitPrefix?: string;
  testID?: string;
  disabled?: boolean;
}

const same = (a: number | null, b: number | null) =>
  a === b || (a !== null && b !== null && Math.abs(a - b) <= 1e-12 * Math.max(1, Math.abs(a), Math.abs(b)));

/**
 * A number input bound to an SI value. It keeps the raw text as typed (so "0." or "-" survive), parses
 * on change, and redraws the text from SI only when the value changes from outside or the unit system
 * switches — so toggling units never drifts.
 */
export function NumberField({ label, quantity, system, value, onChange, error, hint, unitPrefix, testID, disabled }: NumberFieldProps) {
  const unit = unitOf(quantity, system);
  const show = (si: number | null) => (si === null ? '' : formatInputValue(quantity, system, si));
  // What the field shows, and the SI value and system it was drawn from. When the value changes from
  // outside or the unit system switches, the text is redrawn from SI during render (no effect needed).
  const [shown, setShown] = useState(() => ({ si: value, system, text: show(value) }));
  if (shown.system !== system || !same(shown.si, value)) {
    // A field that holds text that is not a number keeps it across a unit switch, so it can be corrected.
    const keep = value === null && shown.system !== system;
    setShown({ si: value, system, text: keep ? shown.text : show(value) });
  }
  const text = shown.text;
  const notNumber = text.trim() !== '' && parseNumber(text) === null;

  const suffix = `${unitPrefix ?? ''}${unit.suffix}`;
  return (
    <TextField
      label={label}
      value={text}
      unit={suffix || undefined}
      unitSpoken={unit.spoken ? `${unitPrefix ? `${unitPrefix} ` : ''}${unit.spoken}` : undefined}
      inputMode="decimal"
      keyboardType="numbers-and-punctuation"
      hint={hint}
      editable={!disabled}
      error={notNumber ? `Enter ${label.charAt(0).toLowerCase()}${label.slice(1)} as a number.` : error}
      testID={testID}
      onChangeText={(t) => {
        const n = parseNumber(t);
        const si = n === null ? null : unit.toSI(n);
        setShown({ si, system, text: t });
        onChange(si);
      }}
    />
  );
}
