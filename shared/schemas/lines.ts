import * as yup from 'yup';

import { pipeSizeByDn, pipeSizeByNps } from '../calc/pipe-sizes';
import { PIPE_ONLY_PURPOSES, PURPOSES, type Purpose } from '../calc/sizing/types';

/** Bounds of line-list fields, shared by the forms, the import and the API. */
export const ITEM_LIMITS = {
  tagMax: 100,
  serviceMax: 200,
  notesMax: 5000,
  /** Operating temperature [°C]. */
  temperatureMinC: -200,
  temperatureMaxC: 1000,
  /** Line outside diameter [m]: 5 mm to 5 m. */
  lineDiameterMinM: 0.005,
  lineDiameterMaxM: 5,
  /** Vessel shell outside diameter [m]. */
  vesselDiameterMinM: 0.1,
  vesselDiameterMaxM: 30,
  lengthMaxM: 100_000,
  vesselLengthMaxM: 200,
  fittingsMax: 10_000,
  buildUpLayersMax: 6,
  layerThicknessMaxM: 1,
} as const;

const num = (label: string) => yup.number().strict().typeError(`${label} must be a number`);
const count = (label: string) =>
  num(label).integer(`${label} must be a whole number`).min(0, `${label} must not be negative`).max(ITEM_LIMITS.fittingsMax, `${label} must be at most ${ITEM_LIMITS.fittingsMax}`);

const tag = () =>
  yup
    .string()
    .strict()
    .trim('Tag must not start or end with spaces')
    .min(1, 'Tag is required')
    .max(ITEM_LIMITS.tagMax, `Tag must be at most ${ITEM_LIMITS.tagMax} characters`);
const service = () => yup.string().strict().max(ITEM_LIMITS.serviceMax, `Service must be at most ${ITEM_LIMITS.serviceMax} characters`);
const notes = () => yup.string().strict().max(ITEM_LIMITS.notesMax, `Notes must be at most ${ITEM_LIMITS.notesMax} characters`);
const operatingTemperature = () =>
  num('Operating temperature')
    .min(ITEM_LIMITS.temperatureMinC, `Operating temperature must be at least ${ITEM_LIMITS.temperatureMinC} °C`)
    .max(ITEM_LIMITS.temperatureMaxC, `Operating temperature must be at most ${ITEM_LIMITS.temperatureMaxC} °C`);
const location = () => yup.string<'indoor' | 'outdoor'>().strict().oneOf(['indoor', 'outdoor'], 'Location must be indoor or outdoor');
const orientation = () => yup.string<'horizontal' | 'vertical'>().strict().oneOf(['horizontal', 'vertical'], 'Orientation must be horizontal or vertical');

const purposes = (allowed: readonly Purpose[]) =>
  yup
    .array()
    .strict()
    .of(yup.string<Purpose>().strict().oneOf([...allowed], `Purpose must be one of ${allowed.join(', ')}`).required())
    .min(1, 'Give at least one purpose')
    .max(allowed.length, 'A purpose is listed twice')
    .test('unique', 'A purpose is listed twice', (v) => !v || new Set(v).size === v.length);

const purposeParameters = (kind: 'line' | 'vessel') =>
  yup
    .object({
      heatConservation: yup
        .object(
          kind === 'line'
            ? { maxHeatLossWPerM: num('Heat-loss limit').moreThan(0, 'Heat-loss limit must be above 0 W/m').max(100_000, 'Heat-loss limit must be at most 100,000 W/m').optional() }
            : { maxHeatLossW: num('Heat-loss limit').moreThan(0, 'Heat-loss limit must be above 0 W').max(1e8, 'Heat-loss limit must be at most 100 MW').optional() },
        )
        .noUnknown()
        .strict()
        .default(undefined)
        .optional(),
      ...(kind === 'line'
        ? {
            temperatureHolding: yup
              .object({
                massFlowKgPerS: num('Mass flow').moreThan(0, 'Mass flow must be above 0 kg/s').max(10_000, 'Mass flow must be at most 10,000 kg/s').required('Mass flow is required'),
                specificHeatJPerKgK: num('Specific heat').min(100, 'Specific heat must be at least 100 J/(kg·K)').max(20_000, 'Specific heat must be at most 20,000 J/(kg·K)').required('Specific heat is required'),
                maxChangeK: num('Largest temperature change').moreThan(0, 'Largest temperature change must be above 0 K').max(500, 'Largest temperature change must be at most 500 K').required('Largest temperature change is required'),
              })
              .noUnknown()
              .strict()
              .default(undefined)
              .optional(),
            frostProtection: yup
              .object({
                minHours: num('Minimum hours').moreThan(0, 'Minimum hours must be above 0').max(1000, 'Minimum hours must be at most 1000').required('Minimum hours is required'),
                innerDiameterM: num('Bore').moreThan(0, 'Bore must be above 0').max(5, 'Bore must be at most 5 m').optional(),
                pipeMassKgPerM: num('Pipe mass').min(0, 'Pipe mass must not be negative').max(10_000, 'Pipe mass must be at most 10,000 kg/m').optional(),
                startTemperatureC: num('Water start temperature').min(0, 'Water start temperature must be at least 0 °C').max(100, 'Water start temperature must be at most 100 °C').optional(),
              })
              .noUnknown()
              .strict()
              .default(undefined)
              .optional(),
          }
        : {}),
    })
    .noUnknown()
    .strict();

const fittings = () =>
  yup
    .object({ valves: count('Valves').optional(), flanges: count('Flanges').optional(), elbows: count('Elbows').optional(), tees: count('Tees').optional() })
    .noUnknown()
    .strict();

export const buildUpSchema = yup
  .object({
    layers: yup
      .array()
      .strict()
      .of(
        yup
          .object({
            materialId: yup.string().strict().min(1, 'Material is required').max(64, 'Material id is too long').required('Material is required'),
            thicknessM: num('Layer thickness').moreThan(0, 'Layer thickness must be above 0').max(ITEM_LIMITS.layerThicknessMaxM, 'Layer thickness must be at most 1 m').optional(),
          })
          .noUnknown()
          .strict()
          .required(),
      )
      .max(ITEM_LIMITS.buildUpLayersMax, `At most ${ITEM_LIMITS.buildUpLayersMax} layers`)
      .required('Layers are required'),
    finishId: yup.string().strict().min(1, 'Finish is required').max(64, 'Finish id is too long').required('Finish is required'),
    fixed: yup.boolean().strict().optional(),
  })
  .noUnknown()
  .strict();
export type BuildUpInput = yup.InferType<typeof buildUpSchema>;

const npsField = () =>
  yup
    .string()
    .strict()
    .max(16, 'NPS is too long')
    .test('nps', 'NPS must be a standard size (ASME B36.10M), e.g. "4" or "1-1/2"', (v) => {
      if (v === undefined) return true;
      try {
        pipeSizeByNps(v);
        return true;
      } catch {
        return false;
      }
    });
const dnField = () =>
  num('DN')
    .integer('DN must be a whole number')
    .test('dn', 'DN must be a standard size with an ASME B36.10M equivalent', (v) => {
      if (v === undefined) return true;
      try {
        pipeSizeByDn(v);
        return true;
      } catch {
        return false;
      }
    });
const lineDiameter = () =>
  num('Outside diameter')
    .min(ITEM_LIMITS.lineDiameterMinM, 'Outside diameter must be at least 5 mm')
    .max(ITEM_LIMITS.lineDiameterMaxM, 'Outside diameter must be at most 5 m');
const lineLength = () => num('Length').min(0, 'Length must not be negative').max(ITEM_LIMITS.lengthMaxM, 'Length must be at most 100 km');
const height = () => num('Height').moreThan(0, 'Height must be above 0').max(1000, 'Height must be at most 1000 m');

const lineFields = {
  tag: tag(),
  service: service().optional(),
  nps: npsField().optional(),
  dn: dnField().optional(),
  outerDiameterM: lineDiameter().optional(),
  orientation: orientation().optional(),
  heightM: height().nullable().optional(),
  lengthM: lineLength(),
  operatingTemperatureC: operatingTemperature(),
  location: location().optional(),
  purposes: purposes(PURPOSES),
  purposeParameters: purposeParameters('line').default(undefined).optional(),
  fittings: fittings().default(undefined).optional(),
  fittingsInsulated: yup.boolean().strict().optional(),
  buildUp: buildUpSchema.nullable().default(undefined).optional(),
  notes: notes().optional(),
};

const oneSize = (v: { nps?: unknown; dn?: unknown; outerDiameterM?: unknown }) =>
  [v.nps, v.dn, v.outerDiameterM].filter((x) => x !== undefined).length;

export const lineCreateSchema = yup
  .object({
    ...lineFields,
    tag: lineFields.tag.required('Tag is required'),
    lengthM: lineFields.lengthM.required('Length is required'),
    operatingTemperatureC: lineFields.operatingTemperatureC.required('Operating temperature is required'),
    purposes: lineFields.purposes.required('Give at least one purpose'),
  })
  .noUnknown()
  .strict()
  .test('size', 'Give the size once: nps, dn or outerDiameterM', function check(v) {
    const n = oneSize(v ?? {});
    if (n === 1) return true;
    return this.createError({ path: 'nps', message: n === 0 ? 'Give the size as nps, dn or outerDiameterM' : 'Give the size once: nps, dn or outerDiameterM, not several' });
  });
export type LineCreateInput = yup.InferType<typeof lineCreateSchema>;

export const linePatchSchema = yup
  .object({ ...lineFields, tag: lineFields.tag.optional(), lengthM: lineFields.lengthM.optional(), operatingTemperatureC: lineFields.operatingTemperatureC.optional(), purposes: lineFields.purposes.optional(), version: num('Version').integer().optional() })
  .noUnknown()
  .strict()
  .test('size', 'Give the size once: nps, dn or outerDiameterM', function check(v) {
    if (oneSize(v ?? {}) <= 1) return true;
    return this.createError({ path: 'nps', message: 'Give the size once: nps, dn or outerDiameterM, not several' });
  });
export type LinePatchInput = yup.InferType<typeof linePatchSchema>;

const VESSEL_PURPOSES = PURPOSES.filter((p) => !PIPE_ONLY_PURPOSES.includes(p));

const vesselFields = {
  tag: tag(),
  service: service().optional(),
  diameterM: num('Diameter').min(ITEM_LIMITS.vesselDiameterMinM, 'Diameter must be at least 0.1 m').max(ITEM_LIMITS.vesselDiameterMaxM, 'Diameter must be at most 30 m'),
  lengthM: num('Length').moreThan(0, 'Length must be above 0').max(ITEM_LIMITS.vesselLengthMaxM, 'Length must be at most 200 m'),
  orientation: orientation().optional(),
  headType: yup
    .string<'flat' | 'ellipsoidal2to1' | 'hemispherical'>()
    .strict()
    .oneOf(['flat', 'ellipsoidal2to1', 'hemispherical'], 'Head type must be flat, ellipsoidal2to1 or hemispherical')
    .optional(),
  location: location().optional(),
  operatingTemperatureC: operatingTemperature(),
  purposes: purposes(VESSEL_PURPOSES),
  purposeParameters: purposeParameters('vessel').default(undefined).optional(),
  buildUp: buildUpSchema.nullable().default(undefined).optional(),
  notes: notes().optional(),
};

export const vesselCreateSchema = yup
  .object({
    ...vesselFields,
    tag: vesselFields.tag.required('Tag is required'),
    diameterM: vesselFields.diameterM.required('Diameter is required'),
    lengthM: vesselFields.lengthM.required('Length is required'),
    operatingTemperatureC: vesselFields.operatingTemperatureC.required('Operating temperature is required'),
    purposes: vesselFields.purposes.required('Give at least one purpose'),
  })
  .noUnknown()
  .strict();
export type VesselCreateInput = yup.InferType<typeof vesselCreateSchema>;

export const vesselPatchSchema = yup
  .object({ ...vesselFields, tag: vesselFields.tag.optional(), diameterM: vesselFields.diameterM.optional(), lengthM: vesselFields.lengthM.optional(), operatingTemperatureC: vesselFields.operatingTemperatureC.optional(), purposes: vesselFields.purposes.optional(), version: num('Version').integer().optional() })
  .noUnknown()
  .strict();
export type VesselPatchInput = yup.InferType<typeof vesselPatchSchema>;

/** Bulk edit of a selection: the same purposes and/or build-up for every listed item. */
export const bulkEditSchema = yup
  .object({
    ids: yup.array().strict().of(num('Id').integer().positive().required()).min(1, 'Select at least one item').max(10_000, 'At most 10,000 items at once').required('ids is required'),
    purposes: purposes(PURPOSES).optional(),
    buildUp: buildUpSchema.nullable().default(undefined).optional(),
  })
  .noUnknown()
  .strict()
  .test('something', 'Give purposes or a build-up to apply', (v) => v?.purposes !== undefined || v?.buildUp !== undefined);
export type BulkEditInput = yup.InferType<typeof bulkEditSchema>;

export const sizingSettingsSchema = yup
  .object({
    seriesMm: yup
      .array()
      .strict()
      .of(num('Thickness').moreThan(0, 'Every thickness must be above 0 mm').max(1000, 'Every thickness must be at most 1000 mm').required())
      .min(1, 'Give at least one thickness')
      .max(100, 'At most 100 thicknesses')
      .optional(),
    maxSingleLayerMm: num('Largest single layer').moreThan(0, 'Largest single layer must be above 0 mm').max(1000, 'Largest single layer must be at most 1000 mm').optional(),
    maxThicknessMm: num('Largest thickness').moreThan(0, 'Largest thickness must be above 0 mm').max(2000, 'Largest thickness must be at most 2000 mm').optional(),
    heatConservationMaxPercentOfBare: num('Heat-conservation rule').moreThan(0, 'The share of the bare heat loss must be above 0 %').max(100, 'The share of the bare heat loss must be at most 100 %').optional(),
    defaultBuildUps: yup
      .object({ hot: buildUpSchema.default(undefined).optional(), cold: buildUpSchema.default(undefined).optional() })
      .noUnknown()
      .strict()
      .default(undefined)
      .optional(),
  })
  .noUnknown()
  .strict();
export type SizingSettingsInput = yup.InferType<typeof sizingSettingsSchema>;

const point = yup
  .object({
    meanTemperatureC: num('Mean temperature').min(-273, 'Mean temperature must be at least −273 °C').max(2000, 'Mean temperature must be at most 2000 °C').required('Mean temperature is required'),
    conductivityWPerMK: num('Conductivity').min(0.001, 'Conductivity must be at least 0.001 W/(m·K)').max(10, 'Conductivity must be at most 10 W/(m·K)').required('Conductivity is required'),
  })
  .noUnknown()
  .strict()
  .required();

const materialFields = {
  name: yup.string().strict().trim('Name must not start or end with spaces').min(1, 'Name is required').max(120, 'Name must be at most 120 characters'),
  source: yup.string().strict().trim('Source must not start or end with spaces').min(3, "Name the datasheet the values come from").max(500, 'Source must be at most 500 characters'),
  tablePoints: yup.array().strict().of(point).min(2, 'Give at least two table points').max(40, 'At most 40 table points'),
  maxServiceTemperatureC: num('Maximum service temperature').min(-273, 'Maximum service temperature must be at least −273 °C').max(2000, 'Maximum service temperature must be at most 2000 °C'),
  minServiceTemperatureC: num('Minimum service temperature').min(-273, 'Minimum service temperature must be at least −273 °C').max(2000, 'Minimum service temperature must be at most 2000 °C'),
  densityKgPerM3: num('Density').moreThan(0, 'Density must be above 0').max(5000, 'Density must be at most 5000 kg/m³').nullable().optional(),
  notes: yup.string().strict().max(2000, 'Notes must be at most 2000 characters').optional(),
};

const serviceRange = function check(this: yup.TestContext, v: { minServiceTemperatureC?: number; maxServiceTemperatureC?: number } | undefined) {
  if (!v || v.minServiceTemperatureC === undefined || v.maxServiceTemperatureC === undefined || v.minServiceTemperatureC < v.maxServiceTemperatureC) return true;
  return this.createError({ path: 'minServiceTemperatureC', message: 'Minimum service temperature must be below the maximum' });
};

export const teamMaterialCreateSchema = yup
  .object({
    ...materialFields,
    name: materialFields.name.required('Name is required'),
    source: materialFields.source.required('Name the datasheet the values come from'),
    tablePoints: materialFields.tablePoints.required('Give at least two table points'),
    maxServiceTemperatureC: materialFields.maxServiceTemperatureC.required('Maximum service temperature is required'),
    minServiceTemperatureC: materialFields.minServiceTemperatureC.required('Minimum service temperature is required'),
  })
  .noUnknown()
  .strict()
  .test('range', 'Minimum service temperature must be below the maximum', serviceRange);
export type TeamMaterialCreateInput = yup.InferType<typeof teamMaterialCreateSchema>;

export const teamMaterialPatchSchema = yup
  .object({ ...materialFields, name: materialFields.name.optional(), source: materialFields.source.optional(), tablePoints: materialFields.tablePoints.optional(), maxServiceTemperatureC: materialFields.maxServiceTemperatureC.optional(), minServiceTemperatureC: materialFields.minServiceTemperatureC.optional() })
  .noUnknown()
  .strict()
  .test('range', 'Minimum service temperature must be below the maximum', serviceRange);
export type TeamMaterialPatchInput = yup.InferType<typeof teamMaterialPatchSchema>;

const emissivity = (label: string) => num(label).moreThan(0, `${label} must be above 0`).max(1, `${label} must be at most 1`);

const finishFields = {
  name: materialFields.name,
  source: materialFields.source,
  emissivity: emissivity('Emissivity'),
  emissivityLow: emissivity('Lowest emissivity').optional(),
  emissivityHigh: emissivity('Highest emissivity').optional(),
  contactMaterial: yup
    .string<'uncoatedMetal' | 'coatedMetal' | 'ceramicGlassStone' | 'plastic' | 'wood'>()
    .strict()
    .oneOf(['uncoatedMetal', 'coatedMetal', 'ceramicGlassStone', 'plastic', 'wood'], 'Surface material must be one of uncoatedMetal, coatedMetal, ceramicGlassStone, plastic, wood'),
};

const emissivityOrder = function check(this: yup.TestContext, v: { emissivity?: number; emissivityLow?: number; emissivityHigh?: number } | undefined) {
  if (!v || v.emissivity === undefined) return true;
  if (v.emissivityLow !== undefined && v.emissivityLow > v.emissivity) return this.createError({ path: 'emissivityLow', message: 'Lowest emissivity must not be above the typical value' });
  if (v.emissivityHigh !== undefined && v.emissivityHigh < v.emissivity) return this.createError({ path: 'emissivityHigh', message: 'Highest emissivity must not be below the typical value' });
  return true;
};

export const teamFinishCreateSchema = yup
  .object({
    ...finishFields,
    name: finishFields.name.required('Name is required'),
    source: finishFields.source.required('Name the datasheet the values come from'),
    emissivity: finishFields.emissivity.required('Emissivity is required'),
    contactMaterial: finishFields.contactMaterial.required('Surface material is required'),
  })
  .noUnknown()
  .strict()
  .test('order', 'Emissivities out of order', emissivityOrder);
export type TeamFinishCreateInput = yup.InferType<typeof teamFinishCreateSchema>;

export const teamFinishPatchSchema = yup
  .object({ ...finishFields, name: finishFields.name.optional(), source: finishFields.source.optional(), emissivity: finishFields.emissivity.optional(), contactMaterial: finishFields.contactMaterial.optional() })
  .noUnknown()
  .strict()
  .test('order', 'Emissivities out of order', emissivityOrder);
export type TeamFinishPatchInput = yup.InferType<typeof teamFinishPatchSchema>;
