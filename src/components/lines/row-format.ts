/**
 * How a line-list row reads: every number in the user's units at list precision (temperatures in whole
 * degrees, thickness in whole millimetres or eighths of an inch, heat flow to three significant figures),
 * and the row's state in a word and an icon as well as a colour.
 */
import { fixed, formatSignificant, formatThickness } from '../../calc/format';
import { toDisplay, unitOf, type UnitSystem } from '../../calc/units';
import type { Item, ItemKind, Line, Vessel } from '../../api/types';
import type { ColorName } from '../../theme';
import type { IconName } from '../ui';

import { PURPOSE_LABELS } from './labels';

export type RowState = 'unsized' | 'stale' | 'failing' | 'current';

export interface RowStatus {
  state: RowState;
  /** The state in a word or two; never left to the colour. */
  word: string;
  icon: IconName;
  tone: ColorName;
  /** What fails, when something does (also shown beside "Stale"). */
  detail?: string;
}

export interface RowCells {
  tag: string;
  service: string;
  size: string;
  length: string;
  temperature: string;
  location: string;
  purposes: string;
  governing: string;
  thickness: string;
  heatLoss: string;
  surface: string;
  status: RowStatus;
}

/** A temperature at list precision: whole degrees with the unit. */
export function listTemperature(celsius: number | null | undefined, system: UnitSystem): string {
  if (celsius === null || celsius === undefined || !Number.isFinite(celsius)) return '—';
  const u = unitOf('temperature', system);
  return `${fixed(toDisplay('temperature', system, celsius), 0)} ${u.suffix}`;
}

/** Unsized, stale, failing or current: the state a person must see first. */
export function rowStatus(item: Pick<Item, 'sizing' | 'purposes'>): RowStatus {
  const s = item.sizing;
  if (!s) return { state: 'unsized', word: 'Not sized', icon: 'info', tone: 'textMuted' };
  const failing = s.failing.length > 0 ? s.failing.map((p) => PURPOSE_LABELS[p].short.toLowerCase()).join(', ') : undefined;
  if (s.stale) return { state: 'stale', word: 'Stale', icon: 'caution', tone: 'caution', detail: failing ? `fails ${failing}` : undefined };
  if (failing) return { state: 'failing', word: 'Fails', icon: 'fail', tone: 'fail', detail: failing };
  return { state: 'current', word: 'Sized', icon: 'pass', tone: 'pass' };
}

function lineSize(l: Line, system: UnitSystem): string {
  if (l.sizeGivenAs === 'nps' && l.nps) return `NPS ${l.nps}`;
  if (l.sizeGivenAs === 'dn' && l.dn !== null) return `DN ${l.dn}`;
  return `OD ${formatSignificant('diameter', l.outerDiameterM, system).text}`;
}

/** The heat flow of a row: per metre (or foot) for a line, the whole vessel for a vessel; a gain says so. */
export function rowHeatFlow(kind: ItemKind, sizing: Item['sizing'], system: UnitSystem): string {
  if (!sizing) return '—';
  const q = kind === 'line' ? sizing.heatLossWPerM : sizing.heatLossW;
  if (q === null || q === undefined || !Number.isFinite(q)) return '—';
  const text = formatSignificant(kind === 'line' ? 'heatLossPerLength' : 'heatFlow', Math.abs(q), system).text;
  return q < 0 ? `${text} gain` : text;
}

export function formatRow(item: Item, kind: ItemKind, system: UnitSystem): RowCells {
  const s = item.sizing;
  const layers = s?.layersM.length ?? 0;
  return {
    tag: item.tag,
    service: item.service || '—',
    size: kind === 'line' ? lineSize(item as Line, system) : `Ø ${formatSignificant('length', (item as Vessel).diameterM, system).text}`,
    length: formatSignificant('length', item.lengthM, system).text,
    temperature: listTemperature(item.operatingTemperatureC, system),
    location: item.location === 'indoor' ? 'Indoor' : 'Outdoor',
    purposes: item.purposes.map((p) => PURPOSE_LABELS[p].short).join(', '),
    governing: s?.governingPurpose ? PURPOSE_LABELS[s.governingPurpose].short : '—',
    thickness: s ? (s.totalThicknessM > 0 ? `${formatThickness(s.totalThicknessM, system).text}${layers > 1 ? ` · ${layers} layers` : ''}` : 'None') : '—',
    heatLoss: rowHeatFlow(kind, s, system),
    surface: listTemperature(s?.surfaceTemperatureC, system),
    status: rowStatus(item),
  };
}
