import * as yup from 'yup';

import { CONTACT_MATERIALS } from '../calc/burn';
import { FINISHES } from '../calc/library/finishes';
import { MEASUREMENT_METHODS, type MeasurementMethod, type RegisterVerdict, type RegisterVerdictValue } from '../calc/register';
import type { ContactMaterial } from '../calc/types';

import type { Permission } from './permissions';

/** Bounds of register fields, shared by the forms and the API. */
export const REGISTER_LIMITS = {
  locationMax: 200,
  descriptionMax: 2000,
  textMax: 2000,
  /** Surface temperature [°C]. */
  temperatureMinC: -200,
  temperatureMaxC: 1000,
  /** Expected contact time [s]: half a second to 8 h. */
  contactSecondsMin: 0.5,
  contactSecondsMax: 28_800,
  emissivityMin: 0.01,
  /** Photos per upload request, and per entry. */
  photosPerRequest: 4,
  photosPerEntry: 20,
  /** Largest photo file [bytes]. */
  photoBytesMax: 10 * 1024 * 1024,
} as const;

/** Status of a register entry: open → action assigned → made safe → verified, or accepted with a reason. */
export const REGISTER_STATUSES = ['open', 'actionAssigned', 'madeSafe', 'verified', 'accepted'] as const;
export type RegisterStatus = (typeof REGISTER_STATUSES)[number];

/** Statuses in which an entry still needs work; verified and accepted entries are closed. */
export const ACTIVE_STATUSES: readonly RegisterStatus[] = ['open', 'actionAssigned', 'madeSafe'];

/** The workflow: from which statuses each step may be taken, where it leads, and who may take it. */
export const REGISTER_TRANSITIONS = {
  /** Give the entry an action, an owner (a team member) and a due date; again to re-assign. */
  assign: { path: 'assign', from: ['open', 'actionAssigned'], to: 'actionAssigned', permission: 'surfaces.assign' },
  /** Record what was done to make the surface safe; asks the safety officers to verify. */
  madeSafe: { path: 'made-safe', from: ['open', 'actionAssigned'], to: 'madeSafe', permission: 'surfaces.create' },
  /** Confirm the fix on the plant (optionally with a new reading, which must pass). */
  verify: { path: 'verify', from: ['madeSafe'], to: 'verified', permission: 'surfaces.verify' },
  /** The fix does not hold: back to the action owner (or open, when nobody was assigned). */
  sendBack: { path: 'send-back', from: ['madeSafe'], to: 'actionAssigned', permission: 'surfaces.verify' },
  /** Accept the surface as it is, with a reason (e.g. guarded by position, duplicate, scheduled for removal). */
  accept: { path: 'accept', from: ['open', 'actionAssigned', 'madeSafe'], to: 'accepted', permission: 'surfaces.accept' },
  /** A closed entry needs work again. */
  reopen: { path: 'reopen', from: ['verified', 'accepted'], to: 'open', permission: 'surfaces.assign' },
} as const satisfies Record<string, { path: string; from: readonly RegisterStatus[]; to: RegisterStatus; permission: Permission }>;
export type RegisterTransition = keyof typeof REGISTER_TRANSITIONS;
export const REGISTER_TRANSITION_NAMES = Object.keys(REGISTER_TRANSITIONS) as RegisterTransition[];

/** Built-in finishes a register surface can be described as (ids of shared/calc/library/finishes). */
export const SURFACE_FINISH_IDS = FINISHES.map((f) => f.id);

const text = (label: string, max: number = REGISTER_LIMITS.textMax) =>
  yup.string().strict().max(max, `${label} must be at most ${max} characters`);
const requiredText = (label: string, max: number = REGISTER_LIMITS.textMax) =>
  text(label, max).trim(`${label} must not start or end with spaces`).min(1, `${label} is required`).required(`${label} is required`);
const num = (label: string) => yup.number().strict().typeError(`${label} must be a number`);
const temperature = (label: string) =>
  num(label)
    .min(REGISTER_LIMITS.temperatureMinC, `${label} must be at least ${REGISTER_LIMITS.temperatureMinC} °C`)
    .max(REGISTER_LIMITS.temperatureMaxC, `${label} must be at most ${REGISTER_LIMITS.temperatureMaxC} °C`);
const emissivity = () =>
  num('Emissivity setting').min(REGISTER_LIMITS.emissivityMin, `Emissivity setting must be at least ${REGISTER_LIMITS.emissivityMin}`).max(1, 'Emissivity setting must be at most 1');
const method = (allowed: readonly MeasurementMethod[]) =>
  yup
    .string<MeasurementMethod>()
    .strict()
    .oneOf([...allowed], `Method must be one of ${allowed.join(', ')}`);
const id = (label: string) => num(label).integer(`${label} must be a whole number`).positive(`${label} must be positive`);

/** A calendar date as YYYY-MM-DD that exists. */
export function isCalendarDate(value: unknown): value is string {
  if (typeof value !== 'string' || !/^\d{4}-\d{2}-\d{2}$/.test(value)) return false;
  const d = new Date(`${value}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === value;
}

const entryFields = {
  location: requiredText('Location or tag', REGISTER_LIMITS.locationMax),
  description: text('Description', REGISTER_LIMITS.descriptionMax),
  itemId: id('Line or vessel').nullable(),
  measuredTemperatureC: temperature('Surface temperature'),
  method: method(MEASUREMENT_METHODS),
  emissivitySetting: emissivity().nullable(),
  surfaceMaterial: yup
    .string<ContactMaterial>()
    .strict()
    .oneOf([...CONTACT_MATERIALS], `Surface material must be one of ${CONTACT_MATERIALS.join(', ')}`),
  surfaceFinishId: yup.string().strict().oneOf([...SURFACE_FINISH_IDS], `Surface finish must be one of ${SURFACE_FINISH_IDS.join(', ')}`).nullable(),
  withinReach: yup.boolean().strict().typeError('Within reach must be true or false'),
  contactSeconds: num('Contact time')
    .min(REGISTER_LIMITS.contactSecondsMin, `Contact time must be at least ${REGISTER_LIMITS.contactSecondsMin} s`)
    .max(REGISTER_LIMITS.contactSecondsMax, 'Contact time must be at most 8 h (28,800 s)')
    .nullable(),
  measuredAt: yup
    .string()
    .strict()
    .test('iso', 'Measured at must be a date and time (ISO 8601)', (v) => v === undefined || (/^\d{4}-\d{2}-\d{2}T/.test(v) && !Number.isNaN(Date.parse(v)))),
};

/** Method-dependent rules shared by create and patch. */
function measurementRules<S extends yup.ObjectSchema<yup.AnyObject>>(schema: S, requireAll: boolean): S {
  return schema
    .test('emissivity-for-infrared', function check(v) {
      if (!v) return true;
      if (v.method === 'infrared' && requireAll && (v.emissivitySetting === undefined || v.emissivitySetting === null)) {
        return this.createError({ path: 'emissivitySetting', message: 'Give the emissivity the infrared thermometer was set to' });
      }
      if (v.method !== undefined && v.method !== 'infrared' && v.emissivitySetting !== undefined && v.emissivitySetting !== null) {
        return this.createError({ path: 'emissivitySetting', message: 'An emissivity setting belongs to an infrared reading only' });
      }
      return true;
    })
    .test('temperature-for-measurement', function check(v) {
      if (!v) return true;
      if (v.method === 'calculated') {
        if (v.measuredTemperatureC !== undefined) {
          return this.createError({ path: 'measuredTemperatureC', message: 'A calculated entry takes its temperature from the sizing of its line or vessel' });
        }
        if (requireAll && (v.itemId === undefined || v.itemId === null)) {
          return this.createError({ path: 'itemId', message: 'A calculated entry needs the line or vessel it comes from' });
        }
        return true;
      }
      if (requireAll && v.measuredTemperatureC === undefined) {
        return this.createError({ path: 'measuredTemperatureC', message: 'Surface temperature is required' });
      }
      return true;
    }) as S;
}

/** A new register entry (SI, °C). With `method: 'calculated'` the temperature comes from the item's sizing. */
export const entryCreateSchema = measurementRules(
  yup
    .object({
      ...entryFields,
      method: entryFields.method.required('Method is required'),
      surfaceMaterial: entryFields.surfaceMaterial.required('Surface material is required'),
      withinReach: entryFields.withinReach.required('Say whether the surface is within reach'),
      measuredTemperatureC: entryFields.measuredTemperatureC.optional(),
    })
    .noUnknown()
    .strict(),
  true,
);
export type EntryCreateInput = yup.InferType<typeof entryCreateSchema>;

/** Corrections to an entry's description and reading (not its status, owner or due date). */
export const entryPatchSchema = measurementRules(
  yup
    .object({
      ...entryFields,
      location: entryFields.location.optional(),
      version: num('Version').integer('Version must be a whole number').positive('Version must be positive').optional(),
    })
    .noUnknown()
    .strict(),
  false,
);
export type EntryPatchInput = yup.InferType<typeof entryPatchSchema>;

export const assignSchema = yup
  .object({
    ownerUserId: id('Owner').required('Choose who owns the action'),
    dueDate: yup.string().strict().required('Due date is required').test('date', 'Due date must be a date (YYYY-MM-DD)', isCalendarDate),
    action: requiredText('Action'),
  })
  .noUnknown()
  .strict();
export type AssignInput = yup.InferType<typeof assignSchema>;

export const madeSafeSchema = yup.object({ note: requiredText('What was done') }).noUnknown().strict();
export type MadeSafeInput = yup.InferType<typeof madeSafeSchema>;

export const verifySchema = yup
  .object({
    note: text('Note'),
    measuredTemperatureC: temperature('Surface temperature after the fix'),
    method: method(['contact', 'infrared']),
    emissivitySetting: emissivity(),
  })
  .noUnknown()
  .strict()
  .test('reading', function check(v) {
    if (!v) return true;
    if (v.measuredTemperatureC !== undefined && v.method === undefined) return this.createError({ path: 'method', message: 'Say how the new reading was taken' });
    if (v.method === 'infrared' && v.emissivitySetting === undefined) {
      return this.createError({ path: 'emissivitySetting', message: 'Give the emissivity the infrared thermometer was set to' });
    }
    if (v.method !== 'infrared' && v.emissivitySetting !== undefined) {
      return this.createError({ path: 'emissivitySetting', message: 'An emissivity setting belongs to an infrared reading only' });
    }
    if (v.method !== undefined && v.measuredTemperatureC === undefined) {
      return this.createError({ path: 'measuredTemperatureC', message: 'Give the new reading' });
    }
    return true;
  });
export type VerifyInput = yup.InferType<typeof verifySchema>;

export const reasonSchema = yup.object({ reason: requiredText('Reason') }).noUnknown().strict();
export type ReasonInput = yup.InferType<typeof reasonSchema>;

export const commentSchema = yup.object({ body: requiredText('Comment') }).noUnknown().strict();
export type CommentInput = yup.InferType<typeof commentSchema>;

export const registerSettingsSchema = yup
  .object({ keepPhotoLocation: yup.boolean().strict().typeError('Keep photo location must be true or false').required('Keep photo location is required') })
  .noUnknown()
  .strict();
export type RegisterSettingsInput = yup.InferType<typeof registerSettingsSchema>;

/** Body schema of each workflow step. */
export const TRANSITION_SCHEMAS = {
  assign: assignSchema,
  madeSafe: madeSafeSchema,
  verify: verifySchema,
  sendBack: reasonSchema,
  accept: reasonSchema,
  reopen: reasonSchema,
} as const satisfies Record<RegisterTransition, yup.AnyObjectSchema>;

/** Verdict filter values of the register list. */
export const REGISTER_VERDICTS = ['fail', 'caution', 'pass'] as const;

/** Words for statuses, methods, materials and verdicts, shared by the app, the mail and the exports. */
export const STATUS_WORDS: Record<RegisterStatus, string> = {
  open: 'Open',
  actionAssigned: 'Action assigned',
  madeSafe: 'Made safe',
  verified: 'Verified',
  accepted: 'Accepted',
};

export const METHOD_WORDS: Record<MeasurementMethod, string> = {
  contact: 'Contact probe',
  infrared: 'Infrared',
  calculated: 'Calculated',
};

export const MATERIAL_WORDS: Record<ContactMaterial, string> = {
  uncoatedMetal: 'Uncoated metal',
  coatedMetal: 'Coated metal',
  ceramicGlassStone: 'Ceramic, glass, stone',
  plastic: 'Plastic',
  wood: 'Wood',
};

export const VERDICT_WORDS: Record<RegisterVerdictValue, string> = {
  fail: 'Fail: above the limit',
  caution: 'Caution',
  pass: 'Pass: at or below the limit',
};

/** A team member as the register names them. */
export type RegisterPerson = { userId: number; name: string };

/** One row of the register: a measured (or recorded) entry, or an item's calculated risk. */
export type RegisterRow = {
  source: 'measured' | 'calculated';
  /** Stable across both kinds: `entry-<id>` or `item-<id>`. */
  key: string;
  /** The entry's id; null for a calculated risk (see `item`). */
  id: number | null;
  siteId: number;
  siteName: string;
  item: { id: number; kind: 'line' | 'vessel'; tag: string } | null;
  location: string;
  description: string;
  measuredTemperatureC: number | null;
  method: MeasurementMethod;
  emissivitySetting: number | null;
  surfaceMaterial: ContactMaterial | null;
  surfaceFinishId: string | null;
  withinReach: boolean;
  contactSeconds: number | null;
  measuredAt: string | null;
  /** null for a calculated risk. */
  status: RegisterStatus | null;
  action: string;
  owner: RegisterPerson | null;
  dueDate: string | null;
  overdue: boolean;
  statusNote: string;
  closedBy: RegisterPerson | null;
  closedAt: string | null;
  verificationTemperatureC: number | null;
  verdict: RegisterVerdict;
  photoCount: number;
  version: number | null;
  createdBy: RegisterPerson | null;
  createdAt: string | null;
  updatedAt: string | null;
  /** When a calculated risk's item was sized. */
  sizedAt: string | null;
};
