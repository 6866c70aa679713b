/**
 * What "save to a site" tells the person, in words and the units on screen: what the quick case becomes in the
 * line list, and what of it stays behind because the site's own data applies there.
 */
import { formatSignificant, formatTemperature, formatTemperatureDelta } from '../../calc/format';
import { pipeSizeByOuterDiameter } from '../../calc/library';
import type { Draft } from '../../calc/quick-case';
import type { LeftBehind, SaveMapping } from '../../calc/save-to-site';
import type { UnitSystem } from '../../calc/units';
import { PURPOSE_LABELS } from '../lines/labels';

/** One sentence per input the line list has no field for. */
export function leftBehindWords(l: LeftBehind, system: UnitSystem): string {
  switch (l.code) {
    case 'conditions':
      return 'The air, surroundings, wind and humidity of this case: the site’s design bases apply when the site is sized, so its numbers can differ from the ones here.';
    case 'touchLimit':
      return `${l.valueSI === null ? 'The surface limit' : `Your surface limit of ${formatTemperature(l.valueSI, system).text}`}: the site’s touch-safety basis sets it, with the burn threshold of the finish.`;
    case 'condensationMargin':
      return `${l.valueSI === null ? 'The margin' : `Your margin of ${formatTemperatureDelta(l.valueSI, system).text}`} above the dew point: the site’s condensation basis sets it.`;
    case 'contact':
      return 'The surface touched and the contact time: the finish’s surface group and the site’s touch basis set them.';
    case 'series':
      return 'The thickness series: the site’s sizing settings set it.';
    case 'energy':
      return 'Operating hours, prices and CO₂ factors: the site’s energy basis sets them.';
    case 'heatLimitRule':
      return 'No heat-loss limit is given: the site’s rule (a share of the bare heat loss) applies.';
    case 'coldPersonnel':
      return 'Cold service: the line list does not size personnel protection (hot-surface burn thresholds do not apply); consider condensation control instead.';
  }
}

/** The purpose as the line list will size it, with the limit that goes with it. */
export function purposeWords(m: SaveMapping, d: Draft, system: UnitSystem): string {
  const name = PURPOSE_LABELS[m.purpose].label;
  const params = (m.proposed.purposeParameters ?? {}) as Record<string, Record<string, number> | undefined>;
  switch (m.purpose) {
    case 'heatConservation': {
      const p = params.heatConservation;
      if (p?.maxHeatLossWPerM !== undefined) return `${name}: at most ${formatSignificant('heatLossPerLength', p.maxHeatLossWPerM, system).text}`;
      if (p?.maxHeatLossW !== undefined) return `${name}: at most ${formatSignificant('heatFlow', p.maxHeatLossW, system).text} for the whole vessel`;
      return `${name}: the site’s rule`;
    }
    case 'temperatureHolding': {
      const p = params.temperatureHolding;
      return p?.maxChangeK !== undefined
        ? `${name}: a drop of at most ${formatTemperatureDelta(p.maxChangeK, system).text} over the line at ${formatSignificant('massFlow', p.massFlowKgPerS ?? NaN, system).text}`
        : name;
    }
    case 'frostProtection': {
      const p = params.frostProtection;
      return p?.minHours !== undefined ? `${name}: at least ${p.minHours} h before standing water reaches ${system === 'US' ? '32 °F' : '0 °C'}` : name;
    }
    default:
      return d.purpose === 'personnel' || d.purpose === 'condensation' ? `${name}: to the site’s limit` : name;
  }
}

/** The item's size in the way the form gave it. */
export function sizeWords(d: Draft, system: UnitSystem): string {
  if (d.kind === 'vessel') {
    const dia = d.vesselDiameterM === null ? '—' : formatSignificant('length', d.vesselDiameterM, system).text;
    const len = d.vesselLengthM === null ? '—' : formatSignificant('length', d.vesselLengthM, system).text;
    return `Vessel ${dia} across, ${len} long, ${d.vesselOrientation}`;
  }
  const od = d.pipeOuterDiameterM;
  const size = od === null ? undefined : pipeSizeByOuterDiameter(od);
  const given =
    d.pipeSizeBy === 'nps' && size ? `NPS ${size.nps}` : d.pipeSizeBy === 'dn' && size ? `DN ${size.dn}` : od === null ? '—' : `${formatSignificant('diameter', od, system, 4).text} outside`;
  return `Line ${given}, ${d.pipeOrientation}`;
}
