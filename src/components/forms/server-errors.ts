import type { FormikHelpers } from 'formik';

import { problemMessage, type ApiProblem } from '../../api/client';

/**
 * Puts a problem the server sent back onto the form: field errors at their fields, anything else
 * as the form's status message (shown in a banner).
 */
export function applyProblem<T>(problem: ApiProblem, helpers: Pick<FormikHelpers<T>, 'setErrors' | 'setStatus'>, fields: readonly string[]) {
  if (problem.kind === 'validation') {
    const known: Record<string, string> = {};
    const other: string[] = [];
    for (const [field, message] of Object.entries(problem.fieldErrors)) {
      if (fields.includes(field)) known[field] = message;
      else other.push(message);
    }
    helpers.setErrors(known as never);
    const general = Object.keys(known).length === 0 || other.length > 0 ? [problem.message, ...other].filter(Boolean).join(' ') : '';
    helpers.setStatus(general ? { error: general } : undefined);
    return;
  }
  helpers.setStatus({ error: problemMessage(problem) });
}

export type FormStatus = { error?: string; done?: string } | undefined;
