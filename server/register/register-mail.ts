import type { UnitSystem } from '../../shared/schemas/common';
import type { OutgoingMail } from '../mail/mailer';
import { dateText, METHOD_WORDS, temperatureText } from './register-words';

export type ReminderKind = 'assigned' | 'dueSoon' | 'overdue' | 'verifyRequest';
export const REMINDER_KINDS: readonly ReminderKind[] = ['assigned', 'dueSoon', 'overdue', 'verifyRequest'];

/** What a register mail says about its entry. */
export type ReminderMailData = {
  kind: ReminderKind;
  to: string;
  recipientName: string;
  unitSystem: UnitSystem;
  entryId: number;
  /** The entry's team: the reminder is its action. */
  teamId: number;
  siteName: string;
  location: string;
  measuredTemperatureC: number;
  method: keyof typeof METHOD_WORDS;
  limitC: number | null;
  action: string;
  dueDate: string | null;
  statusNote: string;
  /** Who assigned the action, or who recorded the fix. */
  byName: string | null;
  /** Days from today to the due date (negative when overdue). */
  daysToDue: number | null;
  link: string;
};

const CAUTION =
  'Lagline is an aid to, not a substitute for, the judgement of a competent person, the plant\'s specification and local codes.';

function reading(d: ReminderMailData): string {
  const limit = d.limitC === null ? '' : `, touch limit ${temperatureText(d.limitC, d.unitSystem)}`;
  return `Surface: ${temperatureText(d.measuredTemperatureC, d.unitSystem)} (${METHOD_WORDS[d.method].toLowerCase()})${limit}`;
}

/** The mail of one register reminder. */
export function reminderMail(d: ReminderMailData): OutgoingMail {
  const where = `${d.location} (${d.siteName})`;
  const due = d.dueDate ? dateText(d.dueDate) : '—';
  switch (d.kind) {
    case 'assigned':
      return {
        to: d.to,
        kind: 'register-reminder',
        teamId: d.teamId,
        subject: `Action for you: hot surface at ${where}`,
        text: [
          `${d.recipientName}, ${d.byName ?? 'a safety officer'} assigned you an action on the hot-surface register.`,
          '',
          `Where: ${where}`,
          reading(d),
          `Action: ${d.action}`,
          `Due: ${due}`,
          '',
          'When it is done, record what was done on the entry ("Made safe"); a safety officer then verifies it:',
          d.link,
          '',
          CAUTION,
        ].join('\n'),
      };
    case 'dueSoon': {
      const when = d.daysToDue === 0 ? 'today' : d.daysToDue === 1 ? 'tomorrow' : `in ${d.daysToDue} days`;
      return {
        to: d.to,
        kind: 'register-reminder',
        teamId: d.teamId,
        subject: `Due ${when}: hot surface at ${where}`,
        text: [
          `${d.recipientName}, the action on this hot surface is due ${when} (${due}).`,
          '',
          `Where: ${where}`,
          reading(d),
          `Action: ${d.action}`,
          '',
          d.link,
        ].join('\n'),
      };
    }
    case 'overdue':
      return {
        to: d.to,
        kind: 'register-reminder',
        teamId: d.teamId,
        subject: `Overdue since ${due}: hot surface at ${where}`,
        text: [
          `${d.recipientName}, the action on this hot surface was due on ${due} and is not recorded as done.`,
          '',
          `Where: ${where}`,
          reading(d),
          `Action: ${d.action}`,
          '',
          'Until it is made safe, keep people away from the surface or guard it.',
          d.link,
        ].join('\n'),
      };
    case 'verifyRequest':
      return {
        to: d.to,
        kind: 'register-reminder',
        teamId: d.teamId,
        subject: `Please verify: hot surface at ${where} was made safe`,
        text: [
          `${d.recipientName}, ${d.byName ?? 'someone'} recorded this hot surface as made safe. Please check it on the plant and verify it, or send it back.`,
          '',
          `Where: ${where}`,
          reading(d),
          `What was done: ${d.statusNote || '—'}`,
          '',
          d.link,
          '',
          CAUTION,
        ].join('\n'),
      };
  }
}
