import type { BasisName, PurposeStatus } from '../../../shared/calc/sizing/types';
import type { ItemKind, ListSortKey, ListStatus, Purpose } from '../../api/types';

/** Purposes in the trade's words, with a short form for narrow columns. */
export const PURPOSE_LABELS: Record<Purpose, { label: string; short: string }> = {
  personnelProtection: { label: 'Personnel protection', short: 'Personnel' },
  heatConservation: { label: 'Heat conservation', short: 'Conservation' },
  condensationControl: { label: 'Condensation control', short: 'Condensation' },
  temperatureHolding: { label: 'Process temperature holding', short: 'Holding' },
  frostProtection: { label: 'Frost protection', short: 'Frost' },
};

export const PURPOSE_ORDER: readonly Purpose[] = ['personnelProtection', 'heatConservation', 'condensationControl', 'temperatureHolding', 'frostProtection'];

/** Purposes an item of this kind may carry (holding and frost need a pipe). */
export const purposesFor = (kind: ItemKind): readonly Purpose[] =>
  kind === 'vessel' ? PURPOSE_ORDER.filter((p) => p !== 'temperatureHolding' && p !== 'frostProtection') : PURPOSE_ORDER;

export const BASIS_LABELS: Record<BasisName, string> = {
  touch: 'Touch safety',
  energy: 'Energy',
  condensation: 'Condensation',
  winter: 'Winter',
};

export const PURPOSE_STATUS_WORDS: Record<PurposeStatus, string> = {
  sized: 'Sized',
  met: 'Met as built',
  notMet: 'Not met as built',
  impossible: 'Not reachable',
  notApplicable: 'Does not apply',
  error: 'Cannot size',
};

export const KIND_WORDS: Record<ItemKind, { one: string; many: string; One: string; Many: string }> = {
  line: { one: 'line', many: 'lines', One: 'Line', Many: 'Lines' },
  vessel: { one: 'vessel', many: 'vessels', One: 'Vessel', Many: 'Vessels' },
};

export const STATUS_FILTERS: { value: ListStatus; label: string }[] = [
  { value: 'failing', label: 'Failing' },
  { value: 'stale', label: 'Stale' },
  { value: 'unsized', label: 'Not sized' },
  { value: 'current', label: 'Up to date' },
];

export const HEAD_TYPE_LABELS = { ellipsoidal2to1: '2:1 ellipsoidal heads', hemispherical: 'Hemispherical heads', flat: 'Flat heads' } as const;

/** Columns a list can be sorted by, in the table's order, with the words a phone's sort menu shows. */
export const SORT_LABELS: Record<ListSortKey, string> = {
  tag: 'Tag',
  service: 'Service',
  outerDiameterM: 'Size',
  lengthM: 'Length',
  operatingTemperatureC: 'Operating temperature',
  location: 'Location',
  governingPurpose: 'Governing purpose',
  totalThicknessM: 'Thickness',
  heatLoss: 'Heat loss',
  surfaceTemperatureC: 'Surface temperature',
  annualEnergyKWh: 'Annual energy',
  sizedAt: 'Sized on',
};
