import * as yup from 'yup';

/** Roles a team member can hold. */
export const ROLES = ['owner', 'engineer', 'safety', 'contractor', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const UNIT_SYSTEMS = ['SI', 'US'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

/** Bounds shared by the forms and the API. */
export const LIMITS = {
  nameMax: 100,
  emailMax: 254,
  passwordMin: 12,
  /** Passwords are pre-hashed before bcrypt, so length is bounded only against abuse. */
  passwordMax: 256,
  teamNameMax: 100,
  siteNameMax: 120,
  siteDescriptionMax: 2000,
  tokenMax: 200,
} as const;

export const emailField = () =>
  yup
    .string()
    .strict()
    .trim('E-mail address must not start or end with spaces')
    .max(LIMITS.emailMax, `E-mail address must be at most ${LIMITS.emailMax} characters`)
    .email('Enter a valid e-mail address')
    .required('E-mail address is required');

export const nameField = () =>
  yup
    .string()
    .strict()
    .trim('Name must not start or end with spaces')
    .min(1, 'Name is required')
    .max(LIMITS.nameMax, `Name must be at most ${LIMITS.nameMax} characters`)
    .required('Name is required');

/** Length rules only; the server also refuses common and guessable passwords. */
export const passwordField = () =>
  yup
    .string()
    .strict()
    .min(LIMITS.passwordMin, `Password must be at least ${LIMITS.passwordMin} characters`)
    .max(LIMITS.passwordMax, `Password must be at most ${LIMITS.passwordMax} characters`)
    .required('Password is required');

export const roleField = () =>
  yup
    .string<Role>()
    .strict()
    .oneOf([...ROLES], `Role must be one of ${ROLES.join(', ')}`)
    .required('Role is required');

export const tokenField = () =>
  yup
    .string()
    .strict()
    .min(1, 'Token is required')
    .max(LIMITS.tokenMax, 'Token is too long')
    .required('Token is required');
