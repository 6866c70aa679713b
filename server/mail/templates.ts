import type { Role } from '../../shared/schemas/common';
import type { OutgoingMail } from './mailer';

const ROLE_NAMES: Record<Role, string> = {
  owner: 'owner',
  engineer: 'engineer',
  safety: 'safety officer',
  contractor: 'insulation contractor',
  viewer: 'viewer',
};

export function invitationMail(p: {
  to: string;
  teamId: number;
  teamName: string;
  role: Role;
  invitedBy: string;
  link: string;
  expiresAt: Date;
}): OutgoingMail {
  return {
    to: p.to,
    kind: 'invitation',
    teamId: p.teamId,
    subject: `You are invited to ${p.teamName} on Lagline`,
    text: [
      `${p.invitedBy} invited you to join the team "${p.teamName}" on Lagline as ${ROLE_NAMES[p.role]}.`,
      '',
      'Accept the invitation here:',
      p.link,
      '',
      `The link works once and expires on ${p.expiresAt.toISOString().slice(0, 16).replace('T', ' ')} UTC.`,
      'If you were not expecting this, you can ignore this e-mail.',
    ].join('\n'),
  };
}

export function passwordResetMail(p: { to: string; link: string }): OutgoingMail {
  return {
    to: p.to,
    kind: 'password-reset',
    teamId: null,
    subject: 'Reset your Lagline password',
    text: [
      'Someone (hopefully you) asked to reset the password of your Lagline account.',
      '',
      'Choose a new password here:',
      p.link,
      '',
      'The link works once and expires in 1 hour.',
      'If this was not you, ignore this e-mail: your password stays as it is.',
    ].join('\n'),
  };
}
