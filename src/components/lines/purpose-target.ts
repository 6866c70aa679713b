/**
 * What each purpose asks, in words and the user's units, from the same sizing plan the job runs (the
 * stored outcome words it in SI for the API).
 */
import { dewPointC } from '../../../shared/calc/dew-point';
import type { SizingPlan } from '../../../shared/calc/sizing/size-item';
import type { SizingBases } from '../../../shared/calc/sizing/types';
import type { Criterion } from '../../../shared/calc/types';
import type { Purpose, PurposeOutcome } from '../../api/types';
import { fixed, formatHours, formatSignificant, formatTemperature, formatTemperatureDelta } from '../../calc/format';
import type { UnitSystem } from '../../calc/units';

type Planned = SizingPlan['purposes'][number];

const criterionOf = (p: Planned): Criterion | undefined => p.check ?? p.case?.solveFor;

/** The target of one purpose in the user's units; the plan's own words where it has no number. */
export function purposeTarget(p: Planned, plan: SizingPlan, bases: SizingBases, system: UnitSystem): string {
  const crit = criterionOf(p);
  switch (p.purpose) {
    case 'personnelProtection':
      return plan.burnLimit && plan.service === 'hot' ? `surface at most ${formatTemperature(plan.burnLimit.limitC, system).text}` : p.target;
    case 'heatConservation': {
      if (p.fractionOfBare !== undefined) return `heat flow at most ${fixed(p.fractionOfBare * 100, 0)} % of the bare item’s`;
      if (crit?.criterion !== 'heatLoss') return p.target;
      const line = plan.kind === 'line';
      const limit = line ? crit.maxWPerM : crit.maxW;
      return limit === undefined ? p.target : `heat flow at most ${formatSignificant(line ? 'heatLossPerLength' : 'heatFlow', limit, system).text}`;
    }
    case 'condensationControl': {
      const c = bases.condensation;
      if (!c) return p.target;
      const margin = crit?.criterion === 'condensation' ? crit.marginK : (c.marginK ?? 1);
      return `surface at least ${formatTemperatureDelta(margin, system).text} above the dew point (${formatTemperature(dewPointC(c.airTemperatureC, c.relativeHumidityPct), system).text})`;
    }
    case 'temperatureHolding':
      if (crit?.criterion !== 'temperatureChange' || !p.case?.run) return p.target;
      return `temperature change over ${formatSignificant('length', p.case.run.lengthM, system).text} at most ${formatTemperatureDelta(crit.maxChangeK, system).text}`;
    case 'frostProtection':
      if (crit?.criterion !== 'freezeTime') return p.target.replace('0 °C', formatTemperature(0, system).text.replace('.0', ''));
      return `at least ${formatHours(crit.minHours).text} before standing water reaches ${formatTemperature(0, system).text.replace('.0', '')}`;
  }
}

/** Targets of every purpose of a plan, by purpose. */
export function purposeTargets(plan: SizingPlan, bases: SizingBases, system: UnitSystem): Partial<Record<Purpose, string>> {
  const out: Partial<Record<Purpose, string>> = {};
  for (const p of plan.purposes) out[p.purpose] = purposeTarget(p, plan, bases, system);
  return out;
}

/** A purpose's note in words without SI figures where ours can say it (a fixed build-up that falls short). */
export function purposeNote(o: PurposeOutcome): string | undefined {
  if (o.status === 'notMet') return 'The build-up as built misses this target.';
  return o.message;
}
