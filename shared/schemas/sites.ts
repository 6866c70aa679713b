import * as yup from 'yup';
import { LIMITS } from './common';

/** The design bases a site holds. */
export const BASIS_KEYS = ['touch', 'energy', 'condensation', 'winter'] as const;
export type BasisKey = (typeof BASIS_KEYS)[number];

/**
 * The credible range of one numeric basis value (outside it the value is refused, by the server and the form
 * alike) and its usual range (outside it the form warns but accepts). SI, temperatures in °C.
 */
export type BasisRange = {
  /** What the value is, in the form's words (lower case, for "… must be …"). */
  label: string;
  unit: '°C' | 'K' | 'm/s' | '%' | 's' | 'h' | 'ratio' | 'fraction' | 'price' | 'kgCo2PerKWh';
  min: number;
  max: number;
  /** `min` itself is refused (the value must be above it). */
  minExclusive?: boolean;
  /** Why the credible range ends where it does, for the refusal message. */
  why: string;
  usualMin?: number;
  usualMax?: number;
  /** What is unusual outside the usual range, for the warning. */
  usualNote?: string;
};

/**
 * Credible and usual ranges of every numeric design-basis value (common practice; each bound states why). The
 * yup schemas below are built from this table, and the site form reads it for its own messages and warnings.
 */
export const BASIS_RANGES = {
  touch: {
    airTemperatureC: { label: 'air temperature', unit: '°C', min: -40, max: 60, why: 'the hottest credible air where people work', usualMin: 0, usualMax: 50, usualNote: 'the touch basis is the hottest credible air around people; check this is not a process temperature' },
    radiantTemperatureC: { label: 'radiant temperature', unit: '°C', min: -60, max: 150, why: 'surroundings people work among', usualMin: -10, usualMax: 70, usualNote: 'surroundings this hot or cold are unusual around walkways' },
    windSpeedMS: { label: 'wind speed', unit: 'm/s', min: 0, max: 30, why: 'beyond storm force', usualMax: 1, usualNote: 'touch safety is usually judged in still air, the worst case: wind cools the surface' },
    surfaceEmissivity: { label: 'surface emissivity', unit: 'ratio', min: 0.02, max: 1, why: 'the physical range of real surfaces' },
    contactSeconds: { label: 'contact time', unit: 's', min: 1, max: 28800, why: 'the contact periods of ISO 13732-1 (1 s to 8 h)', usualMax: 600, usualNote: 'contact this long is unusual; 5 s is the industrial basis of ASTM C1055' },
    maxSurfaceC: { label: 'touch limit', unit: '°C', min: 30, max: 100, why: 'the highest surface temperature a site may set for people to touch', usualMin: 40, usualMax: 65, usualNote: 'a touch limit outside 40…65 °C is unusual; the burn threshold for the surface and contact time applies when it is lower' },
  },
  energy: {
    airTemperatureC: { label: 'air temperature', unit: '°C', min: -50, max: 45, why: 'an annual average anywhere people run plants', usualMin: -20, usualMax: 30, usualNote: 'an annual-average air temperature outside −20…30 °C is unusual' },
    windSpeedMS: { label: 'wind speed', unit: 'm/s', min: 0, max: 30, why: 'beyond storm force', usualMax: 10, usualNote: 'an annual-average wind this strong is unusual' },
    operatingHoursPerYear: { label: 'operating hours', unit: 'h', min: 0, max: 8784, why: 'the hours in a leap year' },
    energyPricePerKWh: { label: 'energy price', unit: 'price', min: 0, max: 100, why: 'per kWh in any currency', usualMax: 1, usualNote: 'a fuel price this high is unusual in EUR, USD or GBP; check the price and its unit' },
    heatSourceEfficiency: { label: 'heat-source efficiency', unit: 'fraction', min: 0, minExclusive: true, max: 1, why: 'a fraction of the fuel energy', usualMin: 0.5, usualNote: 'a heat-source efficiency this low is unusual' },
    co2KgPerKWh: { label: 'CO₂ factor', unit: 'kgCo2PerKWh', min: 0, max: 2, why: 'more than any fuel or grid emits', usualMax: 1, usualNote: 'a CO₂ factor this high is unusual even for coal or a coal-fired grid' },
    coolingCop: { label: 'chiller coefficient of performance', unit: 'ratio', min: 0.3, max: 15, why: 'absorption to the best electric chillers', usualMin: 1.5, usualMax: 8, usualNote: 'electric chillers usually run at a COP of 2.5–6' },
    electricityPricePerKWh: { label: 'electricity price', unit: 'price', min: 0, max: 100, why: 'per kWh in any currency', usualMax: 1, usualNote: 'an electricity price this high is unusual in EUR, USD or GBP; check the price and its unit' },
    electricityCo2KgPerKWh: { label: 'CO₂ factor of electricity', unit: 'kgCo2PerKWh', min: 0, max: 2, why: 'more than any grid emits', usualMax: 1.2, usualNote: 'a grid CO₂ factor this high is unusual' },
  },
  condensation: {
    airTemperatureC: { label: 'air temperature', unit: '°C', min: -40, max: 60, why: 'air around cold lines in a plant', usualMin: 0, usualMax: 45, usualNote: 'condensation control is usually designed for warm, humid air' },
    relativeHumidityPct: { label: 'relative humidity', unit: '%', min: 0, max: 100, why: 'the physical range', usualMin: 30, usualMax: 95, usualNote: 'below 30 % condensation rarely governs; above 95 % no practical thickness keeps a cold surface dry' },
    marginK: { label: 'margin above the dew point', unit: 'K', min: 0, max: 10, why: 'beyond that it is no longer a margin', usualMax: 5, usualNote: 'a margin this wide is unusual; a few degrees is usual' },
  },
  winter: {
    airTemperatureC: { label: 'air temperature', unit: '°C', min: -70, max: 20, why: 'the coldest design air anywhere people run plants', usualMin: -50, usualMax: 0, usualNote: 'frost protection needs design air below 0 °C' },
    windSpeedMS: { label: 'wind speed', unit: 'm/s', min: 0, max: 30, why: 'beyond storm force', usualMax: 15, usualNote: 'a design wind this strong is unusual' },
  },
} as const satisfies Record<BasisKey, Record<string, BasisRange>>;

/** The words of each basis in messages. */
export const BASIS_TITLES: Record<BasisKey, string> = {
  touch: 'Touch safety',
  energy: 'Energy',
  condensation: 'Condensation',
  winter: 'Winter',
};

const UNIT_TEXT: Record<BasisRange['unit'], string> = {
  '°C': ' °C',
  K: ' K',
  'm/s': ' m/s',
  '%': ' %',
  s: ' s',
  h: ' h',
  ratio: '',
  fraction: '',
  price: ' per kWh',
  kgCo2PerKWh: ' kg CO₂/kWh',
};

/** A basis value with its unit, as the server's messages state it (SI). */
export function basisValueText(range: BasisRange, si: number): string {
  return `${range.unit === 'fraction' ? `${si * 100} %` : `${si}${UNIT_TEXT[range.unit]}`}`;
}

function rangeNumber(basis: BasisKey, r: BasisRange) {
  const name = `${BASIS_TITLES[basis]}: ${r.label}`;
  let n = yup.number().strict().typeError(`${name} must be a number`);
  n = r.minExclusive
    ? n.moreThan(r.min, `${name} must be above ${basisValueText(r, r.min)} (${r.why})`)
    : n.min(r.min, `${name} must be at least ${basisValueText(r, r.min)} (${r.why})`);
  return n.max(r.max, `${name} must be at most ${basisValueText(r, r.max)} (${r.why})`);
}

const R = BASIS_RANGES;
const text = (label: string, max = 200) => yup.string().strict().max(max, `${label} must be at most ${max} characters`);

/** Hottest credible air, still air, worst emissivity: used for personnel protection. */
export const touchBasisSchema = yup
  .object({
    airTemperatureC: rangeNumber('touch', R.touch.airTemperatureC).required('Touch safety: air temperature is required'),
    radiantTemperatureC: rangeNumber('touch', R.touch.radiantTemperatureC).optional(),
    windSpeedMS: rangeNumber('touch', R.touch.windSpeedMS).optional(),
    surfaceEmissivity: rangeNumber('touch', R.touch.surfaceEmissivity).optional(),
    contactSeconds: rangeNumber('touch', R.touch.contactSeconds).optional(),
    maxSurfaceC: rangeNumber('touch', R.touch.maxSurfaceC).optional(),
  })
  .noUnknown()
  .strict();

/**
 * Annual-average conditions and economics for heat conservation; on cold service a heat gain is removed by a
 * chiller, costed with its coefficient of performance and electricity's price and CO₂ factor.
 */
export const energyBasisSchema = yup
  .object({
    airTemperatureC: rangeNumber('energy', R.energy.airTemperatureC).required('Energy: air temperature is required'),
    windSpeedMS: rangeNumber('energy', R.energy.windSpeedMS).optional(),
    operatingHoursPerYear: rangeNumber('energy', R.energy.operatingHoursPerYear).optional(),
    energyPricePerKWh: rangeNumber('energy', R.energy.energyPricePerKWh).optional(),
    currency: yup.string().strict().matches(/^[A-Z]{3}$/, 'Energy: currency must be a three-letter code such as EUR or USD').optional(),
    heatSourceEfficiency: rangeNumber('energy', R.energy.heatSourceEfficiency).optional(),
    co2KgPerKWh: rangeNumber('energy', R.energy.co2KgPerKWh).optional(),
    co2Basis: text('Energy: basis of the CO₂ factor').optional(),
    coolingCop: rangeNumber('energy', R.energy.coolingCop).optional(),
    electricityPricePerKWh: rangeNumber('energy', R.energy.electricityPricePerKWh).optional(),
    electricityCo2KgPerKWh: rangeNumber('energy', R.energy.electricityCo2KgPerKWh).optional(),
    electricityCo2Basis: text('Energy: basis of the CO₂ factor of electricity').optional(),
  })
  .noUnknown()
  .strict();

/** Air and humidity for condensation control on cold service. */
export const condensationBasisSchema = yup
  .object({
    airTemperatureC: rangeNumber('condensation', R.condensation.airTemperatureC).required('Condensation: air temperature is required'),
    relativeHumidityPct: rangeNumber('condensation', R.condensation.relativeHumidityPct).required('Condensation: relative humidity is required'),
    marginK: rangeNumber('condensation', R.condensation.marginK).optional(),
  })
  .noUnknown()
  .strict();

/** Coldest design conditions, used for frost protection and process temperature holding. */
export const winterBasisSchema = yup
  .object({
    airTemperatureC: rangeNumber('winter', R.winter.airTemperatureC).required('Winter: air temperature is required'),
    windSpeedMS: rangeNumber('winter', R.winter.windSpeedMS).optional(),
  })
  .noUnknown()
  .strict();

export const designBasesSchema = yup
  .object({
    touch: touchBasisSchema.default(undefined).optional(),
    energy: energyBasisSchema.default(undefined).optional(),
    condensation: condensationBasisSchema.default(undefined).optional(),
    winter: winterBasisSchema.default(undefined).optional(),
  })
  .noUnknown()
  .strict();
export type DesignBases = yup.InferType<typeof designBasesSchema>;

/** A value that is credible but unusual: accepted, with a word of warning. */
export type BasisWarning = { basis: BasisKey; key: string; field: string; message: string };

/**
 * Warnings for values inside their credible range but outside their usual one (the form shows them; nothing is
 * refused). Field paths are those of the API (`designBases.touch.windSpeedMS`).
 */
export function designBasisWarnings(bases: DesignBases): BasisWarning[] {
  const out: BasisWarning[] = [];
  for (const basis of BASIS_KEYS) {
    const values = bases[basis] as Record<string, unknown> | undefined;
    if (!values) continue;
    for (const [key, range] of Object.entries(BASIS_RANGES[basis]) as [string, BasisRange][]) {
      const v = values[key];
      if (typeof v !== 'number' || !Number.isFinite(v) || v < range.min || v > range.max) continue;
      const low = range.usualMin !== undefined && v < range.usualMin;
      const high = range.usualMax !== undefined && v > range.usualMax;
      if ((low || high) && range.usualNote) {
        out.push({ basis, key, field: `designBases.${basis}.${key}`, message: `${BASIS_TITLES[basis]}: ${range.usualNote}.` });
      }
    }
  }
  return out;
}

const siteName = () =>
  yup
    .string()
    .strict()
    .trim('Site name must not start or end with spaces')
    .min(1, 'Site name is required')
    .max(LIMITS.siteNameMax, `Site name must be at most ${LIMITS.siteNameMax} characters`);
const siteDescription = () =>
  yup.string().strict().max(LIMITS.siteDescriptionMax, `Description must be at most ${LIMITS.siteDescriptionMax} characters`);

export const siteCreateSchema = yup
  .object({
    name: siteName().required('Site name is required'),
    description: siteDescription().optional(),
    designBases: designBasesSchema.default(undefined).optional(),
  })
  .noUnknown()
  .strict();
export type SiteCreateInput = yup.InferType<typeof siteCreateSchema>;

export const sitePatchSchema = yup
  .object({
    name: siteName().optional(),
    description: siteDescription().optional(),
    designBases: designBasesSchema.default(undefined).optional(),
  })
  .noUnknown()
  .strict();
export type SitePatchInput = yup.InferType<typeof sitePatchSchema>;

export const siteMemberAddSchema = yup
  .object({ userId: yup.number().strict().integer('User id must be a whole number').positive('User id must be positive').required('User id is required') })
  .noUnknown()
  .strict();
export type SiteMemberAddInput = yup.InferType<typeof siteMemberAddSchema>;
