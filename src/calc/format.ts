/**
 * Result formatting with the precision the trade expects: temperatures to 0.1°, heat flow to three
 * significant figures, thickness in whole millimetres or eighths of an inch, money to the cent.
 */
import { type Quantity, type UnitSystem, unitOf } from './units';

export type Formatted = {
  /** The number alone, as shown large. */
  value: string;
  /** Its unit suffix. */
  unit: string;
  /** Number and unit together ("56.5 °C"). */
  text: string;
  /** For screen readers ("56.5 degrees Celsius"). */
  spoken: string;
};

const LOCALE = 'en-US';

function cleanNegativeZero(s: string): string {
  return /^-0(\.0+)?$/.test(s) ? s.slice(1) : s;
}

function pack(value: string, unit: string, spokenUnit: string): Formatted {
  return {
    value,
    unit,
    text: unit ? `${value} ${unit}` : value,
    spoken: spokenUnit ? `${value.replace('−', 'minus ')} ${spokenUnit}` : value,
  };
}

/** Fixed decimals with a true minus sign and thousands separators. */
export function fixed(x: number, decimals: number): string {
  const s = cleanNegativeZero(x.toFixed(decimals));
  const neg = s.startsWith('-');
  const body = neg ? s.slice(1) : s;
  const [int, frac] = body.split('.');
  const grouped = int.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return (neg ? '−' : '') + grouped + (frac !== undefined ? `.${frac}` : '');
}

/** Three (or `sig`) significant figures, never in exponent form. */
export function significant(x: number, sig = 3): string {
  if (!Number.isFinite(x)) return '—';
  if (x === 0) return '0';
  const magnitude = Math.floor(Math.log10(Math.abs(Number(x.toPrecision(sig)))));
  const decimals = Math.max(0, sig - 1 - magnitude);
  const rounded = Number(x.toPrecision(sig));
  return fixed(rounded, decimals);
}

/** A temperature result to 0.1° in the chosen system. */
export function formatTemperature(celsius: number, system: UnitSystem): Formatted {
  const u = unitOf('temperature', system);
  return pack(fixed(u.fromSI(celsius), 1), u.suffix, u.spoken);
}

/** A temperature difference to 0.1 K (or °F). */
export function formatTemperatureDelta(kelvin: number, system: UnitSystem): Formatted {
  const u = unitOf('temperatureDelta', system);
  return pack(fixed(u.fromSI(kelvin), 1), u.suffix, u.spoken);
}

/** Any quantity to three significant figures (heat flow, coefficients, energy). */
export function formatSignificant(quantity: Quantity, si: number, system: UnitSystem, sig = 3): Formatted {
  const u = unitOf(quantity, system);
  return pack(significant(u.fromSI(si), sig), u.suffix, u.spoken);
}

const EIGHTHS = ['', '⅛', '¼', '⅜', '½', '⅝', '¾', '⅞'];
const EIGHTHS_SPOKEN = ['', 'one eighth', 'one quarter', 'three eighths', 'one half', 'five eighths', 'three quarters', 'seven eighths'];

/** A thickness: whole millimetres, or inches to the nearest eighth. */
export function formatThickness(metres: number, system: UnitSystem): Formatted {
  if (system === 'SI') {
    const mm = fixed(metres * 1000, 0);
    return pack(mm, 'mm', 'millimetres');
  }
  const eighths = Math.round((metres / 0.0254) * 8);
  const whole = Math.floor(eighths / 8);
  const rest = eighths - whole * 8;
  const value = rest === 0 ? String(whole) : whole === 0 ? EIGHTHS[rest] : `${whole}${EIGHTHS[rest]}`;
  const spokenValue = rest === 0 ? String(whole) : whole === 0 ? EIGHTHS_SPOKEN[rest] : `${whole} and ${EIGHTHS_SPOKEN[rest]}`;
  return { value, unit: 'in', text: `${value} in`, spoken: `${spokenValue} inches` };
}

/** Money to the currency's cents. */
export function formatMoney(amount: number, currency: string): Formatted {
  let value: string;
  try {
    value = new Intl.NumberFormat(LOCALE, { style: 'currency', currency, minimumFractionDigits: 2, maximumFractionDigits: 2 }).format(amount);
  } catch {
    value = `${fixed(amount, 2)} ${currency}`;
  }
  value = value.replace('-', '−');
  return { value, unit: '', text: value, spoken: value.replace('−', 'minus ') };
}

/** The symbol of a currency ("$", "€", "£"), or its code and a space when it has none in this locale. */
export function currencySymbol(code: string): string {
  try {
    const part = new Intl.NumberFormat(LOCALE, { style: 'currency', currency: code }).formatToParts(0).find((p) => p.type === 'currency');
    if (part && part.value !== code) return part.value;
  } catch {
    // Not an ISO 4217 code: fall through to the code itself.
  }
  return `${code} `;
}

/** Hours to one decimal. */
export function formatHours(hours: number): Formatted {
  return pack(fixed(hours, 1), 'h', 'hours');
}
