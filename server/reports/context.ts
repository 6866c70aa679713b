/**
 * What every report prints around its tables: the title block (site, revision, date, who prepared, checked
 * and approved), the design bases and sizing settings the numbers rest on, the method, and the cautions.
 */
import type { SizingBases } from '../../shared/calc/sizing/types';
import type { DesignBases } from '../../shared/schemas/sites';
import { REVISION_PURPOSE_LABELS } from '../../shared/schemas/revisions';
import type { LineList } from '../revisions/revisions.service';
import type { DisplayUnits } from './display';
import type { Block, ReportDocument, Signatory } from './pdf';

/** 2026-12-03 (ISO 8601, the date form of engineering documents). */
export const isoDate = (d: Date | string) => new Date(d).toISOString().slice(0, 10);
/** 2026-12-03 14:05 UTC. */
export const isoDateTime = (d: Date | string) => `${new Date(d).toISOString().slice(0, 16).replace('T', ' ')} UTC`;

const STATUS_TEXT = { prepared: 'Prepared, awaiting check', checked: 'Checked, awaiting approval', issued: 'Issued' } as const;

/** The title block and running head of a report of a line list. */
export function documentFrame(list: LineList, title: string, du: DisplayUnits, now: Date): Omit<ReportDocument, 'blocks'> {
  const r = list.revision;
  const units = du.system === 'SI' ? 'SI (°C, mm, m, W)' : 'US customary (°F, in, ft, Btu/h)';
  if (!r) {
    return {
      title,
      site: list.snapshot.site.name,
      revision: 'Draft',
      revisionShort: 'Draft',
      status: 'Not issued',
      date: isoDate(now),
      createdAt: now,
      units,
      signatories: [
        { role: 'Prepared', name: null, at: null },
        { role: 'Checked', name: null, at: null },
        { role: 'Approved', name: null, at: null },
      ],
      watermark: 'DRAFT — NOT ISSUED',
    };
  }
  const sig = (role: Signatory['role'], s: { name: string; at: string } | null): Signatory => ({ role, name: s?.name ?? null, at: s ? isoDateTime(s.at) : null });
  const date = r.status === 'issued' && r.approved ? r.approved.at : r.prepared.at;
  return {
    title,
    site: list.snapshot.site.name,
    revision: `Rev ${r.number} — ${REVISION_PURPOSE_LABELS[r.purpose]}`,
    revisionShort: `Rev ${r.number}`,
    status: STATUS_TEXT[r.status],
    date: isoDate(date),
    createdAt: new Date(date),
    units,
    description: r.description || undefined,
    signatories: [sig('Prepared', r.prepared), sig('Checked', r.checked), sig('Approved', r.approved)],
    watermark: r.status === 'issued' ? undefined : 'NOT ISSUED',
  };
}

type Bases = SizingBases & { energy?: DesignBases['energy'] };

/** The design bases and sizing settings, as definitions. */
export function basesBlock(list: LineList, du: DisplayUnits): Block[] {
  const b = list.snapshot.designBases as Bases;
  const s = list.snapshot.sizingSettings;
  const rows: [string, string][] = [];
  const wind = (ms: number | undefined) => (ms ? `wind ${du.speed(ms)}` : 'still air');
  if (b.touch) {
    const t = b.touch;
    rows.push([
      'Touch-safety basis',
      [
        `air ${du.temperature(t.airTemperatureC)}`,
        t.radiantTemperatureC !== undefined ? `surroundings ${du.temperature(t.radiantTemperatureC)}` : null,
        wind(t.windSpeedMS),
        t.surfaceEmissivity !== undefined ? `surface emissivity ${t.surfaceEmissivity}` : "finish's lowest credible emissivity",
        `contact ${t.contactSeconds ?? 5} s`,
        t.maxSurfaceC !== undefined ? `site limit ${du.temperature(t.maxSurfaceC)}` : null,
      ]
        .filter(Boolean)
        .join(', '),
    ]);
  } else rows.push(['Touch-safety basis', 'not set']);
  if (b.energy) {
    const e = b.energy;
    rows.push([
      'Energy basis',
      [
        `annual-average air ${du.temperature(e.airTemperatureC)}`,
        wind(e.windSpeedMS),
        e.operatingHoursPerYear !== undefined ? `${e.operatingHoursPerYear} h a year` : 'operating hours not set',
        e.energyPricePerKWh !== undefined ? `energy ${du.price(e.energyPricePerKWh, e.currency ?? '')}` : 'no energy price',
        e.heatSourceEfficiency !== undefined ? `heat-source efficiency ${du.percent(e.heatSourceEfficiency * 100)}` : null,
        e.co2KgPerKWh !== undefined ? `CO₂ ${du.co2Factor(e.co2KgPerKWh)}${e.co2Basis ? ` (${e.co2Basis})` : ''}` : 'no CO₂ factor',
      ]
        .filter(Boolean)
        .join(', '),
    ]);
  } else rows.push(['Energy basis', 'not set']);
  if (b.condensation) {
    const c = b.condensation;
    rows.push(['Condensation basis', `air ${du.temperature(c.airTemperatureC)}, ${c.relativeHumidityPct} % relative humidity, margin ${du.temperatureDelta(c.marginK ?? 1)} above the dew point`]);
  } else rows.push(['Condensation basis', 'not set']);
  if (b.winter) rows.push(['Winter basis', `air ${du.temperature(b.winter.airTemperatureC)}, ${wind(b.winter.windSpeedMS)}`]);
  rows.push([
    'Thickness series',
    `${s.seriesMm.map((mm) => du.thicknessValue(mm / 1000)).join(', ')} ${du.system === 'SI' ? 'mm' : 'in'}; two layers above ${du.thickness(s.maxSingleLayerMm / 1000)}; at most ${du.thickness(s.maxThicknessMm / 1000)}`,
  ]);
  rows.push(['Heat conservation without an item limit', `heat flow at most ${s.heatConservationMaxPercentOfBare} % of the bare item's`]);
  return [{ kind: 'heading', text: 'Design bases and sizing settings' }, { kind: 'definitions', rows }];
}

/** How the numbers are made, in short, and the cautions every result carries. */
export function methodBlock(extra: string[] = []): Block[] {
  return [
    { kind: 'heading', text: 'Method' },
    {
      kind: 'paragraph',
      text:
        'Each item is sized for every purpose it carries against the site basis of that purpose (personnel protection: touch-safety basis; heat conservation: energy basis; condensation control: condensation basis; process temperature holding and frost protection: winter basis). The thickest purpose governs; the sized layer is rounded up to the site series and split into two layers above the single-layer limit. Conduction through each layer uses the Kirchhoff integral of its k(T) (ASTM C680, ISO 12241); radiation the Stefan–Boltzmann law with the finish emissivity; natural convection Churchill–Chu (cylinders, vertical surfaces); wind Churchill–Bernstein; air properties at the film temperature. Heat loss is at the energy basis; valves and flanges add an equivalent length of pipe (common practice). Surface temperature is at the touch-safety basis for hot service and at the condensation basis for cold service. Burn thresholds follow ISO 13732-1 with the ASTM C1055 5 s contact as the default.',
    },
    { kind: 'paragraph', text: 'Purposes: PP personnel protection, HC heat conservation, CC condensation control, TH process temperature holding, FP frost protection.', tone: 'muted' },
    ...extra.map((text): Block => ({ kind: 'paragraph', text, tone: 'muted' })),
    { kind: 'heading', text: 'Cautions' },
    {
      kind: 'paragraph',
      text:
        'These results are an aid to, not a substitute for, the judgement of a competent engineer, the plant’s insulation specification and local codes. Contact-burn thresholds depend on who can touch a surface and for how long; a surface below a threshold can still hurt someone who cannot withdraw. Condensation and freezing results assume the stated air conditions; outdoor cold lines also see a sky colder than the air, and insulation that gets wet loses much of its value.',
      tone: 'heat',
    },
  ];
}

/** A note on a draft's items that are not sized on their current inputs. */
export function draftNote(list: LineList): Block[] {
  if (list.revision) return [];
  const notReady = list.items.filter((x) => x.status !== 'current').length;
  return [
    {
      kind: 'paragraph',
      text: `Draft: this is the line list as it stands, not an issued revision.${notReady ? ` ${notReady} item${notReady === 1 ? ' is' : 's are'} not sized on ${notReady === 1 ? 'its' : 'their'} current inputs and show${notReady === 1 ? 's' : ''} no result or an outdated one (marked in the list).` : ''}`,
      tone: 'heat',
    },
  ];
}
