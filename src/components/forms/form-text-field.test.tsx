import { act, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { Formik } from 'formik';

import { signInSchema } from '../../../shared/schemas';
import { Button } from '../ui';

import { FormTextField } from './form-text-field';
import { trimStrings, validateWithSchema } from './validate';

type Values = { email: string; password: string };

function SignInLike({ onSubmit }: { onSubmit: (v: Values) => void }) {
  return (
    <Formik<Values>
      initialValues={{ email: '', password: '' }}
      validate={(v) => validateWithSchema(signInSchema, trimStrings(v, ['password']))}
      onSubmit={onSubmit}
    >
      {(form) => (
        <>
          <FormTextField form={form} name="email" label="E-mail address" testID="email" />
          <FormTextField form={form} name="password" label="Password" password testID="password" />
          <Button label="Sign in" onPress={() => form.handleSubmit()} />
        </>
      )}
    </Formik>
  );
}

describe('FormTextField with a shared schema', () => {
  it('when nothing has been submitted yet, then invalid fields show no error', async () => {
    render(<SignInLike onSubmit={jest.fn()} />);
    fireEvent.change(screen.getByTestId('email'), { target: { value: 'not-an-address' } });
    fireEvent.blur(screen.getByTestId('email'));
    await act(async () => undefined);
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('when submitted empty, then each field names its problem and nothing is sent', async () => {
    const onSubmit = jest.fn();
    render(<SignInLike onSubmit={onSubmit} />);
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(screen.getAllByRole('alert')).toHaveLength(2));
    expect(screen.getByText('Error: E-mail address is required')).toBeTruthy();
    expect(screen.getByText('Error: Password is required')).toBeTruthy();
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('when the error is fixed after a submit, then its message goes away as the user types', async () => {
    render(<SignInLike onSubmit={jest.fn()} />);
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(screen.getByText('Error: E-mail address is required')).toBeTruthy());
    fireEvent.change(screen.getByTestId('email'), { target: { value: 'ada@north-ridge.example ' } });
    await waitFor(() => expect(screen.queryByText(/E-mail address/, { selector: '[role=alert]' })).toBeNull());
  });

  it('when the values are valid, then surrounding spaces are ignored and the form submits', async () => {
    const onSubmit = jest.fn();
    render(<SignInLike onSubmit={onSubmit} />);
    fireEvent.change(screen.getByTestId('email'), { target: { value: ' ada@north-ridge.example' } });
    fireEvent.change(screen.getByTestId('password'), { target: { value: 'anything at all' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalledTimes(1));
  });
});
