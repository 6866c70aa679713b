import * as yup from 'yup';
import { emailField, LIMITS, nameField, passwordField, tokenField } from './common';

export const signUpSchema = yup
  .object({
    name: nameField(),
    email: emailField(),
    password: passwordField(),
    teamName: yup
      .string()
      .strict()
      .trim('Team name must not start or end with spaces')
      .min(1, 'Team name is required')
      .max(LIMITS.teamNameMax, `Team name must be at most ${LIMITS.teamNameMax} characters`)
      .required('Team name is required'),
  })
  .noUnknown()
  .strict();
export type SignUpInput = yup.InferType<typeof signUpSchema>;

export const signInSchema = yup
  .object({
    email: emailField(),
    // Sign-in accepts any stored password, so only the upper bound applies here.
    password: yup
      .string()
      .strict()
      .min(1, 'Password is required')
      .max(LIMITS.passwordMax, `Password must be at most ${LIMITS.passwordMax} characters`)
      .required('Password is required'),
  })
  .noUnknown()
  .strict();
export type SignInInput = yup.InferType<typeof signInSchema>;

export const passwordResetRequestSchema = yup.object({ email: emailField() }).noUnknown().strict();
export type PasswordResetRequestInput = yup.InferType<typeof passwordResetRequestSchema>;

export const passwordResetConfirmSchema = yup
  .object({ token: tokenField(), password: passwordField() })
  .noUnknown()
  .strict();
export type PasswordResetConfirmInput = yup.InferType<typeof passwordResetConfirmSchema>;
