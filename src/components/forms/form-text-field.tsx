import type { FormikProps } from 'formik';

import { TextField, type TextFieldProps } from '../ui';

export interface FormTextFieldProps<T> extends Omit<TextFieldProps, 'value' | 'onChangeText' | 'error'> {
  form: FormikProps<T>;
  name: keyof T & string;
}

/**
 * A TextField bound to a Formik form. Errors appear only after the first submit, then follow the
 * input as it changes; errors the server sent back sit at their field the same way.
 */
export function FormTextField<T>({ form, name, onBlur, ...rest }: FormTextFieldProps<T>) {
  const raw = form.values[name];
  const error = form.submitCount > 0 ? (form.errors[name] as string | undefined) : undefined;
  return (
    <TextField
      {...rest}
      value={typeof raw === 'string' ? raw : raw == null ? '' : String(raw)}
      onChangeText={(text) => void form.setFieldValue(name, text)}
      onBlur={(e) => {
        void form.setFieldTouched(name, true, false);
        onBlur?.(e);
      }}
      error={error}
    />
  );
}
