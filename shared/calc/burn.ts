/**
 * Contact-burn thresholds of hot surfaces by surface material and contact time.
 *
 * @remarks
 * Two bases, as the trade uses them:
 * - ISO 13732-1:2006, burn thresholds for contact of unprotected skin with a hot solid surface whose temperature
 *   is maintained during contact, for five surface-material groups and contact periods from 0.5 s upward.
 *   The standard gives *bands* (spreads); this module takes the **lower bound** of each band (the conservative
 *   edge). Between the tabulated contact periods it interpolates linearly in log10(time): that interpolation
 *   is **our assumption**, not the standard's. Below 1 s the 1 s value is kept (conservative, as thresholds
 *   fall with time); from 8 h on the 8 h value applies, as the standard states for long contact.
 * - ASTM C1055, the 5 s contact basis usual for industrial personnel protection, used when no contact time
 *   is given. For metal surfaces it gives ≈ 60 °C; for the other material groups this module uses the
 *   ISO 13732-1 lower bound interpolated at 5 s.
 *
 * Provenance of every number is stated beside it:
 * - 1 s, 1 min, 10 min and 8 h: confirmed against the burn-threshold table of EN 563:1994 (ref. 3, the
 *   predecessor that ISO 13732-1:2006 replaced), as reproduced in the implementing notes to § 12 of the German
 *   accident-prevention regulation DGUV Vorschrift 79 (ref. 4). The 1 min, 10 min and 8 h values are also
 *   confirmed for the 2006 edition by a jacketing supplier's page quoting DIN EN ISO 13732-1. Whether the 2006
 *   figures moved the 1 s bands was not confirmed: that same page reads the uncoated-metal band at 1 s as 62–65 °C,
 *   against 65–70 °C in EN 563. The value kept here (65 °C) is the EN 563 table's.
 * - 10 s: read from the figures of the standard, **as recalled from memory**; not confirmed.
 * - ASTM C1055: the 5 s industrial contact basis is confirmed (scope, clause 1.4 of C1055-03 and 1.3 of
 *   C1055-20); the 60 °C metal limit is **from memory**.
 * Check the memory values against the standard before relying on an edge case.
 *
 * References:
 * 1. ISO 13732-1:2006, *Ergonomics of the thermal environment — Methods for the assessment of human responses to
 *    contact with surfaces — Part 1: Hot surfaces*, clause 4.2 (burn thresholds), Figures 1–5 and Tables 1–2.
 * 2. ASTM C1055-20, *Standard Guide for Heated System Surface Conditions that Produce Contact Burn Injuries*.
 * 3. EN 563:1994, *Safety of machinery — Temperatures of touchable surfaces — Ergonomics data to establish
 *    temperature limit values for hot surfaces*, table of burn thresholds (contact up to 1 s, 1 min, 10 min, 8 h).
 * 4. BG BAU, DGUV Vorschrift 79, § 12 (surface temperatures), implementing note quoting the EN 563:1994 table.
 */

import { CalcInputError } from './errors';
import type { BurnResult, Contact, ContactMaterial } from './types';

/** Contact material groups of ISO 13732-1, in the order the standard presents them. */
export const CONTACT_MATERIALS: readonly ContactMaterial[] = [
  'uncoatedMetal',
  'coatedMetal',
  'ceramicGlassStone',
  'plastic',
  'wood',
] as const;

/** One tabulated burn-threshold point with its provenance. */
export type BurnThresholdPoint = {
  /** Contact period [s]. */
  seconds: number;
  /** Lower bound of the burn-threshold band [°C]. */
  thresholdC: number;
  /** Where the number comes from. */
  provenance: string;
};

const EN563 =
  'confirmed against the EN 563:1994 burn-threshold table (predecessor of ISO 13732-1:2006), as reproduced in the ' +
  'implementing notes to DGUV Vorschrift 79 § 12';
const S1 = `ISO 13732-1:2006 / EN 563:1994, contact up to 1 s, lower bound of the band; ${EN563}`;
const S10 =
  'ISO 13732-1:2006, figure for contact periods 1 s to 10 s, lower bound of the band at 10 s (read from the figure, ' +
  'from memory; not confirmed)';
const T1 = `ISO 13732-1:2006, table of burn thresholds for 1 min contact; ${EN563}, and by a supplier page quoting DIN EN ISO 13732-1`;
const T10 = `ISO 13732-1:2006, burn threshold for 10 min contact, all materials; ${EN563}`;
const T8H = `ISO 13732-1:2006, burn threshold for 8 h and longer, all materials; ${EN563}`;
const COATED_1S =
  'coated metal taken equal to the uncoated-metal lower bound (65 °C) as a conservative choice, the coating thickness ' +
  `being unknown: the published band for a 50 µm lacquer is 75–80 °C at 1 s; ${EN563}`;
const COATED_10S =
  'coated metal taken equal to the uncoated-metal lower bound at 10 s, conservative (coating raises the band); ' +
  'the uncoated value is read from the figure (from memory; not confirmed)';

const MINUTE = 60;
const TEN_MINUTES = 600;
const EIGHT_HOURS = 8 * 3600;

/**
 * ISO 13732-1:2006 burn-threshold lower bounds by material and contact period, ascending in time.
 * The 1 s, 1 min, 10 min and 8 h values are confirmed against the EN 563:1994 table; the 10 s values are from
 * memory of the figures — see the provenance of each point.
 */
export const ISO_13732_1_BURN_THRESHOLDS: Readonly<Record<ContactMaterial, readonly BurnThresholdPoint[]>> = {
  uncoatedMetal: [
    { seconds: 1, thresholdC: 65, provenance: S1 },
    { seconds: 10, thresholdC: 55, provenance: S10 },
    { seconds: MINUTE, thresholdC: 51, provenance: T1 },
    { seconds: TEN_MINUTES, thresholdC: 48, provenance: T10 },
    { seconds: EIGHT_HOURS, thresholdC: 43, provenance: T8H },
  ],
  coatedMetal: [
    { seconds: 1, thresholdC: 65, provenance: COATED_1S },
    { seconds: 10, thresholdC: 55, provenance: COATED_10S },
    { seconds: MINUTE, thresholdC: 51, provenance: T1 },
    { seconds: TEN_MINUTES, thresholdC: 48, provenance: T10 },
    { seconds: EIGHT_HOURS, thresholdC: 43, provenance: T8H },
  ],
  ceramicGlassStone: [
    { seconds: 1, thresholdC: 80, provenance: S1 },
    { seconds: 10, thresholdC: 66, provenance: S10 },
    { seconds: MINUTE, thresholdC: 56, provenance: T1 },
    { seconds: TEN_MINUTES, thresholdC: 48, provenance: T10 },
    { seconds: EIGHT_HOURS, thresholdC: 43, provenance: T8H },
  ],
  plastic: [
    { seconds: 1, thresholdC: 86, provenance: S1 },
    { seconds: 10, thresholdC: 70, provenance: S10 },
    { seconds: MINUTE, thresholdC: 60, provenance: T1 },
    { seconds: TEN_MINUTES, thresholdC: 48, provenance: T10 },
    { seconds: EIGHT_HOURS, thresholdC: 43, provenance: T8H },
  ],
  wood: [
    { seconds: 1, thresholdC: 110, provenance: S1 },
    { seconds: 10, thresholdC: 89, provenance: S10 },
    { seconds: MINUTE, thresholdC: 60, provenance: T1 },
    { seconds: TEN_MINUTES, thresholdC: 48, provenance: T10 },
    { seconds: EIGHT_HOURS, thresholdC: 43, provenance: T8H },
  ],
};

/** Contact period of the ASTM C1055 industrial basis [s]. */
export const ASTM_C1055_CONTACT_SECONDS = 5;

/**
 * ASTM C1055 surface-temperature limit for a 5 s contact with a metallic surface [°C] (≈ 140 °F).
 * From memory of ASTM C1055 (the 60 °C / 140 °F metal criterion widely used for personnel protection); not
 * confirmed. The 5 s contact period itself is confirmed: C1055 establishes 5 s as the probable contact time for
 * industrial situations (scope, clause 1.4 of C1055-03, 1.3 of C1055-20).
 */
export const ASTM_C1055_METAL_5S_LIMIT_C = 60;

const ISO_SOURCE =
  'ISO 13732-1:2006 burn threshold, lower bound of the band for the surface material; values between tabulated ' +
  'contact periods interpolated linearly in log(time) (our assumption, not part of the standard); thresholds at 1 s, ' +
  '1 min, 10 min and 8 h confirmed against the EN 563:1994 table, those at 10 s read from the figures (from memory)';

/** The basis text for a result taken from the given tabulated points. */
function isoSource(used: readonly BurnThresholdPoint[], extra?: string): string {
  const fromMemory = used.filter((p) => /from memory/.test(p.provenance)).map((p) => `${p.seconds} s`);
  const note =
    fromMemory.length > 0
      ? `this value rests on the ${fromMemory.join(' and ')} point, which is from memory`
      : 'this value rests only on confirmed points';
  return [ISO_SOURCE, extra, note].filter(Boolean).join('; ');
}

/** A burn threshold with the basis it was taken from. */
export type BurnThreshold = {
  /** Surface temperature at and above which a burn may occur [°C]. */
  thresholdC: number;
  /** Contact period the threshold applies to [s]. */
  seconds: number;
  /** Basis, with the interpolation assumption when one was made. */
  source: string;
};

/** Contact as the public edge may receive it: the contact time may be omitted (ASTM C1055 basis). */
export type ContactInput = { material: ContactMaterial; seconds?: number };

function isMetal(material: ContactMaterial): boolean {
  return material === 'uncoatedMetal' || material === 'coatedMetal';
}

function checkMaterial(material: unknown, field: string): asserts material is ContactMaterial {
  if (typeof material !== 'string' || !(CONTACT_MATERIALS as readonly string[]).includes(material)) {
    throw new CalcInputError(field, `${field} must be one of ${CONTACT_MATERIALS.join(', ')}`);
  }
}

/**
 * ISO 13732-1 burn-threshold lower bound for a material and contact period, interpolated in log(time).
 *
 * θ(t) = θ_i + (θ_{i+1} − θ_i) · (log t − log t_i) / (log t_{i+1} − log t_i) between tabulated t_i ≤ t ≤ t_{i+1}.
 *
 * @param material - surface material group
 * @param seconds - contact period [s], > 0
 * @returns threshold [°C] with its basis
 * @remarks Below 1 s the 1 s value is returned (conservative); from 8 h on, the 8 h value (43 °C). The
 *   log-time interpolation is our assumption. The standard applies to surfaces whose temperature is held during
 *   contact and to contact of less than about 10 % of the skin.
 * @example burnThresholdIso13732('uncoatedMetal', 60).thresholdC // 51 (ISO 13732-1:2006, 1 min, uncoated metal)
 * References: 1. ISO 13732-1:2006, clause 4.2.
 */
export function burnThresholdIso13732(material: ContactMaterial, seconds: number): BurnThreshold {
  checkMaterial(material, 'contact.material');
  if (typeof seconds !== 'number' || !Number.isFinite(seconds) || seconds <= 0) {
    throw new CalcInputError('contact.seconds', 'contact.seconds must be a positive number of seconds');
  }
  const points = ISO_13732_1_BURN_THRESHOLDS[material];
  const first = points[0];
  const last = points[points.length - 1];
  if (seconds <= first.seconds) {
    return {
      thresholdC: first.thresholdC,
      seconds,
      source: isoSource([first], `contact below ${first.seconds} s takes the ${first.seconds} s value`),
    };
  }
  if (seconds >= last.seconds) {
    return { thresholdC: last.thresholdC, seconds, source: isoSource([last]) };
  }
  for (let i = 0; i < points.length - 1; i += 1) {
    const a = points[i];
    const b = points[i + 1];
    if (seconds <= b.seconds) {
      const fraction = (Math.log10(seconds) - Math.log10(a.seconds)) / (Math.log10(b.seconds) - Math.log10(a.seconds));
      const used = fraction === 1 ? [b] : fraction === 0 ? [a] : [a, b];
      return { thresholdC: a.thresholdC + (b.thresholdC - a.thresholdC) * fraction, seconds, source: isoSource(used) };
    }
  }
  // Unreachable: the bracket search above covers first.seconds < seconds < last.seconds.
  return { thresholdC: last.thresholdC, seconds, source: isoSource([last]) };
}

/**
 * Burn threshold for a surface material, with the ASTM C1055 5 s industrial basis when no time is given.
 *
 * @param material - surface material group
 * @param seconds - contact period [s]; omitted → ASTM C1055 basis (5 s)
 * @returns threshold [°C]
 * @remarks With `seconds` omitted: metals 60 °C (ASTM C1055, 5 s); other materials the ISO 13732-1 lower bound at
 *   5 s (log-time interpolation, our assumption). With `seconds` given: ISO 13732-1 as {@link burnThresholdIso13732}.
 * @example burnThresholdC('uncoatedMetal') // 60 (ASTM C1055, 5 s contact, metal)
 * References: 1. ISO 13732-1:2006. 2. ASTM C1055-20.
 */
export function burnThresholdC(material: ContactMaterial, seconds?: number): number {
  return burnThresholdWithSource(material, seconds).thresholdC;
}

/**
 * Burn threshold with its basis (see {@link burnThresholdC}).
 *
 * @param material - surface material group
 * @param seconds - contact period [s]; omitted → ASTM C1055 5 s basis
 * @returns threshold [°C], contact period [s] and the source text
 * @example burnThresholdWithSource('plastic', 60).thresholdC // 60 (ISO 13732-1:2006, 1 min, plastics)
 * References: 1. ISO 13732-1:2006. 2. ASTM C1055-20.
 */
export function burnThresholdWithSource(material: ContactMaterial, seconds?: number): BurnThreshold {
  checkMaterial(material, 'contact.material');
  if (seconds === undefined || seconds === null) {
    if (isMetal(material)) {
      return {
        thresholdC: ASTM_C1055_METAL_5S_LIMIT_C,
        seconds: ASTM_C1055_CONTACT_SECONDS,
        source:
          'ASTM C1055, 5 s industrial contact basis (confirmed: C1055 scope), metallic surface ≈ 60 °C (140 °F) ' +
          '(limit from memory; not confirmed)',
      };
    }
    const iso = burnThresholdIso13732(material, ASTM_C1055_CONTACT_SECONDS);
    return {
      ...iso,
      source: `ASTM C1055 5 s industrial contact basis; non-metallic surface evaluated with ${iso.source}`,
    };
  }
  return burnThresholdIso13732(material, seconds);
}

/**
 * Compares a surface temperature with the burn threshold for the expected contact: verdict `aboveThreshold`
 * when T_surface ≥ θ_threshold (a burn may occur at the threshold itself), else `belowThreshold`.
 *
 * @param surfaceTemperatureC - surface temperature [°C]
 * @param contact - surface material and contact period [s] (period omitted → ASTM C1055 5 s basis)
 * @returns `{ thresholdC, verdict, source }`
 * @remarks Applies to hot surfaces only; for cold surfaces see {@link COLD_CONTACT_NOTE}. The check is a screen,
 *   not a risk assessment: ISO 13732-1 also weighs who may touch the surface and how likely contact is.
 * @example burnCheck(56.5, { material: 'uncoatedMetal', seconds: 5 }).verdict // 'belowThreshold' (58 °C threshold)
 * References: 1. ISO 13732-1:2006. 2. ASTM C1055-20.
 */
export function burnCheck(surfaceTemperatureC: number, contact: Contact | ContactInput): BurnResult {
  if (typeof surfaceTemperatureC !== 'number' || !Number.isFinite(surfaceTemperatureC)) {
    throw new CalcInputError('surfaceTemperatureC', 'surfaceTemperatureC must be a finite number');
  }
  if (contact === null || typeof contact !== 'object') {
    throw new CalcInputError('contact', 'contact must be an object with material and seconds');
  }
  const threshold = burnThresholdWithSource(contact.material, contact.seconds);
  return {
    thresholdC: threshold.thresholdC,
    verdict: surfaceTemperatureC >= threshold.thresholdC ? 'aboveThreshold' : 'belowThreshold',
    source: threshold.source,
  };
}

/**
 * Note shown beside cold surfaces: ISO 13732-1 covers hot surfaces only. Cold contact is the subject of
 * ISO 13732-3:2005 (cold surfaces), whose thresholds (numbness, frostbite) are not evaluated here. The figures
 * quoted are for 10 s fingertip contact, confirmed against the selection from DIN EN ISO 13732-3 published by
 * the German Federal Institute for Occupational Safety and Health (BAuA, hazard guide "Kalte Medien/Oberflächen",
 * Table 5.2-1): frostbite at −7.0 °C on aluminium and −12.5 °C on steel, numbness at +3.0 °C and −1.0 °C. That
 * longer contact brings the frostbite risk closer to 0 °C is from memory.
 */
export const COLD_CONTACT_NOTE =
  'Cold surfaces are assessed under ISO 13732-3 (cold surfaces), not by this hot-surface check. For a 10 s ' +
  'fingertip contact ISO 13732-3 gives frostbite at about −7 °C on aluminium and −12.5 °C on steel (numbness at ' +
  '+3 °C and −1 °C); longer contact brings the risk closer to 0 °C (from memory).';

// ---------------------------------------------------------------------------------------------------------
// One verdict for touch safety

/**
 * Surface temperature below which a cold surface earns a contact warning [°C], by contact material.
 *
 * @remarks Common practice warns about cold metal below roughly −10 °C. ISO 13732-3:2005 (as quoted in
 * {@link COLD_CONTACT_NOTE}, confirmed against the BAuA selection) puts frostbite for a 10 s fingertip contact at
 * −7.0 °C on aluminium and −12.5 °C on steel; as on the hot side, this module takes the conservative edge, the
 * aluminium figure, for bare and for coated metal (the coating being unknown). For ceramic, glass, stone, plastic
 * and wood no figure is stored here: they draw heat from the skin more slowly than metal, so the metal value is a
 * conservative screen for them too (our assumption).
 */
export const COLD_CONTACT_WARNING_C: Readonly<Record<ContactMaterial, number>> = {
  uncoatedMetal: -7,
  coatedMetal: -7,
  ceramicGlassStone: -7,
  plastic: -7,
  wood: -7,
};

const COLD_CONTACT_SOURCE =
  'cold contact: ISO 13732-3:2005 frostbite onset for a 10 s fingertip contact, −7.0 °C on aluminium (the conservative ' +
  'edge of the published metals; steel −12.5 °C), confirmed against the BAuA selection from DIN EN ISO 13732-3; used for ' +
  'non-metals as well, which draw heat more slowly (our assumption); hot-surface burn thresholds do not apply';

/** The temperature scale and decimals a temperature is shown with; verdicts compare at this precision. */
export type TemperaturePrecision = {
  /** Decimals shown (1 for results, 0 for lists). */
  decimals: number;
  /** Scale shown: degrees Celsius (default) or Fahrenheit. */
  scale?: 'C' | 'F';
};

/** Where the limit of a touch-safety verdict comes from. */
export type TouchSafetyGovernor = 'touchLimit' | 'burnThreshold' | 'coldContact';

/** Inputs of {@link touchSafetyVerdict}, all SI with temperatures in °C. */
export type TouchSafetyInput = {
  /** Outer surface temperature [°C]. */
  surfaceTemperatureC: number;
  /** Air around the surface [°C]: a surface colder than the air is on cold service and is judged as cold contact. */
  airTemperatureC: number;
  /** A stated highest surface temperature (a site's or a sizing's touch limit) [°C]; omitted → the burn threshold alone. */
  limitC?: number;
  /** Who stated `limitC`, for the source text (e.g. "the site's touch limit"); default "the stated touch limit". */
  limitSource?: string;
  /** Surface material and contact time (omitted time → ASTM C1055 5 s basis). */
  contact: ContactInput;
  /** Precision the temperatures are shown at; default 0.1 °C. */
  precision?: TemperaturePrecision;
};

/** One verdict for touch safety, with the one limit it was judged against. */
export type TouchSafetyVerdict = {
  /** `pass`, `fail` (a hot surface at or above its limit) or `caution` (a cold surface below the frostbite onset). */
  verdict: 'pass' | 'caution' | 'fail';
  /** `hot` when the surface is at or above the air temperature, else `cold`. */
  regime: 'hot' | 'cold';
  /** Which limit governs: the stated touch limit, the burn threshold for the contact, or cold contact. */
  governs: TouchSafetyGovernor;
  /** The governing limit [°C]. */
  limitC: number;
  /** The surface against the governing limit, compared at the shown precision. */
  comparison: 'below' | 'at' | 'above';
  /** The burn threshold for the contact material and time (hot regime), else null [°C]. */
  burnThresholdC: number | null;
  /**
   * Highest surface temperature that passes at the shown precision (hot regime) [°C]: a sizing solved for a surface
   * at most this value gets a passing verdict. Null in the cold regime.
   */
  maxPassingSurfaceC: number | null;
  /** Basis of the governing limit. */
  source: string;
};

function shownValue(temperatureC: number, p: Required<TemperaturePrecision>): number {
  const v = p.scale === 'F' ? (temperatureC * 9) / 5 + 32 : temperatureC;
  return Number(v.toFixed(p.decimals));
}

function fromShownValue(shown: number, p: Required<TemperaturePrecision>): number {
  return p.scale === 'F' ? ((shown - 32) * 5) / 9 : shown;
}

function compareShown(a: number, b: number): 'below' | 'at' | 'above' {
  return a < b ? 'below' : a > b ? 'above' : 'at';
}

/**
 * The single touch-safety verdict of a surface: which limit governs, and whether the surface meets it as shown.
 *
 * Hot regime (surface ≥ air): the governing limit is the stricter of the stated touch limit L and the burn threshold
 * θ(material, time). A touch limit is a highest allowed temperature (pass when T_s ≤ L as shown); a burn threshold is
 * where a burn begins (pass when T_s < θ as shown), so with L and θ shown equal the threshold governs. Cold regime
 * (surface < air): the cold-contact warning temperature governs ({@link COLD_CONTACT_WARNING_C}); the verdict is
 * `caution` below it, else `pass`; hot-surface thresholds and L do not apply.
 *
 * @param input.surfaceTemperatureC - surface temperature [°C]
 * @param input.airTemperatureC - air temperature [°C]
 * @param input.limitC - stated touch limit [°C], optional
 * @param input.contact - surface material and contact time [s]
 * @param input.precision - decimals and scale the figures are shown with (default 1 decimal, °C)
 * @returns verdict, regime, governing limit [°C] and its source, comparison as shown, burn threshold [°C], and the
 *   highest passing surface temperature [°C] for a solver
 * @remarks Comparing at the shown precision keeps the words in step with the figures: 58.0 °C against a 58.0 °C
 *   threshold reads "at the threshold" (a fail), never "above" it. A screen, not a risk assessment; the plant's
 *   specification, local codes and a competent engineer decide what is safe to touch.
 * @example touchSafetyVerdict({ surfaceTemperatureC: 58.03, airTemperatureC: 25, limitC: 60, contact: { material: 'uncoatedMetal', seconds: 5 } })
 *   // → { verdict: 'fail', governs: 'burnThreshold', comparison: 'at', limitC: ≈58.01, … } (ISO 13732-1, 5 s, metal)
 * References: 1. ISO 13732-1:2006. 2. ASTM C1055-20. 3. ISO 13732-3:2005.
 */
export function touchSafetyVerdict(input: TouchSafetyInput): TouchSafetyVerdict {
  if (input === null || typeof input !== 'object') throw new CalcInputError('(input)', 'touchSafetyVerdict needs an object');
  const { surfaceTemperatureC: s, airTemperatureC: air, limitC, contact } = input;
  if (typeof s !== 'number' || !Number.isFinite(s)) throw new CalcInputError('surfaceTemperatureC', 'surfaceTemperatureC must be a finite number');
  if (typeof air !== 'number' || !Number.isFinite(air)) throw new CalcInputError('airTemperatureC', 'airTemperatureC must be a finite number');
  if (limitC !== undefined && (typeof limitC !== 'number' || !Number.isFinite(limitC))) {
    throw new CalcInputError('limitC', 'limitC must be a finite number when given');
  }
  if (contact === null || typeof contact !== 'object') throw new CalcInputError('contact', 'contact must be an object with material and seconds');
  checkMaterial(contact.material, 'contact.material');
  const decimals = input.precision?.decimals ?? 1;
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 6) {
    throw new CalcInputError('precision.decimals', 'precision.decimals must be an integer from 0 to 6');
  }
  const scale = input.precision?.scale ?? 'C';
  if (scale !== 'C' && scale !== 'F') throw new CalcInputError('precision.scale', 'precision.scale must be C or F');
  const p: Required<TemperaturePrecision> = { decimals, scale };
  const shownSurface = shownValue(s, p);

  if (s < air) {
    const cold = COLD_CONTACT_WARNING_C[contact.material];
    const comparison = compareShown(shownSurface, shownValue(cold, p));
    return {
      verdict: comparison === 'below' ? 'caution' : 'pass',
      regime: 'cold',
      governs: 'coldContact',
      limitC: cold,
      comparison,
      burnThresholdC: null,
      maxPassingSurfaceC: null,
      source: COLD_CONTACT_SOURCE,
    };
  }

  const burn = burnThresholdWithSource(contact.material, contact.seconds);
  const shownBurn = shownValue(burn.thresholdC, p);
  const step = 10 ** -decimals;
  if (limitC !== undefined && shownValue(limitC, p) < shownBurn) {
    const comparison = compareShown(shownSurface, shownValue(limitC, p));
    return {
      verdict: comparison === 'above' ? 'fail' : 'pass',
      regime: 'hot',
      governs: 'touchLimit',
      limitC,
      comparison,
      burnThresholdC: burn.thresholdC,
      maxPassingSurfaceC: limitC,
      source: `${input.limitSource ?? 'the stated touch limit'}, stricter than the burn threshold (${burn.source})`,
    };
  }
  const comparison = compareShown(shownSurface, shownBurn);
  return {
    verdict: comparison === 'below' ? 'pass' : 'fail',
    regime: 'hot',
    governs: 'burnThreshold',
    limitC: burn.thresholdC,
    comparison,
    burnThresholdC: burn.thresholdC,
    maxPassingSurfaceC: fromShownValue(Number((shownBurn - step).toFixed(decimals)), p),
    source: burn.source,
  };
}
