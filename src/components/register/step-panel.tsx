import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { REGISTER_TRANSITIONS, TRANSITION_SCHEMAS, type RegisterTransition } from '../../../shared/schemas/register';
import { problemMessage } from '../../api/client';
import { useRegisterStep, type RegisterEntry, type StepInput } from '../../api/register';
import { useTeam } from '../../api/team';
import { roleLabels } from '../../api/types';
import type { UnitSystem } from '../../calc/units';
import { spacing } from '../../theme';
import { validateWithSchema } from '../forms';
import { NumberField } from '../quick-sizing/number-field';
import { SelectField } from '../ui/select-field';
import { Banner, Button, ChoiceGroup, Text, TextField } from '../ui';


/** The words of each step: its button, what its text field asks, its confirm button. */
export const STEP_WORDS: Record<RegisterTransition, { button: string; field: string; confirm: string; variant: 'primary' | 'secondary' | 'danger' }> = {
  assign: { button: 'Assign an action', field: 'Action', confirm: 'Assign', variant: 'primary' },
  madeSafe: { button: 'Record made safe', field: 'What was done', confirm: 'Record made safe', variant: 'primary' },
  verify: { button: 'Verify the fix', field: 'Note', confirm: 'Verify', variant: 'primary' },
  sendBack: { button: 'Send back', field: 'Why it is not safe yet', confirm: 'Send back', variant: 'secondary' },
  accept: { button: 'Accept as it is', field: 'Reason', confirm: 'Accept', variant: 'secondary' },
  reopen: { button: 'Reopen', field: 'Reason', confirm: 'Reopen', variant: 'secondary' },
};

/** The usual next step first, for each status. */
const ORDER: Record<RegisterEntry['status'], RegisterTransition[]> = {
  open: ['assign', 'madeSafe', 'accept'],
  actionAssigned: ['madeSafe', 'assign', 'accept'],
  madeSafe: ['verify', 'sendBack', 'accept'],
  verified: ['reopen'],
  accepted: ['reopen'],
};

const dayPlus = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
const DUE_CHOICES = [
  { value: '1', label: 'Tomorrow' },
  { value: '7', label: 'In a week' },
  { value: '14', label: 'In 2 weeks' },
  { value: '30', label: 'In a month' },
] as const;

function StepForm({ entry, name, system, onDone }: { entry: RegisterEntry; name: RegisterTransition; system: UnitSystem; onDone: () => void }) {
  const step = useRegisterStep(entry.id);
  const team = useTeam(name === 'assign');
  const words = STEP_WORDS[name];
  const [text, setText] = useState(name === 'assign' ? entry.action : '');
  const [ownerId, setOwnerId] = useState(entry.owner ? String(entry.owner.userId) : '');
  const [due, setDue] = useState(entry.dueDate ?? dayPlus(7));
  const [reading, setReading] = useState<number | null>(null);
  const [method, setMethod] = useState<'contact' | 'infrared'>('contact');
  const [emissivity, setEmissivity] = useState<number | null>(0.95);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);

  const body = (): StepInput[RegisterTransition] => {
    switch (name) {
      case 'assign':
        return { ownerUserId: Number(ownerId), dueDate: due.trim(), action: text.trim() };
      case 'madeSafe':
        return { note: text.trim() };
      case 'verify':
        return {
          ...(text.trim() ? { note: text.trim() } : {}),
          ...(reading !== null ? { measuredTemperatureC: reading, method, ...(method === 'infrared' && emissivity !== null ? { emissivitySetting: emissivity } : {}) } : {}),
        };
      default:
        return { reason: text.trim() };
    }
  };
  const textField = name === 'assign' ? 'action' : name === 'madeSafe' || name === 'verify' ? 'note' : 'reason';

  const submit = async () => {
    setProblem(null);
    const b = body();
    const found = validateWithSchema(TRANSITION_SCHEMAS[name], b as Record<string, unknown>) as Record<string, string>;
    if (name === 'assign' && !ownerId) found.ownerUserId = 'Choose who owns the action';
    setErrors(found);
    if (Object.keys(found).length) return;
    const result = await step.mutateAsync({ name, body: b });
    if (result.kind === 'ok') return onDone();
    if (result.kind === 'validation' && Object.keys(result.fieldErrors).length) setErrors(result.fieldErrors);
    setProblem(problemMessage(result));
  };

  const people = (team.data?.members ?? []).filter((m) => m.role !== 'viewer');
  return (
    <View style={styles.form} testID={`step-form-${name}`}>
      {name === 'assign' ? (
        <>
          <SelectField
            label="Action owner"
            value={ownerId}
            options={[
              { value: '', label: team.isPending ? 'Loading the team…' : 'Choose someone' },
              ...people.map((m) => ({ value: String(m.userId), label: m.name, detail: m.role === 'contractor' ? `${roleLabels[m.role]} (must be invited to the site)` : roleLabels[m.role] })),
            ]}
            onChange={setOwnerId}
            testID="step-owner"
          />
          {errors.ownerUserId ? (
            <Text variant="caption" weight="semibold" tone="fail" role="alert">{`Error: ${errors.ownerUserId}`}</Text>
          ) : null}
          <ChoiceGroup compact
            label="Due"
            value={DUE_CHOICES.find((c) => dayPlus(Number(c.value)) === due)?.value ?? null}
            choices={DUE_CHOICES}
            onChange={(v) => setDue(dayPlus(Number(v)))}
            testID="step-due-quick"
          />
          <TextField label="Due date" value={due} onChangeText={setDue} placeholder="YYYY-MM-DD" hint="A date, YYYY-MM-DD" error={errors.dueDate} testID="step-due" />
        </>
      ) : null}
      {name === 'verify' ? (
        <>
          <NumberField label="New reading (optional)" quantity="temperature" system={system} value={reading} onChange={setReading} error={errors.measuredTemperatureC} testID="step-reading" />
          {reading !== null ? (
            <ChoiceGroup compact
              label="Measured with"
              value={method}
              choices={[
                { value: 'contact', label: 'Contact probe' },
                { value: 'infrared', label: 'Infrared' },
              ]}
              onChange={setMethod}
              testID="step-method"
            />
          ) : null}
          {reading !== null && method === 'infrared' ? (
            <NumberField label="Emissivity setting" quantity="ratio" system={system} value={emissivity} onChange={setEmissivity} error={errors.emissivitySetting} testID="step-emissivity" />
          ) : null}
        </>
      ) : null}
      <TextField label={words.field} value={text} onChangeText={setText} multiline error={errors[textField]} testID="step-text" />
      {problem ? (
        <Banner tone="fail" title="Not done" testID="step-problem">
          <Text>{problem}</Text>
        </Banner>
      ) : null}
      <View style={styles.buttons}>
        <Button label={words.confirm} variant={words.variant === 'danger' ? 'danger' : 'primary'} busy={step.isPending} onPress={() => void submit()} testID="step-confirm" style={styles.big} />
        <Button label="Cancel" variant="secondary" onPress={onDone} testID="step-cancel" style={styles.big} />
      </View>
    </View>
  );
}

/**
 * The next steps of an entry that the signed-in person may take (the server decides again): buttons, and the
 * short form of the step chosen. On phones it sits in the bar at the bottom of the screen, under the thumb.
 */
export function StepPanel({ entry, system }: { entry: RegisterEntry; system: UnitSystem }) {
  const [open, setOpen] = useState<RegisterTransition | null>(null);
  const steps = ORDER[entry.status].filter((s) => entry.allowed.includes(s) && (REGISTER_TRANSITIONS[s].from as readonly string[]).includes(entry.status));
  if (open) return <StepForm entry={entry} name={open} system={system} onDone={() => setOpen(null)} />;
  if (steps.length === 0) return null;
  return (
    <View style={styles.buttons} testID="step-buttons">
      {steps.map((s, i) => (
        <Button
          key={s}
          label={s === 'assign' && entry.status === 'actionAssigned' ? 'Re-assign' : STEP_WORDS[s].button}
          variant={i === 0 ? 'primary' : 'secondary'}
          onPress={() => setOpen(s)}
          testID={`step-${s}`}
          style={styles.big}
        />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.md },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  big: { minHeight: 48 },
});
