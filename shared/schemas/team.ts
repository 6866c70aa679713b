import * as yup from 'yup';
import { emailField, nameField, passwordField, roleField } from './common';

export const invitationCreateSchema = yup.object({ email: emailField(), role: roleField() }).noUnknown().strict();
export type InvitationCreateInput = yup.InferType<typeof invitationCreateSchema>;

/** New users send name and password; a signed-in user with the invited address sends `{}`. */
export const invitationAcceptSchema = yup
  .object({ name: nameField().optional().default(undefined), password: passwordField().optional().default(undefined) })
  .noUnknown()
  .strict();
export type InvitationAcceptInput = yup.InferType<typeof invitationAcceptSchema>;

export const memberRoleSchema = yup.object({ role: roleField() }).noUnknown().strict();
export type MemberRoleInput = yup.InferType<typeof memberRoleSchema>;
