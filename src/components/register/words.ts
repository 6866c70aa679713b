import type { RegisterVerdictValue } from '../../../shared/calc/register';
import { FINISHES } from '../../../shared/calc/library/finishes';
import type { ContactMaterial } from '../../../shared/calc/types';
import { MATERIAL_WORDS, STATUS_WORDS, type RegisterStatus } from '../../../shared/schemas/register';
import { fixed } from '../../calc/format';
import { unitOf, type UnitSystem } from '../../calc/units';

export { MATERIAL_WORDS, METHOD_WORDS, STATUS_WORDS } from '../../../shared/schemas/register';

/** The verdict as a word on its own (the badge adds the icon and colour). */
export const VERDICT_SHORT: Record<RegisterVerdictValue, string> = { fail: 'Fail', caution: 'Caution', pass: 'Pass' };

export const STATUS_CHOICES = (Object.keys(STATUS_WORDS) as RegisterStatus[]).map((value) => ({ value, label: STATUS_WORDS[value] }));

export const MATERIAL_CHOICES: { value: ContactMaterial; label: string }[] = (Object.keys(MATERIAL_WORDS) as ContactMaterial[]).map((value) => ({
  value,
  label: MATERIAL_WORDS[value],
}));

/** Surface finishes a person can pick (the library's), with their emissivity to help an infrared reading. */
export const FINISH_CHOICES = [
  { value: '', label: 'Not stated' },
  ...FINISHES.map((f) => ({ value: f.id, label: f.name, detail: `emissivity about ${f.emissivityRange[0]}–${f.emissivityRange[1]}` })),
];

/** The ISO 13732-1 group a finish belongs to, so picking a finish fills the material in. */
export function materialOfFinish(finishId: string): ContactMaterial | null {
  const f = FINISHES.find((x) => x.id === finishId);
  if (!f) return null;
  if (!f.metallic) return 'plastic';
  return finishId === 'painted-metal' ? 'coatedMetal' : 'uncoatedMetal';
}

/** A temperature in whole degrees of the user's units, for lists. */
export function wholeDegrees(celsius: number | null, system: UnitSystem): string {
  if (celsius === null || !Number.isFinite(celsius)) return '—';
  const u = unitOf('temperature', system);
  return `${fixed(u.fromSI(celsius), 0)} ${u.suffix}`;
}

/** A text link with a 44 px tall target (11 px above and below its 22 px line). */
export const TALL_LINK = { paddingVertical: 11, alignSelf: 'flex-start' } as const;
