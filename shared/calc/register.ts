/**
 * The verdict of a hot-surface register entry: a surface temperature measured on the plant (or computed by
 * sizing) judged against the touch limit that applies to its surface material and expected contact time.
 *
 * @remarks
 * The limit is the one whole-site sizing uses for personnel protection, so a line and its register entry never
 * disagree: the ISO 13732-1 burn threshold for the material and contact time (ASTM C1055 5 s basis when no time is
 * given; {@link burnThresholdWithSource}), or the site's own touch limit where that is lower. Like sizing, the
 * reading is compared at the precision results are shown (0.1 °C): a reading shown at the limit meets it.
 *
 * Beyond the comparison, the verdict carries the cautions a safety officer needs on a plant walk:
 * - **Infrared on a low-emissivity surface.** An infrared thermometer infers temperature from radiance assuming
 *   the emissivity it is set to. Bare aluminium, stainless steel and galvanised steel emit far less than the
 *   0.95 such instruments are usually left at, so the reading is low — possibly far below the true surface
 *   temperature — and, at any setting, such surfaces reflect their surroundings. A pass on such a reading cannot
 *   be trusted, so it becomes a caution (confirm with a contact probe, or a patch of tape or paint of known
 *   emissivity: common practice).
 * - **Cold surfaces** below −10 °C are not judged by the hot-surface thresholds at all; they carry the
 *   cold-contact note ({@link COLD_CONTACT_NOTE}) as a caution.
 * - **Out of reach.** A surface above the limit that is not within reach of a walkway, platform or ladder is a
 *   caution, not a failure: the hazard is there if access changes (scaffolds, maintenance).
 *
 * The verdict is a screen, not a risk assessment; the plant's specification, local codes and a competent person
 * decide what is safe.
 *
 * References:
 * 1. ISO 13732-1:2006, *Ergonomics of the thermal environment — Methods for the assessment of human responses to
 *    contact with surfaces — Part 1: Hot surfaces*, clause 4.2 (burn thresholds) — through `burn.ts`.
 * 2. ASTM C1055-20, *Standard Guide for Heated System Surface Conditions that Produce Contact Burn Injuries*.
 * 3. ISO 13732-3:2005, *… Part 3: Cold surfaces* — through {@link COLD_CONTACT_NOTE}.
 */

import { burnThresholdWithSource, COLD_CONTACT_NOTE, CONTACT_MATERIALS } from './burn';
import { CalcInputError } from './errors';
import { FINISHES, type Finish } from './library/finishes';
import type { ContactMaterial } from './types';

/** How a register temperature was obtained. `calculated`: taken from the item's sizing, not measured. */
export const MEASUREMENT_METHODS = ['contact', 'infrared', 'calculated'] as const;
export type MeasurementMethod = (typeof MEASUREMENT_METHODS)[number];

/**
 * Below this surface temperature the cold-contact note applies instead of the hot-surface thresholds [°C].
 * Common practice (warn below about −10 °C for metal); ISO 13732-3 gives frostbite for a 10 s fingertip contact
 * at about −12.5 °C on steel and −7 °C on aluminium (see {@link COLD_CONTACT_NOTE}).
 */
export const COLD_CONTACT_BELOW_C = -10;

/**
 * An emissivity setting, or a surface emissivity, below this counts as low for an infrared reading [–].
 * Common practice: handheld infrared thermometers are trusted on surfaces of emissivity above about 0.5 (paint,
 * oxidised steel, plastics, ceramics); below it reflected surroundings and the uncertainty of the emissivity
 * itself dominate the reading.
 */
export const LOW_EMISSIVITY_BELOW = 0.5;

/**
 * Built-in finishes that count as low-emissivity surfaces for infrared readings: the metallic finishes whose
 * typical emissivity is below {@link LOW_EMISSIVITY_BELOW} (bright and oxidised aluminium, stainless steel, new and
 * weathered galvanised steel), with the emissivities the library states for them.
 */
export const LOW_EMISSIVITY_FINISHES: readonly Finish[] = FINISHES.filter((f) => f.metallic && f.emissivity < LOW_EMISSIVITY_BELOW);

/** A register reading as the verdict needs it (SI, °C). */
export type RegisterReading = {
  /** Surface temperature measured or computed [°C]. */
  temperatureC: number;
  method: MeasurementMethod;
  /** Emissivity the infrared thermometer was set to [–]; infrared only. */
  emissivitySetting?: number | null;
  /** ISO 13732-1 surface-material group. */
  surfaceMaterial: ContactMaterial;
  /** Built-in finish id of the surface (e.g. `aluminium-oxidised`), when known. */
  surfaceFinishId?: string | null;
  /** Within reach of a walkway, platform or ladder. */
  withinReach: boolean;
  /** Expected contact time of this surface [s]; omitted → the site's, else the ASTM C1055 5 s basis. */
  contactSeconds?: number | null;
};

/** The part of a site's touch-safety basis the verdict uses. */
export type RegisterTouchBasis = {
  /** Expected contact time for the site [s]. */
  contactSeconds?: number | null;
  /** The site's own touch limit [°C]; applies where it is below the burn threshold. */
  maxSurfaceC?: number | null;
};

export type RegisterCautionCode = 'INFRARED_LOW_EMISSIVITY' | 'INFRARED_BARE_METAL_UNSTATED' | 'COLD_CONTACT' | 'OUT_OF_REACH';

export type RegisterCaution = { code: RegisterCautionCode; message: string };

export type RegisterVerdictValue = 'fail' | 'caution' | 'pass';

/** The judgement of one register reading. */
export type RegisterVerdict = {
  /** `fail`: above the limit and within reach; `caution`: see `cautions`; `pass`: at or below the limit. */
  verdict: RegisterVerdictValue;
  /** `hot`: compared with a touch limit; `cold`: below {@link COLD_CONTACT_BELOW_C}, not compared. */
  basis: 'hot' | 'cold';
  /** The limit the reading was compared with [°C]; null for cold surfaces. */
  limitC: number | null;
  /** Which limit governs: the site's touch limit or the burn threshold; null for cold surfaces. */
  governs: 'touchLimit' | 'burnThreshold' | null;
  /** Contact time the threshold is for [s]; null for cold surfaces. */
  contactSeconds: number | null;
  /** Reading minus limit [K]; null for cold surfaces. */
  marginK: number | null;
  /** Where the limit comes from (or the cold-contact note). */
  source: string;
  cautions: RegisterCaution[];
};

const fmt = (x: number) => String(Math.round(x * 100) / 100);

function checkReading(r: RegisterReading): void {
  if (r === null || typeof r !== 'object') throw new CalcInputError('reading', 'reading must be an object');
  if (typeof r.temperatureC !== 'number' || !Number.isFinite(r.temperatureC)) {
    throw new CalcInputError('temperatureC', 'temperatureC must be a finite number of degrees Celsius');
  }
  if (!(MEASUREMENT_METHODS as readonly string[]).includes(r.method)) {
    throw new CalcInputError('method', `method must be one of ${MEASUREMENT_METHODS.join(', ')}`);
  }
  if (!(CONTACT_MATERIALS as readonly string[]).includes(r.surfaceMaterial)) {
    throw new CalcInputError('surfaceMaterial', `surfaceMaterial must be one of ${CONTACT_MATERIALS.join(', ')}`);
  }
  const e = r.emissivitySetting;
  if (e !== undefined && e !== null && (typeof e !== 'number' || !(e > 0 && e <= 1))) {
    throw new CalcInputError('emissivitySetting', 'emissivitySetting must be above 0 and at most 1');
  }
  const s = r.contactSeconds;
  if (s !== undefined && s !== null && (typeof s !== 'number' || !Number.isFinite(s) || s <= 0)) {
    throw new CalcInputError('contactSeconds', 'contactSeconds must be a positive number of seconds');
  }
}

/** Cautions of an infrared reading on the surface; `escalate` when a pass on it cannot be trusted. */
function infraredCautions(r: RegisterReading): { cautions: RegisterCaution[]; escalate: boolean } {
  if (r.method !== 'infrared') return { cautions: [], escalate: false };
  const finish = r.surfaceFinishId ? FINISHES.find((f) => f.id === r.surfaceFinishId) : undefined;
  const lowFinish = finish && LOW_EMISSIVITY_FINISHES.includes(finish) ? finish : undefined;
  const setting = r.emissivitySetting ?? null;
  if (lowFinish) {
    const [lo, hi] = lowFinish.emissivityRange;
    const settingText = setting === null ? 'an unstated emissivity' : `ε ${fmt(setting)}`;
    const reason =
      setting !== null && setting > hi
        ? `the thermometer was set to ${settingText}, but ${lowFinish.name.toLowerCase()} has an emissivity of about ${fmt(lo)}–${fmt(hi)}, so the surface may be much hotter than read`
        : `${lowFinish.name.toLowerCase()} has an emissivity of about ${fmt(lo)}–${fmt(hi)}; at ${settingText} the reading still depends on reflected surroundings and on the surface's state`;
    return {
      escalate: true,
      cautions: [
        {
          code: 'INFRARED_LOW_EMISSIVITY',
          message: `An infrared reading on a low-emissivity surface reads low: ${reason}. Confirm with a contact probe, or measure on a patch of tape or paint of known emissivity.`,
        },
      ],
    };
  }
  if (setting !== null && setting < LOW_EMISSIVITY_BELOW) {
    return {
      escalate: true,
      cautions: [
        {
          code: 'INFRARED_LOW_EMISSIVITY',
          message: `The thermometer was set to ε ${fmt(setting)}, a low-emissivity (shiny) surface: bare aluminium, stainless or galvanised steel read low and reflect their surroundings, so the reading is uncertain. Confirm with a contact probe, or measure on a patch of tape or paint of known emissivity.`,
        },
      ],
    };
  }
  if (r.surfaceMaterial === 'uncoatedMetal' && !finish) {
    return {
      escalate: true,
      cautions: [
        {
          code: 'INFRARED_BARE_METAL_UNSTATED',
          message: 'Bare metal of an unstated kind: if it is aluminium, stainless or galvanised steel, an infrared reading reads low. Say which surface it is, or confirm with a contact probe.',
        },
      ],
    };
  }
  return { cautions: [], escalate: false };
}

/**
 * Judges a register reading against the touch limit for its surface material and contact time.
 *
 * Limit θ = min(θ_burn(material, t), θ_site) where θ_burn is the ISO 13732-1 lower bound (ASTM C1055 5 s basis
 * when no contact time is known) and θ_site the site's touch limit when given; t = the entry's contact time, else
 * the site's. Verdict: fail when round(T, 0.1 °C) > θ and the surface is within reach; caution when above but out
 * of reach, when T < −10 °C (cold contact, not compared), or when a pass rests on an infrared reading of a
 * low-emissivity surface; else pass.
 *
 * @param reading - the measured (or computed) surface temperature [°C], how it was obtained, the surface and
 *   its accessibility and expected contact time [s]
 * @param basis - the site's touch basis: contact time [s] and optional touch limit [°C]
 * @returns the verdict with the limit [°C], which limit governs, the margin [K], the source and the cautions
 * @remarks Screening only: ISO 13732-1 also weighs who may touch the surface and how likely contact is. The
 *   log-time interpolation between tabulated contact periods is an assumption of `burn.ts`, stated in `source`.
 * @example registerVerdict({ temperatureC: 52, method: 'contact', surfaceMaterial: 'uncoatedMetal', withinReach: true,
 *   contactSeconds: 60 }).verdict // 'fail' (ISO 13732-1:2006, 1 min contact with uncoated metal: 51 °C)
 * References: 1. ISO 13732-1:2006, clause 4.2. 2. ASTM C1055-20. 3. ISO 13732-3:2005.
 */
export function registerVerdict(reading: RegisterReading, basis: RegisterTouchBasis = {}): RegisterVerdict {
  checkReading(reading);
  const ir = infraredCautions(reading);
  if (reading.temperatureC < COLD_CONTACT_BELOW_C) {
    return {
      verdict: 'caution',
      basis: 'cold',
      limitC: null,
      governs: null,
      contactSeconds: null,
      marginK: null,
      source: COLD_CONTACT_NOTE,
      cautions: [{ code: 'COLD_CONTACT', message: COLD_CONTACT_NOTE }, ...ir.cautions],
    };
  }
  const seconds = reading.contactSeconds ?? basis.contactSeconds ?? undefined;
  const threshold = burnThresholdWithSource(reading.surfaceMaterial, seconds);
  const siteLimit = basis.maxSurfaceC ?? undefined;
  const touchLimitGoverns = siteLimit !== undefined && Number.isFinite(siteLimit) && siteLimit < threshold.thresholdC;
  const limitC = touchLimitGoverns ? (siteLimit as number) : threshold.thresholdC;
  const source = touchLimitGoverns
    ? `The site's touch limit (below the burn threshold of ${fmt(threshold.thresholdC)} °C for this surface and contact time)`
    : threshold.source;
  const shown = Math.round(reading.temperatureC * 10) / 10;
  const above = shown > limitC;
  const cautions: RegisterCaution[] = [...ir.cautions];
  let verdict: RegisterVerdictValue;
  if (above && reading.withinReach) verdict = 'fail';
  else if (above) {
    verdict = 'caution';
    cautions.push({
      code: 'OUT_OF_REACH',
      message:
        'Above the touch limit but out of reach of walkways, platforms and ladders: keep it so, and guard or insulate it before access changes (scaffolds, maintenance).',
    });
  } else verdict = ir.escalate ? 'caution' : 'pass';
  return {
    verdict,
    basis: 'hot',
    limitC,
    governs: touchLimitGoverns ? 'touchLimit' : 'burnThreshold',
    contactSeconds: threshold.seconds,
    marginK: reading.temperatureC - limitC,
    source,
    cautions,
  };
}
