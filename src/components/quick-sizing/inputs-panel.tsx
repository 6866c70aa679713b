import { StyleSheet, View } from 'react-native';

import { currencySymbol, fixed } from '../../calc/format';
import { finishById, finishes, materialById, materials, pipeSizeByOuterDiameter, pipeSizes, thicknessSeries } from '../../calc/library';
import { temperaturesInText } from '../../calc/calc-messages';
import { materialNameIn, type ServiceLimitBreach } from '../../calc/present';
import {
  CONTACT_MATERIALS,
  PURPOSES,
  PURPOSE_TRADE_TERMS,
  isColdService,
  limitKey,
  purposeAvailable,
  type Draft,
  type LayerDraft,
  type Num,
} from '../../calc/quick-case';
import type { FieldErrors } from '../../calc/validation';
import { unitOf, type Quantity, type UnitSystem } from '../../calc/units';
import { spacing } from '../../theme';
import { Button, Card, SelectField, Text, TextField, type SelectOption } from '../ui';

import { VerdictBadge } from './result-value';

import { CoefficientFields } from './coefficient-fields';
import { NumberField } from './number-field';
import { OptionChips, type ChipOption } from './option-chips';

export interface InputsPanelProps {
  draft: Draft;
  system: UnitSystem;
  errors: FieldErrors;
  onChange: (patch: Partial<Draft>) => void;
  /** Layers run outside their service temperatures, shown at the layer. */
  serviceLimits?: readonly ServiceLimitBreach[];
}

const MAX_LAYERS = 3;

type EnergyNumberKey = 'operatingHoursPerYear' | 'pricePerKWh' | 'efficiency' | 'co2KgPerKWh' | 'coolingCop' | 'electricityPricePerKWh' | 'electricityCo2KgPerKWh';

type Options<K extends keyof Draft> = readonly ChipOption<Draft[K] & string>[];

const KIND_OPTIONS: Options<'kind'> = [
  { value: 'pipe', label: 'Pipe' },
  { value: 'vessel', label: 'Vessel' },
  { value: 'wall', label: 'Wall or flat surface' },
];
const SIZE_BY_OPTIONS: Options<'pipeSizeBy'> = [
  { value: 'nps', label: 'NPS' },
  { value: 'dn', label: 'DN' },
  { value: 'od', label: 'Outside diameter' },
];
const PIPE_ORIENTATION_OPTIONS: Options<'pipeOrientation'> = [
  { value: 'horizontal', label: 'Horizontal' },
  { value: 'vertical', label: 'Vertical' },
];
const VESSEL_ORIENTATION_OPTIONS: Options<'vesselOrientation'> = [
  { value: 'vertical', label: 'Vertical' },
  { value: 'horizontal', label: 'Horizontal' },
];
const HEAD_OPTIONS: Options<'headType'> = [
  { value: 'ellipsoidal2to1', label: '2:1 ellipsoidal' },
  { value: 'hemispherical', label: 'Hemispherical' },
  { value: 'flat', label: 'Flat' },
];
const WALL_ORIENTATION_OPTIONS: Options<'wallOrientation'> = [
  { value: 'vertical', label: 'Sideways (a vertical wall)' },
  { value: 'faceUp', label: 'Up (a roof or top)' },
  { value: 'faceDown', label: 'Down (an underside)' },
];
const MODE_OPTIONS: Options<'mode'> = [
  { value: 'size', label: 'The thickness needed' },
  { value: 'check', label: 'Whether this build-up is enough' },
];
const CONTACT_OPTIONS: Options<'contactMaterial'> = CONTACT_MATERIALS.map((c) => ({ value: c.id, label: c.label }));
const CURRENCY_OPTIONS: readonly ChipOption<string>[] = [
  { value: 'USD', label: 'USD $' },
  { value: 'EUR', label: 'EUR €' },
  { value: 'GBP', label: 'GBP £' },
];

/** A service temperature in whole degrees of the units shown. */
function degrees(celsius: number, system: UnitSystem): string {
  const u = unitOf('temperature', system);
  return `${fixed(u.fromSI(celsius), 0)} ${u.suffix}`;
}

/** The library's materials, named and rated in the units shown. */
function materialOptions(system: UnitSystem): SelectOption[] {
  return [
    ...materials.map((m) => ({
      value: m.id,
      label: materialNameIn(m.name, system),
      detail:
        m.maxServiceTemperatureC === undefined
          ? undefined
          : m.minServiceTemperatureC !== undefined
            ? `Service from ${degrees(m.minServiceTemperatureC, system)} to ${degrees(m.maxServiceTemperatureC, system)}`
            : `Service to ${degrees(m.maxServiceTemperatureC, system)}`,
    })),
    { value: 'custom', label: 'Custom k(T)', detail: 'Enter the conductivity polynomial yourself' },
  ];
}
const FINISH_OPTIONS: readonly SelectOption[] = [
  ...finishes.map((f) => ({ value: f.id, label: f.name, detail: `Emissivity ${f.emissivity}` })),
  { value: 'custom', label: 'Custom emissivity' },
];
const SERIES_OPTIONS: readonly SelectOption[] = thicknessSeries.map((s) => ({ value: s.id, label: s.name }));

/** The limit field of each purpose, keyed by the draft field it fills. */
const LIMIT_FIELDS: Partial<Record<keyof Draft, { label: string; quantity: Quantity; hint?: string }>> = {
  maxSurfaceC: {
    label: 'Highest surface temperature allowed',
    quantity: 'temperature',
    hint: 'Often 55 °C to 60 °C for metal jackets within reach; your plant’s specification governs. A stricter burn threshold for the contact below governs instead.',
  },
  maxHeatLossWPerM: { label: 'Most heat loss allowed per length', quantity: 'heatLossPerLength' },
  maxHeatFluxWPerM2: { label: 'Most heat loss allowed per area', quantity: 'heatFlux' },
  maxHeatLossW: { label: 'Most heat loss allowed, whole vessel', quantity: 'heatFlow' },
  condensationMarginK: { label: 'Margin above the dew point', quantity: 'temperatureDelta' },
  maxChangeK: { label: 'Largest temperature drop along the run', quantity: 'temperatureDelta' },
  minHours: { label: 'Hours the standing water must stay above freezing', quantity: 'hours' },
};

/** Every input of the quick-sizing case, grouped the way a person thinks about the job. */
export function InputsPanel({ draft: d, system, errors, onChange, serviceLimits = [] }: InputsPanelProps) {
  const num = (key: keyof Draft, label: string, quantity: Quantity, extra?: { hint?: string; testID?: string }) => (
    <NumberField
      label={label}
      quantity={quantity}
      system={system}
      value={d[key] as Num}
      onChange={(v) => onChange({ [key]: v } as Partial<Draft>)}
      error={errors[key as string]}
      hint={extra?.hint}
      testID={extra?.testID ?? `qs-input-${String(key)}`}
    />
  );
  const energyNum = (key: EnergyNumberKey, label: string, quantity: Quantity, unitPrefix?: string) => (
    <NumberField
      label={label}
      quantity={quantity}
      unitPrefix={unitPrefix}
      system={system}
      value={d.energy[key]}
      onChange={(v) => onChange({ energy: { ...d.energy, [key]: v } })}
      error={errors[`energy.${key}`]}
      testID={`qs-input-energy.${key}`}
    />
  );
  const odUnit = unitOf('diameter', system);
  const limit = limitKey(d);
  const limitField = LIMIT_FIELDS[limit];

  const setLayer = (i: number, patch: Partial<LayerDraft>) => onChange({ layers: d.layers.map((l, j) => (j === i ? { ...l, ...patch } : l)) });
  const available = purposeAvailable(d.purpose, d.kind);
  const purpose = PURPOSES.find((p) => p.id === d.purpose);
  const solvedIndex = d.mode === 'size' && available ? d.layers.length - 1 : -1;
  const cold = isColdService(d);
  const money = currencySymbol(d.energy.currency);

  return (
    <View style={styles.col}>
      <Card title="What you are insulating" testID="qs-section-geometry">
        <OptionChips
          label="Shape"
          value={d.kind}
          testID="qs-kind"
          options={KIND_OPTIONS}
          onChange={(kind) => onChange({ kind })}
        />
        {d.kind === 'pipe' ? (
          <>
            <OptionChips
              label="Pipe size given as"
              value={d.pipeSizeBy}
              testID="qs-size-by"
              options={SIZE_BY_OPTIONS}
              onChange={(pipeSizeBy) => {
                const known = d.pipeOuterDiameterM !== null ? pipeSizeByOuterDiameter(d.pipeOuterDiameterM) : undefined;
                const fallback = pipeSizes.find((p) => p.nps === '4');
                if (pipeSizeBy !== 'od' && !known && fallback) onChange({ pipeSizeBy, ...sizePatch(fallback.outerDiameterM) });
                else onChange({ pipeSizeBy });
              }}
            />
            {d.pipeSizeBy === 'od' ? (
              num('pipeOuterDiameterM', 'Outside diameter', 'diameter')
            ) : (
              <SelectField
                label={d.pipeSizeBy === 'nps' ? 'Nominal pipe size (NPS)' : 'Nominal size (DN)'}
                testID="qs-input-pipeSize"
                value={String(pipeSizeByOuterDiameter(d.pipeOuterDiameterM ?? 0)?.outerDiameterM ?? '')}
                options={pipeSizes.map((p) => ({
                  value: String(p.outerDiameterM),
                  label: d.pipeSizeBy === 'nps' ? `NPS ${p.nps}` : `DN ${p.dn}`,
                  detail: `${odUnit.fromSI(p.outerDiameterM).toFixed(system === 'US' ? 3 : 1)} ${odUnit.suffix} outside (ASME B36.10M)`,
                }))}
                onChange={(v) => onChange(sizePatch(Number(v)))}
              />
            )}
            <OptionChips
              label="Run"
              value={d.pipeOrientation}
              testID="qs-pipe-orientation"
              options={PIPE_ORIENTATION_OPTIONS}
              onChange={(pipeOrientation) => onChange({ pipeOrientation })}
            />
            {d.pipeOrientation === 'vertical' ? num('pipeHeightM', 'Height of the vertical run', 'length') : null}
          </>
        ) : null}
        {d.kind === 'vessel' ? (
          <>
            {num('vesselDiameterM', 'Shell outside diameter', 'length')}
            {num('vesselLengthM', 'Shell length, tangent to tangent', 'length')}
            <OptionChips
              label="Axis"
              value={d.vesselOrientation}
              testID="qs-vessel-orientation"
              options={VESSEL_ORIENTATION_OPTIONS}
              onChange={(vesselOrientation) => onChange({ vesselOrientation })}
            />
            <OptionChips
              label="Heads"
              value={d.headType}
              testID="qs-head-type"
              options={HEAD_OPTIONS}
              onChange={(headType) => onChange({ headType })}
            />
          </>
        ) : null}
        {d.kind === 'wall' ? (
          <>
            <OptionChips
              label="The surface faces"
              value={d.wallOrientation}
              testID="qs-wall-orientation"
              options={WALL_ORIENTATION_OPTIONS}
              onChange={(wallOrientation) => onChange({ wallOrientation })}
            />
            {d.wallOrientation === 'vertical'
              ? num('wallHeightM', 'Wall height', 'length')
              : num('wallCharacteristicLengthM', 'Area ÷ perimeter', 'length', { hint: 'For a 2 m × 1 m top: 2 ÷ 6 = 0.33 m.' })}
          </>
        ) : null}
        {num('processTemperatureC', 'Process temperature', 'temperature')}
      </Card>

      <Card title="Insulation and finish" subtitle="Layers from the inside out." testID="qs-section-layers">
        {d.layers.map((l, i) => {
          const custom = l.materialId === 'custom';
          const provenance = custom ? undefined : materialById(l.materialId)?.provenance;
          return (
            <View key={i} style={styles.layer} testID={`qs-layer-${i}`}>
              <Text variant="label">{`Layer ${i + 1}${i === 0 ? ' (against the surface)' : ''}`}</Text>
              <SelectField
                label={`Material, layer ${i + 1}`}
                testID={`qs-input-layers[${i}].material`}
                value={l.materialId}
                options={materialOptions(system)}
                onChange={(id) => {
                  const m = materialById(id);
                  if (m) setLayer(i, { materialId: id, conductivity: [...m.conductivity], maxServiceTemperatureC: m.maxServiceTemperatureC ?? null });
                  else setLayer(i, { materialId: 'custom', conductivity: padTo3(l.conductivity) });
                }}
              />
              {provenance ? (
                <Text tone="textMuted" testID={`qs-layer-${i}-provenance`}>
                  {provenance}
                </Text>
              ) : null}
              {serviceLimits
                .filter((b) => b.layerIndex === i)
                .map((b) => (
                  <VerdictBadge key={b.kind} state="fail" text={b.text} testID={`qs-layer-${i}-service-limit`} />
                ))}
              {custom ? (
                <>
                  <CoefficientFields
                    layer={i + 1}
                    system={system}
                    value={l.conductivity}
                    onChange={(conductivity) => setLayer(i, { conductivity })}
                    errors={l.conductivity.map((_, j) => errors[`layers[${i}].conductivity[${j}]`])}
                    testID={`qs-input-layers[${i}].conductivity`}
                  />
                  <NumberField
                    label={`Maximum service temperature, layer ${i + 1}`}
                    quantity="temperature"
                    system={system}
                    value={l.maxServiceTemperatureC}
                    onChange={(v) => setLayer(i, { maxServiceTemperatureC: v })}
                    error={errors[`layers[${i}].maxServiceTemperatureC`]}
                    hint="Optional: a warning appears when the layer runs hotter."
                    testID={`qs-input-layers[${i}].maxServiceTemperatureC`}
                  />
                </>
              ) : null}
              {i === solvedIndex ? (
                <Text tone="textMuted" testID={`qs-layer-${i}-solved`}>
                  Thickness: worked out for the purpose below, rounded up to the thickness series.
                </Text>
              ) : (
                <NumberField
                  label={`Thickness, layer ${i + 1}`}
                  quantity="thickness"
                  system={system}
                  value={l.thicknessM}
                  onChange={(v) => setLayer(i, { thicknessM: v })}
                  error={errors[`layers[${i}].thicknessM`]}
                  testID={`qs-input-layers[${i}].thicknessM`}
                />
              )}
              {d.layers.length > 1 ? (
                <Button label={`Remove layer ${i + 1}`} variant="quiet" onPress={() => onChange({ layers: d.layers.filter((_, j) => j !== i) })} />
              ) : null}
            </View>
          );
        })}
        {d.layers.length < MAX_LAYERS ? (
          <Button
            label="Add an outer layer"
            variant="secondary"
            icon="plus"
            testID="qs-add-layer"
            onPress={() => {
              const last = d.layers[d.layers.length - 1];
              onChange({ layers: [...d.layers, { ...(last ?? defaultLayer()), thicknessM: last?.thicknessM ?? 0.05 }] });
            }}
          />
        ) : null}
        {errors.layers ? <Text tone="fail">{`Error: ${errors.layers}`}</Text> : null}
        <SelectField
          label="Outer finish"
          testID="qs-input-finish"
          value={d.finishId}
          options={FINISH_OPTIONS}
          onChange={(id) => {
            const f = finishById(id);
            onChange(f ? { finishId: id, emissivity: f.emissivity } : { finishId: 'custom' });
          }}
        />
        {d.finishId === 'custom' ? num('emissivity', 'Surface emissivity', 'ratio', { hint: 'From 0.02 (polished metal) to 1.' }) : null}
      </Card>

      <Card title="Surroundings" testID="qs-section-ambient">
        {num('airTemperatureC', 'Air temperature', 'temperature')}
        {num('radiantTemperatureC', 'Surroundings temperature (radiant)', 'temperature', { hint: 'Usually the air temperature; lower outdoors under a clear sky.' })}
        {num('windSpeedMS', 'Wind speed', 'speed', { hint: '0 for still air indoors.' })}
        {num('relativeHumidityPct', 'Relative humidity', 'percent', { hint: 'Gives the dew point; needed to stay dry.' })}
      </Card>

      <Card title="What the insulation must do" testID="qs-section-purpose">
        <OptionChips
          label="Purpose"
          value={d.purpose}
          testID="qs-purpose"
          options={PURPOSES.map((p) => ({
            value: p.id,
            label: p.label,
            disabled: !purposeAvailable(p.id, d.kind),
            note: purposeAvailable(p.id, d.kind) ? undefined : 'pipes only',
          }))}
          onChange={(purpose) => onChange({ purpose })}
        />
        <Text tone="textMuted" testID="qs-purpose-hint">
          {`${temperaturesInText(purpose?.hint ?? '', system)} (${PURPOSE_TRADE_TERMS[d.purpose]})`}
        </Text>
        {!available ? (
          <Text tone="caution" testID="qs-purpose-unavailable">
            {`Caution: ${purpose?.label} is worked out for pipes (flow along a run, or water standing in it). For a ${d.kind === 'vessel' ? 'vessel' : 'wall'}, choose another purpose; the build-up below is checked as entered.`}
          </Text>
        ) : null}
        <OptionChips
          label="Work out"
          value={d.mode}
          testID="qs-mode"
          options={MODE_OPTIONS}
          onChange={(mode) => onChange({ mode })}
        />
        {available && limitField
          ? num(limit, limitField.label, limitField.quantity, { hint: limitField.hint && temperaturesInText(limitField.hint, system), testID: 'qs-input-limit' })
          : null}
        {d.kind === 'pipe' && d.purpose === 'holding' ? (
          <>
            {num('runLengthM', 'Length of the run', 'length')}
            {num('massFlowKgPerS', 'Mass flow', 'massFlow')}
            {num('specificHeatJPerKgK', 'Specific heat of the fluid', 'specificHeat', { hint: 'Water about 4.19 kJ/(kg·K).' })}
          </>
        ) : null}
        {d.kind === 'pipe' && d.purpose === 'frost' ? (
          <>
            {num('innerDiameterM', 'Pipe inside diameter', 'diameter', { hint: 'Set from the standard wall when you pick a size; edit if yours differs.' })}
            {num('pipeMassKgPerM', 'Pipe mass per length', 'massPerLength')}
          </>
        ) : null}
        <OptionChips
          label="If someone touches the surface, it is"
          value={d.contactMaterial}
          testID="qs-contact"
          options={CONTACT_OPTIONS}
          onChange={(contactMaterial) => onChange({ contactMaterial })}
        />
        {cold ? (
          <Text tone="textMuted" testID="qs-cold-contact-hint">
            {temperaturesInText('Cold service: a touch is judged as cold contact (frostbite on metal from about −7 °C, ISO 13732-3), not against hot-surface burn thresholds.', system)}
          </Text>
        ) : (
          num('contactSeconds', 'Contact time', 'seconds', { hint: '5 s is the usual industrial basis; longer contact lowers the burn threshold.' })
        )}
      </Card>

      <Card title="Energy and money assumptions" subtitle="Defaults shown; change them to match your plant." testID="qs-section-assumptions">
        <SelectField
          label="Thickness series"
          testID="qs-input-series"
          value={d.energy.seriesId}
          options={SERIES_OPTIONS}
          onChange={(seriesId) => onChange({ energy: { ...d.energy, seriesId } })}
        />
        {energyNum('operatingHoursPerYear', 'Operating hours per year', 'hours')}
        <OptionChips
          label="Currency"
          value={d.energy.currency}
          testID="qs-currency"
          options={CURRENCY_OPTIONS}
          onChange={(currency) => onChange({ energy: { ...d.energy, currency } })}
        />
        {cold ? (
          <>
            <Text tone="textMuted" testID="qs-cooling-note">
              Cold service: the heat gained is removed by a chiller, so it is costed as the chiller’s electricity.
            </Text>
            {energyNum('coolingCop', 'Chiller coefficient of performance (COP)', 'ratio')}
            {energyNum('electricityPricePerKWh', 'Electricity price', 'pricePerEnergy', money)}
            {energyNum('electricityCo2KgPerKWh', 'CO₂ factor of electricity', 'co2Factor')}
            <TextField
              label="Basis of the electricity CO₂ factor"
              value={d.energy.electricityCo2Basis}
              onChangeText={(electricityCo2Basis) => onChange({ energy: { ...d.energy, electricityCo2Basis } })}
              testID="qs-input-energy.electricityCo2Basis"
            />
          </>
        ) : (
          <>
            {energyNum('pricePerKWh', 'Energy price (fuel as bought)', 'pricePerEnergy', money)}
            {energyNum('efficiency', 'Heat-source efficiency', 'fraction')}
            {energyNum('co2KgPerKWh', 'CO₂ factor of the fuel', 'co2Factor')}
            <TextField label="Basis of the CO₂ factor" value={d.energy.co2Basis} onChangeText={(co2Basis) => onChange({ energy: { ...d.energy, co2Basis } })} testID="qs-input-energy.co2Basis" />
          </>
        )}
      </Card>
    </View>
  );

  function sizePatch(outerDiameterM: number): Partial<Draft> {
    const p = pipeSizeByOuterDiameter(outerDiameterM);
    const patch: Partial<Draft> = { pipeOuterDiameterM: outerDiameterM };
    if (p?.innerDiameterM) patch.innerDiameterM = p.innerDiameterM;
    if (p?.massPerMetreKg) patch.pipeMassKgPerM = Number(p.massPerMetreKg.toFixed(2));
    return patch;
  }
}

function padTo3(c: Num[]): Num[] {
  const out = [...c];
  while (out.length < 3) out.push(0);
  return out;
}

function defaultLayer(): LayerDraft {
  const m = materials[0];
  return { materialId: m.id, conductivity: [...m.conductivity], maxServiceTemperatureC: m.maxServiceTemperatureC ?? null, thicknessM: 0.05 };
}

const styles = StyleSheet.create({
  col: { gap: spacing.lg },
  layer: { gap: spacing.sm, paddingBottom: spacing.sm },
});
