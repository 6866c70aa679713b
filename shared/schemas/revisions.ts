import * as yup from 'yup';

/** Why a revision is issued (the trade's two purposes of issue). */
export const REVISION_PURPOSES = ['review', 'construction'] as const;
export type RevisionPurpose = (typeof REVISION_PURPOSES)[number];

export const REVISION_PURPOSE_LABELS: Record<RevisionPurpose, string> = {
  review: 'Issued for review',
  construction: 'Issued for construction',
};

export const REVISION_STATUSES = ['prepared', 'checked', 'issued'] as const;
export type RevisionStatus = (typeof REVISION_STATUSES)[number];

/**
 * How a site numbers its revisions.
 * - `trade`: letters for issues for review (A, B, C …, skipping I and O, which read as 1 and 0 — common
 *   practice), numbers from 0 for issues for construction.
 * - `counter`: the team's own scheme, a prefix and one counter for every issue (e.g. "P-" from 1 with two
 *   digits: P-01, P-02 …).
 */
export type RevisionScheme = { kind: 'trade' } | { kind: 'counter'; prefix: string; start: number; digits: number };

/** Totals a revision keeps for its history line. */
export type RevisionTotals = {
  lines: number;
  vessels: number;
  /** Whole items at the energy basis [W]. */
  heatLossW: number;
  bareHeatLossW: number;
  annualEnergyKWh: number;
  bareAnnualEnergyKWh: number;
  /** Items with a purpose they do not meet. */
  failing: number;
};

/** A signature as the API shows it: who, and when. */
export type RevisionSignature = { userId: number | null; name: string; at: string };

/** One field of an item that differs between two line lists. */
export type FieldChange = {
  field: string;
  label: string;
  /** Values as stored (SI). */
  from: unknown;
  to: unknown;
  /** Values in the reader's units. */
  fromText: string;
  toText: string;
  /** The insulation thickness changed (layers or total). */
  thickness: boolean;
};

/** An item added, removed or changed between two line lists. */
export type ItemChange = {
  key: string;
  kind: 'line' | 'vessel';
  tag: string;
  itemId: number;
  change: 'added' | 'removed' | 'changed';
  thicknessChanged: boolean;
  totalThicknessM: { from: number | null; to: number | null; fromText: string; toText: string };
  /** One line on the item as it is on the side that has it (added: the new side). */
  summary: string;
  fields: FieldChange[];
};

export type ComparisonCounts = { added: number; removed: number; changed: number; unchanged: number; thicknessChanged: number };

export const DEFAULT_REVISION_SCHEME: RevisionScheme = { kind: 'trade' };

export const REVISION_LIMITS = { descriptionMax: 500, prefixMax: 12, digitsMax: 6, startMax: 999_999, hashLength: 64 } as const;

/** Letters of review revisions: A–Z without I and O, then AA, AB … (common practice). */
const LETTERS = 'ABCDEFGHJKLMNPQRSTUVWXYZ';

/**
 * The revision mark of the n-th revision (1-based) of a series.
 *
 * @param scheme - the site's numbering
 * @param purpose - review or construction (the trade scheme numbers them apart)
 * @param sequence - 1 for the first revision of its series
 * @returns the mark as printed
 * @example revisionNumber({ kind: 'trade' }, 'review', 1) // 'A'
 * @example revisionNumber({ kind: 'trade' }, 'construction', 1) // '0'
 * @example revisionNumber({ kind: 'counter', prefix: 'P-', start: 1, digits: 2 }, 'review', 3) // 'P-03'
 */
export function revisionNumber(scheme: RevisionScheme, purpose: RevisionPurpose, sequence: number): string {
  if (scheme.kind === 'counter') return `${scheme.prefix}${String(scheme.start + sequence - 1).padStart(scheme.digits, '0')}`;
  if (purpose === 'construction') return String(sequence - 1);
  let n = sequence;
  let out = '';
  while (n > 0) {
    const r = (n - 1) % LETTERS.length;
    out = LETTERS[r] + out;
    n = Math.floor((n - 1) / LETTERS.length);
  }
  return out;
}

/** The numbering series a new revision belongs to. */
export function revisionSeries(scheme: RevisionScheme, purpose: RevisionPurpose): string {
  return scheme.kind === 'counter' ? `counter:${scheme.prefix}` : purpose;
}

const purposeField = () =>
  yup
    .string<RevisionPurpose>()
    .strict()
    .oneOf([...REVISION_PURPOSES], `Purpose must be one of ${REVISION_PURPOSES.join(', ')}`);

const descriptionField = () =>
  yup.string().strict().max(REVISION_LIMITS.descriptionMax, `Description must be at most ${REVISION_LIMITS.descriptionMax} characters`);

/** Preparing a revision: why it is issued and a line on what changed. */
export const revisionPrepareSchema = yup
  .object({
    purpose: purposeField().required('Purpose is required'),
    description: descriptionField(),
  })
  .noUnknown()
  .strict();
export type RevisionPrepareInput = yup.InferType<typeof revisionPrepareSchema>;

/** Editing a prepared revision before it is checked. */
export const revisionPatchSchema = yup
  .object({ description: descriptionField().required('Description is required') })
  .noUnknown()
  .strict();
export type RevisionPatchInput = yup.InferType<typeof revisionPatchSchema>;

/** Checking or approving signs the snapshot the signer reviewed: its hash must match. */
export const revisionSignSchema = yup
  .object({
    snapshotHash: yup
      .string()
      .strict()
      .matches(/^[0-9a-f]{64}$/, 'snapshotHash must be the 64 hex digits of the revision you reviewed')
      .required('snapshotHash is required: sign the snapshot you reviewed'),
  })
  .noUnknown()
  .strict();
export type RevisionSignInput = yup.InferType<typeof revisionSignSchema>;

export const revisionSchemeSchema = yup
  .object({
    kind: yup.string<'trade' | 'counter'>().strict().oneOf(['trade', 'counter'], 'kind must be trade or counter').required('kind is required'),
    prefix: yup
      .string()
      .strict()
      .max(REVISION_LIMITS.prefixMax, `Prefix must be at most ${REVISION_LIMITS.prefixMax} characters`)
      .matches(/^[A-Za-z0-9._/-]*$/, 'Prefix may hold letters, digits and . _ / - only')
      .when('kind', { is: 'counter', then: (s) => s.defined('Prefix is required (empty text for none)') }),
    start: yup
      .number()
      .strict()
      .typeError('Start must be a number')
      .integer('Start must be a whole number')
      .min(0, 'Start must not be negative')
      .max(REVISION_LIMITS.startMax, `Start must be at most ${REVISION_LIMITS.startMax}`)
      .when('kind', { is: 'counter', then: (s) => s.required('Start is required') }),
    digits: yup
      .number()
      .strict()
      .typeError('Digits must be a number')
      .integer('Digits must be a whole number')
      .min(1, 'Digits must be at least 1')
      .max(REVISION_LIMITS.digitsMax, `Digits must be at most ${REVISION_LIMITS.digitsMax}`)
      .when('kind', { is: 'counter', then: (s) => s.required('Digits is required') }),
  })
  .noUnknown()
  .strict();
