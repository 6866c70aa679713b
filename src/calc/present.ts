/**
 * What the results show, in display units and words: one place decides labels, precision and verdicts,
 * so the pinned summary, the results panel and the charts agree.
 */
import { COLD_CONTACT_NOTE } from '../../shared/calc/burn';
import type { CalcResult } from '../../shared/calc/types';

import { type Formatted, formatHours, formatMoney, formatSignificant, formatTemperature, formatTemperatureDelta, formatThickness, significant } from './format';
import type { LiveOutput } from './live';
import { CONTACT_MATERIALS, PURPOSES, limitValue, meetsPurpose, purposeAvailable, type Draft } from './quick-case';
import type { Quantity, UnitSystem } from './units';

export type Shown = { label: string; /** For the pinned summary. */ short?: string; value: Formatted; si: number | null; note?: string; testID: string };
export type VerdictView = { state: 'pass' | 'caution' | 'fail'; text: string };

export type Presentation = {
  verdict: VerdictView;
  headline: Shown[];
  details: Shown[];
  energy: Shown[];
  energyBasis: string;
  burn: (VerdictView & { threshold: Shown }) | null;
};

export function heatQuantity(kind: Draft['kind']): Quantity {
  return kind === 'pipe' ? 'heatLossPerLength' : kind === 'wall' ? 'heatFlux' : 'heatFlow';
}

/** Per metre / per m² / per vessel, carried to per foot / per ft² in US units. */
function energyBasisOf(kind: Draft['kind'], system: UnitSystem): { factor: number; label: string } {
  if (kind === 'pipe') return system === 'US' ? { factor: 0.3048, label: 'per foot of pipe, per year' } : { factor: 1, label: 'per metre of pipe, per year' };
  if (kind === 'wall') return system === 'US' ? { factor: 0.09290304, label: 'per square foot, per year' } : { factor: 1, label: 'per square metre, per year' };
  return { factor: 1, label: 'for the whole vessel, per year' };
}

function limitText(d: Draft, system: UnitSystem, r: CalcResult): string {
  const lim = limitValue(d);
  if (lim === null) return '';
  switch (d.purpose) {
    case 'personnel':
      return `surface at most ${formatTemperature(lim, system).text}`;
    case 'conservation':
      return `heat loss at most ${formatSignificant(heatQuantity(d.kind), lim, system).text}`;
    case 'condensation':
      return r.dewPointC !== undefined
        ? `surface at least ${formatTemperature(r.dewPointC + lim, system).text} (dew point + ${formatTemperatureDelta(lim, system).text})`
        : `${formatTemperatureDelta(lim, system).text} above the dew point`;
    case 'holding':
      return `a drop of at most ${formatTemperatureDelta(lim, system).text} along the run`;
    case 'frost':
      return `at least ${formatHours(lim).text} before standing water reaches 0 °C`;
  }
}

export function present(d: Draft, out: Extract<LiveOutput, { kind: 'ok' }>, system: UnitSystem): Presentation {
  const r = out.result;
  const q = heatQuantity(d.kind);
  const gain = out.heatFlow < 0;
  const purpose = PURPOSES.find((p) => p.id === d.purpose)!;
  const available = purposeAvailable(d.purpose, d.kind);
  const meets = available ? meetsPurpose(d, r) : null;
  const sized = Boolean(out.case.solveFor);

  let verdict: VerdictView;
  const lim = limitText(d, system, r);
  if (!available) verdict = { state: 'caution', text: `${purpose.label} is worked out for pipes only; this build-up is shown as entered.` };
  else if (meets === null) verdict = { state: 'caution', text: `Not enough information to judge “${purpose.label}” — ${lim || 'see the warnings'}.` };
  else if (sized) {
    const t = out.chosenThicknessM ?? 0;
    verdict = meets
      ? { state: 'pass', text: t > 0 ? `${formatThickness(t, system).text} meets “${purpose.label}”: ${lim}.` : `No added insulation is needed for “${purpose.label}”: ${lim}.` }
      : { state: 'fail', text: `The rounded build-up does not meet ${lim}.` };
  } else {
    verdict = meets ? { state: 'pass', text: `This build-up meets “${purpose.label}”: ${lim}.` } : { state: 'fail', text: `This build-up does not meet “${purpose.label}”: ${lim}.` };
  }

  const headline: Shown[] = [];
  if (sized) {
    const t = out.chosenThicknessM ?? 0;
    const rounded = r.roundedLayersM ?? [];
    const split = rounded.length > 1 ? `as ${rounded.length} layers: ${rounded.map((x) => formatThickness(x, system).text).join(' + ')}` : undefined;
    const exact = r.thicknessM !== undefined ? `least that works: ${formatThickness(r.thicknessM, system).text}` : undefined;
    headline.push({
      label: d.layers.length > 1 ? 'Outer layer needed' : 'Thickness needed',
      short: 'Thickness',
      value: formatThickness(t, system),
      si: t,
      note: [split, exact, 'rounded up to the series'].filter(Boolean).join('; '),
      testID: 'qs-result-thickness',
    });
  }
  headline.push({ label: 'Surface temperature', short: 'Surface', value: formatTemperature(r.surfaceTemperatureC, system), si: r.surfaceTemperatureC, testID: 'qs-result-surfaceTemperature', note: d.kind === 'vessel' ? 'hottest part of the vessel' : undefined });
  headline.push({
    label: `${gain ? 'Heat gain' : 'Heat loss'}${d.kind === 'pipe' ? ' per length' : d.kind === 'wall' ? ' per area' : ', whole vessel'}`,
    short: gain ? 'Heat gain' : 'Heat loss',
    value: formatSignificant(q, Math.abs(out.heatFlow), system),
    si: out.heatFlow,
    testID: 'qs-result-heatLoss',
  });
  if (r.outletTemperatureC !== undefined) {
    headline.push({
      label: 'Temperature at the end of the run',
      short: 'End of run',
      value: formatTemperature(r.outletTemperatureC, system),
      si: r.outletTemperatureC,
      note: d.processTemperatureC !== null ? `a drop of ${formatTemperatureDelta(d.processTemperatureC - r.outletTemperatureC, system).text}` : undefined,
      testID: 'qs-result-outletTemperature',
    });
  }
  if (r.hoursToZeroC !== undefined) {
    headline.push({
      label: 'Standing water reaches 0 °C after',
      short: 'To 0 °C',
      value: r.hoursToZeroC === null ? { value: 'No freezing', unit: '', text: 'No freezing', spoken: 'No freezing: the air is not below 0 degrees' } : formatHours(r.hoursToZeroC),
      si: r.hoursToZeroC,
      note: r.hoursToZeroC === null ? 'the air is not below 0 °C' : undefined,
      testID: 'qs-result-hoursToZero',
    });
  }

  const details: Shown[] = [];
  if (r.dewPointC !== undefined) details.push({ label: 'Dew point', value: formatTemperature(r.dewPointC, system), si: r.dewPointC, testID: 'qs-result-dewPoint' });
  r.interfaceTemperaturesC.forEach((t, i, all) => {
    if (i === all.length - 1) return;
    const at = out.boundaries[i + 1]?.positionM;
    const label = all.length === out.case.layers.length ? `Outer face of layer ${i + 1}` : `Layer face ${at !== undefined ? formatThickness(at, system).text : ''} out`;
    details.push({ label, value: formatTemperature(t, system), si: t, testID: `qs-result-interface-${i}` });
  });
  details.push({ label: 'Convection coefficient', value: formatSignificant('filmCoefficient', r.convectionCoefficientWPerM2K, system), si: r.convectionCoefficientWPerM2K, testID: 'qs-result-convection' });
  details.push({ label: 'Radiation coefficient', value: formatSignificant('filmCoefficient', r.radiationCoefficientWPerM2K, system), si: r.radiationCoefficientWPerM2K, testID: 'qs-result-radiation' });
  details.push({ label: 'Total insulation', value: formatThickness(r.totalThicknessM, system), si: r.totalThicknessM, testID: 'qs-result-totalThickness' });
  if (r.runHeatLossW !== undefined) details.push({ label: 'Heat lost along the run', value: formatSignificant('heatFlow', r.runHeatLossW, system), si: r.runHeatLossW, testID: 'qs-result-runHeatLoss' });
  for (const p of r.parts ?? []) {
    const name = p.name === 'shell' ? 'Shell' : p.name === 'head1' ? 'Head 1' : 'Head 2';
    details.push({
      label: `${name}: surface, heat loss`,
      value: formatTemperature(p.surfaceTemperatureC, system),
      si: p.surfaceTemperatureC,
      note: `${formatSignificant('heatFlow', p.heatLossW, system).text} over ${significant(p.areaM2 * (system === 'US' ? 10.7639104 : 1))} ${system === 'US' ? 'ft²' : 'm²'}`,
      testID: `qs-result-part-${p.name}`,
    });
  }

  const basis = energyBasisOf(d.kind, system);
  const energy: Shown[] = [];
  const e = out.energy;
  if (e) {
    const cur = d.energy.currency;
    energy.push({ label: 'Fuel used to make up the heat', value: formatSignificant('energy', e.fuelKWh * basis.factor, system), si: e.fuelKWh, testID: 'qs-result-energy' });
    energy.push({ label: 'Energy cost', value: formatMoney(e.cost * basis.factor, cur), si: e.cost, testID: 'qs-result-cost' });
    energy.push({ label: 'CO₂', value: formatSignificant('co2Mass', e.co2Kg * basis.factor, system), si: e.co2Kg, testID: 'qs-result-co2' });
    if (e.savingCost !== null && e.savingFuelKWh !== null && e.savingCo2Kg !== null) {
      energy.push({
        label: 'Saved against the bare surface',
        value: formatMoney(e.savingCost * basis.factor, cur),
        si: e.savingCost,
        note: `${formatSignificant('energy', e.savingFuelKWh * basis.factor, system).text} and ${formatSignificant('co2Mass', e.savingCo2Kg * basis.factor, system).text}${e.savingFraction !== null ? `; ${significant(e.savingFraction * 100)} % less heat` : ''}`,
        testID: 'qs-result-saving',
      });
    }
  }

  let burn: Presentation['burn'] = null;
  if (r.burn) {
    const mat = CONTACT_MATERIALS.find((c) => c.id === d.contactMaterial)?.label.toLowerCase() ?? d.contactMaterial;
    const secs = d.contactSeconds ?? 5;
    const above = r.burn.verdict === 'aboveThreshold';
    const cold = r.surfaceTemperatureC < (d.airTemperatureC ?? 0) && r.surfaceTemperatureC < 10;
    burn = {
      state: above ? 'fail' : cold ? 'caution' : 'pass',
      text: cold
        ? `A cold surface: the hot-surface burn check does not apply. ${COLD_CONTACT_NOTE}`
        : above
        ? `Above the burn threshold for ${secs} s contact with ${mat}: a touch can burn.`
        : `Below the burn threshold for ${secs} s contact with ${mat}.`,
      threshold: { label: 'Burn threshold used', value: formatTemperature(r.burn.thresholdC, system), si: r.burn.thresholdC, note: r.burn.source, testID: 'qs-result-burnThreshold' },
    };
  }
  return { verdict, headline, details, energy, energyBasis: basis.label, burn };
}
