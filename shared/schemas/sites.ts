import * as yup from 'yup';
import { LIMITS } from './common';

const temperatureC = (label: string) =>
  yup.number().strict().min(-100, `${label} must be at least -100 °C`).max(1000, `${label} must be at most 1000 °C`);
const windSpeed = () => yup.number().strict().min(0, 'Wind speed must not be negative').max(60, 'Wind speed must be at most 60 m/s');
const emissivity = () => yup.number().strict().min(0.01, 'Emissivity must be at least 0.01').max(1, 'Emissivity must be at most 1');

/** Hottest credible air, still air, worst emissivity: used for personnel protection. */
export const touchBasisSchema = yup
  .object({
    airTemperatureC: temperatureC('Air temperature').required('Air temperature is required'),
    radiantTemperatureC: temperatureC('Radiant temperature').optional(),
    windSpeedMS: windSpeed().optional(),
    surfaceEmissivity: emissivity().optional(),
    contactSeconds: yup.number().strict().min(1, 'Contact time must be at least 1 s').max(28800, 'Contact time must be at most 8 h').optional(),
  })
  .noUnknown()
  .strict();

/** Annual-average conditions and economics for heat conservation. */
export const energyBasisSchema = yup
  .object({
    airTemperatureC: temperatureC('Air temperature').required('Air temperature is required'),
    windSpeedMS: windSpeed().optional(),
    operatingHoursPerYear: yup.number().strict().min(0, 'Operating hours must not be negative').max(8784, 'Operating hours must be at most 8784 h a year').optional(),
    energyPricePerKWh: yup.number().strict().min(0, 'Energy price must not be negative').max(100, 'Energy price is implausibly high').optional(),
    currency: yup.string().strict().matches(/^[A-Z]{3}$/, 'Currency must be a three-letter code').optional(),
    heatSourceEfficiency: yup.number().strict().moreThan(0, 'Efficiency must be above 0').max(1, 'Efficiency must be at most 1').optional(),
    co2KgPerKWh: yup.number().strict().min(0, 'CO₂ factor must not be negative').max(5, 'CO₂ factor is implausibly high').optional(),
    co2Basis: yup.string().strict().max(200, 'CO₂ basis must be at most 200 characters').optional(),
  })
  .noUnknown()
  .strict();

/** Air and humidity for condensation control on cold service. */
export const condensationBasisSchema = yup
  .object({
    airTemperatureC: temperatureC('Air temperature').required('Air temperature is required'),
    relativeHumidityPct: yup.number().strict().min(0, 'Relative humidity must be 0–100 %').max(100, 'Relative humidity must be 0–100 %').required('Relative humidity is required'),
    marginK: yup.number().strict().min(0, 'Margin must not be negative').max(20, 'Margin must be at most 20 K').optional(),
  })
  .noUnknown()
  .strict();

export const designBasesSchema = yup
  .object({
    touch: touchBasisSchema.default(undefined).optional(),
    energy: energyBasisSchema.default(undefined).optional(),
    condensation: condensationBasisSchema.default(undefined).optional(),
  })
  .noUnknown()
  .strict();
export type DesignBases = yup.InferType<typeof designBasesSchema>;

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
