import { ValidationError, type AnySchema } from 'yup';

export type FormErrors<T> = Partial<Record<keyof T & string, string>>;

/** Removes surrounding spaces from every string except the listed keys (passwords keep theirs). */
export function trimStrings<T extends Record<string, unknown>>(values: T, keep: readonly (keyof T)[] = []): T {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(values)) out[k] = typeof v === 'string' && !keep.includes(k as keyof T) ? v.trim() : v;
  return out as T;
}

/**
 * Runs a shared yup schema (the one the server uses) over form values and returns Formik errors:
 * the first message per field.
 */
export function validateWithSchema<T extends Record<string, unknown>>(schema: AnySchema, values: T): FormErrors<T> {
  try {
    schema.validateSync(values, { abortEarly: false });
    return {};
  } catch (e) {
    if (!(e instanceof ValidationError)) throw e;
    const errors: Record<string, string> = {};
    const items = e.inner.length > 0 ? e.inner : [e];
    for (const item of items) {
      const key = item.path ?? '';
      if (key && !(key in errors)) errors[key] = item.message;
    }
    return errors as FormErrors<T>;
  }
}
