/**
 * What the results show, in display units and words: one place decides labels, precision and verdicts,
 * so the pinned summary, the results panel, the layers and the charts agree.
 */
import { touchSafetyVerdict, type TouchSafetyVerdict } from '../../shared/calc/burn';
import type { CalcResult, Warning } from '../../shared/calc/types';

import { temperaturesInText, warningsInFormWords } from './calc-messages';
import { type Formatted, fixed, formatHours, formatMoney, formatSignificant, formatTemperature, formatTemperatureDelta, formatThickness, significant } from './format';
import { materialById } from './library';
import type { LiveOutput } from './live';
import { CONTACT_MATERIALS, PURPOSES, limitValue, meetsPurpose, purposeAvailable, type Draft } from './quick-case';
import { unitOf, type Quantity, type UnitSystem } from './units';

export type Shown = { label: string; /** For the pinned summary. */ short?: string; value: Formatted; si: number | null; note?: string; testID: string };
export type VerdictState = 'pass' | 'caution' | 'fail';
export type VerdictView = { state: VerdictState; text: string };

/** The one touch-safety verdict, with the limit that governs it and the burn threshold used. */
export type TouchView = VerdictView & {
  governs: TouchSafetyVerdict['governs'];
  /** The governing limit and, on hot service, the burn threshold for the contact. */
  facts: Shown[];
};

/** A layer run outside its service temperatures. */
export type ServiceLimitBreach = {
  /** Index of the form's layer (0 = against the surface). */
  layerIndex: number;
  kind: 'max' | 'min';
  text: string;
};

/** One line of the pinned summary's reason: what passes, what does not. */
export type SummaryReason = { state: VerdictState; text: string };

export type Presentation = {
  /** The purpose's verdict; for "Safe to touch" it is the touch-safety verdict itself. */
  verdict: VerdictView;
  /** The touch-safety verdict beside another purpose; null when the purpose is "Safe to touch" (it is the verdict). */
  touch: TouchView | null;
  /** The touch-safety facts (governing limit, burn threshold) whichever purpose is chosen. */
  touchFacts: Shown[];
  serviceLimits: ServiceLimitBreach[];
  /** The worst of everything above, for the pinned summary. */
  overall: VerdictView & { reasons: SummaryReason[] };
  headline: Shown[];
  details: Shown[];
  energy: Shown[];
  energyBasis: string;
  /** The calculation's warnings in the form's words and units. */
  warnings: Warning[];
};

const RANK: Record<VerdictState, number> = { pass: 0, caution: 1, fail: 2 };

/** The worse of verdict states. */
export function worstState(states: readonly VerdictState[]): VerdictState {
  return states.reduce<VerdictState>((w, s) => (RANK[s] > RANK[w] ? s : w), 'pass');
}

export function heatQuantity(kind: Draft['kind']): Quantity {
  return kind === 'pipe' ? 'heatLossPerLength' : kind === 'wall' ? 'heatFlux' : 'heatFlow';
}

/** Per metre / per m² / per vessel, carried to per foot / per ft² in US units. */
function energyBasisOf(kind: Draft['kind'], system: UnitSystem): { factor: number; label: string } {
  if (kind === 'pipe') return system === 'US' ? { factor: 0.3048, label: 'per foot of pipe, per year' } : { factor: 1, label: 'per metre of pipe, per year' };
  if (kind === 'wall') return system === 'US' ? { factor: 0.09290304, label: 'per square foot, per year' } : { factor: 1, label: 'per square metre, per year' };
  return { factor: 1, label: 'for the whole vessel, per year' };
}

/** A material's name in the units shown ("…, up to 850 °F"). */
export function materialNameIn(name: string, system: UnitSystem): string {
  return temperaturesInText(name, system);
}

/** Where water freezes, in the units shown. */
function freezing(system: UnitSystem): string {
  return system === 'US' ? '32 °F' : '0 °C';
}

/** A service rating in whole degrees of the units shown. */
function rating(celsius: number, system: UnitSystem): string {
  const u = unitOf('temperature', system);
  return `${fixed(u.fromSI(celsius), 0)} ${u.suffix}`;
}

/** The contact in words: "5 s contact with bare metal". */
function contactWords(d: Draft): string {
  const mat = CONTACT_MATERIALS.find((c) => c.id === d.contactMaterial)?.label.toLowerCase() ?? d.contactMaterial;
  return `${d.contactSeconds ?? 5} s contact with ${mat}`;
}

/** The touch-safety verdict of a result, in the units shown; the entered limit counts only for "Safe to touch". */
export function touchSafetyOf(d: Draft, r: CalcResult, system: UnitSystem): { verdict: TouchSafetyVerdict; view: TouchView } {
  const limitC = d.purpose === 'personnel' && d.maxSurfaceC !== null ? d.maxSurfaceC : undefined;
  const v = touchSafetyVerdict({
    surfaceTemperatureC: r.surfaceTemperatureC,
    airTemperatureC: d.airTemperatureC ?? r.surfaceTemperatureC,
    limitC,
    limitSource: 'the limit entered',
    contact: { material: d.contactMaterial, seconds: d.contactSeconds ?? undefined },
    precision: { decimals: 1, scale: system === 'US' ? 'F' : 'C' },
  });
  const T = (c: number) => formatTemperature(c, system).text;
  const surface = T(r.surfaceTemperatureC);
  const contact = contactWords(d);
  const state: VerdictState = v.verdict;
  let text: string;
  if (v.regime === 'cold') {
    const onset = T(v.limitC);
    text =
      state === 'caution'
        ? `A cold surface at ${surface}: below ${onset}, where a brief touch of metal can cause frostbite (cold contact, ISO 13732-3). Guard or insulate it; hot-surface burn thresholds do not apply.`
        : `The surface (${surface}) is colder than the air, so a touch is judged as cold contact — frostbite from about ${onset} for a 10 s touch of metal (ISO 13732-3) — not against hot-surface burn thresholds.`;
  } else if (v.governs === 'touchLimit') {
    const lim = T(v.limitC);
    const burn = v.burnThresholdC !== null ? ` (stricter than the ${T(v.burnThresholdC)} burn threshold for ${contact})` : '';
    text = state === 'pass' ? `${surface} is within the ${lim} limit entered${burn}.` : `${surface} is above the ${lim} limit entered${burn}: a touch may burn.`;
  } else {
    const lim = T(v.limitC);
    const stricter = limitC !== undefined ? ` (stricter than the ${T(limitC)} limit entered, so it governs)` : '';
    const where = v.comparison === 'below' ? 'below' : v.comparison === 'at' ? 'at' : 'above';
    text =
      state === 'pass'
        ? `${surface} is below the burn threshold of ${lim} for ${contact}${stricter}.`
        : `${surface} is ${where} the burn threshold of ${lim} for ${contact}${stricter}: a touch can burn.`;
  }
  const facts: Shown[] = [];
  if (v.regime === 'hot') {
    const burnSource = r.burn?.source ?? v.source;
    if (v.governs === 'touchLimit') {
      facts.push({ label: 'Limit that governs: the limit entered', value: formatTemperature(v.limitC, system), si: v.limitC, note: `stricter than the burn threshold for ${contact}`, testID: 'qs-result-touchLimit' });
      if (v.burnThresholdC !== null) {
        facts.push({ label: 'Burn threshold (less strict here)', value: formatTemperature(v.burnThresholdC, system), si: r.burn?.thresholdC ?? v.burnThresholdC, note: burnSource, testID: 'qs-result-burnThreshold' });
      }
    } else {
      facts.push({
        label: 'Limit that governs: the burn threshold',
        value: formatTemperature(v.limitC, system),
        si: r.burn?.thresholdC ?? v.limitC,
        note: `for ${contact}; ${burnSource}`,
        testID: 'qs-result-burnThreshold',
      });
    }
  } else {
    facts.push({ label: 'Cold contact: caution below', value: formatTemperature(v.limitC, system), si: v.limitC, note: v.source, testID: 'qs-result-coldContact' });
  }
  return { verdict: v, view: { state, text, governs: v.governs, facts } };
}

/** Layers run above (or below) their service temperatures, compared as shown, in the form's words. */
export function serviceLimitBreaches(d: Draft, out: Extract<LiveOutput, { kind: 'ok' }>, system: UnitSystem): ServiceLimitBreach[] {
  const u = unitOf('temperature', system);
  const shown = (c: number) => Number(u.fromSI(c).toFixed(1));
  const worst = new Map<string, { layerIndex: number; kind: 'max' | 'min'; reachedC: number; limitC: number; face: 'inner' | 'outer' }>();
  for (const l of out.buildUp) {
    const draftLayer = d.layers[l.draftIndex];
    if (!draftLayer) continue;
    const material = materialById(draftLayer.materialId);
    const maxC = draftLayer.maxServiceTemperatureC ?? undefined;
    const minC = l.layer.minServiceTemperatureC ?? (draftLayer.materialId !== 'custom' ? material?.minServiceTemperatureC : undefined);
    const hotFace = l.innerC >= l.outerC ? 'inner' : 'outer';
    const hot = Math.max(l.innerC, l.outerC);
    const cold = Math.min(l.innerC, l.outerC);
    if (maxC !== undefined && shown(hot) > shown(maxC)) {
      const key = `${l.draftIndex}-max`;
      const prev = worst.get(key);
      if (!prev || hot > prev.reachedC) worst.set(key, { layerIndex: l.draftIndex, kind: 'max', reachedC: hot, limitC: maxC, face: hotFace });
    }
    if (minC !== undefined && shown(cold) < shown(minC)) {
      const key = `${l.draftIndex}-min`;
      const prev = worst.get(key);
      if (!prev || cold < prev.reachedC) worst.set(key, { layerIndex: l.draftIndex, kind: 'min', reachedC: cold, limitC: minC, face: hotFace === 'inner' ? 'outer' : 'inner' });
    }
  }
  return [...worst.values()]
    .sort((a, b) => a.layerIndex - b.layerIndex || (a.kind === 'max' ? -1 : 1))
    .map((b) => {
      const draftLayer = d.layers[b.layerIndex];
      const m = draftLayer.materialId === 'custom' ? null : materialById(draftLayer.materialId);
      const name = m ? ` (${materialNameIn(m.name, system).replace(/^./, (c) => c.toLowerCase())})` : '';
      const reached = formatTemperature(b.reachedC, system).text;
      const text =
        b.kind === 'max'
          ? `Layer ${b.layerIndex + 1}${name} runs at ${reached} at its ${b.face} face, above the ${rating(b.limitC, system)} it is rated for: it will break down. Choose a material rated for this temperature, or put a layer of one underneath.`
          : `Layer ${b.layerIndex + 1}${name} runs at ${reached} at its ${b.face} face, below the ${rating(b.limitC, system)} it is rated for. Choose a material rated for this cold.`;
      return { layerIndex: b.layerIndex, kind: b.kind, text };
    });
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
      return `at least ${formatHours(lim).text} before standing water reaches ${freezing(system)}`;
  }
}

/**
 * How close the best build-up within reach gets to a target no thickness meets: the figure reached, the limit
 * and the shortfall, each with its unit.
 */
function shortfallView(d: Draft, out: Extract<LiveOutput, { kind: 'ok' }>, system: UnitSystem): { best: Shown; text: string } | null {
  const s = out.shortfall;
  const solve = out.case.solveFor;
  if (!s || !solve) return null;
  const r = out.result;
  const at = formatThickness(s.bestThicknessM, system).text;
  const where =
    s.code === 'SERIES_TOO_THIN'
      ? `with two of the series’ thickest single layers (${at} in all)${s.neededThicknessM !== null ? `; it needs ${formatThickness(s.neededThicknessM, system).text}` : ''}`
      : `with ${at}, the thickest searched`;
  const T = (c: number) => formatTemperature(c, system);
  const dT = (k: number) => formatTemperatureDelta(k, system).text;
  const q = heatQuantity(d.kind);
  switch (solve.criterion) {
    case 'surfaceTemperature': {
      const best = T(r.surfaceTemperatureC);
      return {
        best: { label: 'Lowest surface temperature within reach', short: 'Best surface', value: best, si: r.surfaceTemperatureC, note: where, testID: 'qs-result-best' },
        text: `the lowest surface temperature within reach is ${best.text} ${where} — ${dT(r.surfaceTemperatureC - solve.maxC)} above the ${T(solve.maxC).text} it must not exceed`,
      };
    }
    case 'heatLoss': {
      const lim = (d.kind === 'pipe' ? solve.maxWPerM : d.kind === 'wall' ? solve.maxWPerM2 : solve.maxW) ?? 0;
      const best = formatSignificant(q, Math.abs(out.heatFlow), system);
      return {
        best: { label: 'Least heat loss within reach', short: 'Best loss', value: best, si: Math.abs(out.heatFlow), note: where, testID: 'qs-result-best' },
        text: `the least heat loss within reach is ${best.text} ${where} — ${formatSignificant(q, Math.abs(out.heatFlow) - lim, system).text} more than the ${formatSignificant(q, lim, system).text} allowed`,
      };
    }
    case 'condensation': {
      const need = (r.dewPointC ?? 0) + solve.marginK;
      const best = T(r.surfaceTemperatureC);
      return {
        best: { label: 'Warmest surface within reach', short: 'Best surface', value: best, si: r.surfaceTemperatureC, note: where, testID: 'qs-result-best' },
        text: `the warmest surface within reach is ${best.text} ${where} — ${dT(need - r.surfaceTemperatureC)} short of the ${T(need).text} (dew point + margin) it needs`,
      };
    }
    case 'temperatureChange': {
      const drop = r.outletTemperatureC !== undefined ? out.case.processTemperatureC - r.outletTemperatureC : NaN;
      const best = formatTemperatureDelta(Math.abs(drop), system);
      return {
        best: { label: 'Smallest drop within reach', short: 'Best drop', value: best, si: drop, note: where, testID: 'qs-result-best' },
        text: `the smallest drop along the run within reach is ${best.text} ${where} — ${dT(Math.abs(drop) - solve.maxChangeK)} more than the ${dT(solve.maxChangeK)} allowed`,
      };
    }
    case 'freezeTime': {
      const h = r.hoursToZeroC ?? 0;
      const best = formatHours(h);
      return {
        best: { label: `Longest time to ${freezing(system)} within reach`, short: 'Best time', value: best, si: h, note: where, testID: 'qs-result-best' },
        text: `the longest time before standing water reaches ${freezing(system)} within reach is ${best.text} ${where} — ${formatHours(solve.minHours - h).text} short of the ${formatHours(solve.minHours).text} needed`,
      };
    }
  }
}

export function present(d: Draft, out: Extract<LiveOutput, { kind: 'ok' }>, system: UnitSystem): Presentation {
  const r = out.result;
  const q = heatQuantity(d.kind);
  const gain = out.heatFlow < 0;
  const purpose = PURPOSES.find((p) => p.id === d.purpose)!;
  const available = purposeAvailable(d.purpose, d.kind);
  const sized = Boolean(out.case.solveFor);
  const touch = touchSafetyOf(d, r, system);
  const shortfall = shortfallView(d, out, system);
  const personnel = d.purpose === 'personnel' && available;

  let verdict: VerdictView;
  const lim = limitText(d, system, r);
  if (!available) verdict = { state: 'caution', text: `${purpose.label} is worked out for pipes only; this build-up is shown as entered.` };
  else if (shortfall) verdict = { state: 'fail', text: `No thickness meets “${purpose.label}”: ${shortfall.text}.` };
  else if (personnel) {
    const t = out.chosenThicknessM ?? 0;
    const pass = touch.view.state !== 'fail';
    const lead = sized
      ? pass
        ? t > 0
          ? `${formatThickness(t, system).text} meets “${purpose.label}”`
          : `No added insulation is needed for “${purpose.label}”`
        : `The rounded build-up does not meet “${purpose.label}”`
      : pass
        ? `This build-up meets “${purpose.label}”`
        : `This build-up does not meet “${purpose.label}”`;
    verdict = { state: touch.view.state, text: `${lead}: ${touch.view.text}` };
  } else {
    const meets = meetsPurpose(d, r);
    if (meets === null) verdict = { state: 'caution', text: `Not enough information to judge “${purpose.label}” — ${lim || 'see the warnings'}.` };
    else if (sized) {
      const t = out.chosenThicknessM ?? 0;
      verdict = meets
        ? { state: 'pass', text: t > 0 ? `${formatThickness(t, system).text} meets “${purpose.label}”: ${lim}.` : `No added insulation is needed for “${purpose.label}”: ${lim}.` }
        : { state: 'fail', text: `The rounded build-up does not meet ${lim}.` };
    } else {
      verdict = meets ? { state: 'pass', text: `This build-up meets “${purpose.label}”: ${lim}.` } : { state: 'fail', text: `This build-up does not meet “${purpose.label}”: ${lim}.` };
    }
  }

  const serviceLimits = serviceLimitBreaches(d, out, system);

  const headline: Shown[] = [];
  if (shortfall) headline.push(shortfall.best);
  if (sized && !shortfall) {
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
      label: `Standing water reaches ${freezing(system)} after`,
      short: `To ${freezing(system)}`,
      value: r.hoursToZeroC === null ? { value: 'No freezing', unit: '', text: 'No freezing', spoken: 'No freezing: the air is not below freezing' } : formatHours(r.hoursToZeroC),
      si: r.hoursToZeroC,
      note: r.hoursToZeroC === null ? `the air is not below ${freezing(system)}` : undefined,
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
    const cooling = e.service === 'cooling';
    energy.push({
      label: cooling ? 'Electricity for the chiller to remove the heat gain' : 'Fuel used to make up the heat',
      value: formatSignificant('energy', e.fuelKWh * basis.factor, system),
      si: e.fuelKWh,
      note: cooling ? `heat gain ÷ coefficient of performance ${significant(d.energy.coolingCop ?? NaN)}` : undefined,
      testID: 'qs-result-energy',
    });
    energy.push({ label: cooling ? 'Electricity cost' : 'Energy cost', value: formatMoney(e.cost * basis.factor, cur), si: e.cost, testID: 'qs-result-cost' });
    energy.push({ label: cooling ? 'CO₂ of the electricity' : 'CO₂', value: formatSignificant('co2Mass', e.co2Kg * basis.factor, system), si: e.co2Kg, testID: 'qs-result-co2' });
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

  const reasons: SummaryReason[] = [];
  reasons.push({ state: verdict.state, text: shortfall ? 'No thickness meets the purpose' : `${purpose.label}: ${verdict.state === 'pass' ? 'met' : verdict.state === 'fail' ? 'not met' : 'see results'}` });
  if (!personnel) {
    const t = touch.view;
    reasons.push({
      state: t.state,
      text: touch.verdict.regime === 'cold' ? (t.state === 'pass' ? 'Touch: no frostbite risk' : 'Touch: frostbite risk') : t.state === 'pass' ? 'Touch: below the burn threshold' : `Touch: ${touch.verdict.comparison} the burn threshold`,
    });
  }
  for (const b of serviceLimits) reasons.push({ state: 'fail', text: `Layer ${b.layerIndex + 1} ${b.kind === 'max' ? 'above' : 'below'} its service temperature` });
  const overallState = worstState(reasons.map((x) => x.state));
  const overall = {
    state: overallState,
    text: reasons.filter((x) => x.state === overallState).map((x) => x.text).join(' · '),
    reasons,
  };

  const warnings = warningsInFormWords(r.warnings, d, system, serviceLimits.length > 0 || !r.warnings.some((w) => w.code.endsWith('SERVICE_TEMPERATURE_EXCEEDED')));

  return {
    verdict,
    touch: personnel ? null : touch.view,
    touchFacts: touch.view.facts,
    serviceLimits,
    overall,
    headline,
    details,
    energy,
    energyBasis: basis.label,
    warnings,
  };
}
