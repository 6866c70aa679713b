import { fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';

import { TextField } from './text-field';

function Controlled(props: { initial?: string; error?: string }) {
  const [value, setValue] = useState(props.initial ?? '');
  return (
    <>
      <TextField label="Outer diameter" unit="mm" unitSpoken="millimetres" value={value} onChangeText={setValue} error={props.error} testID="od" />
      <output data-testid="raw">{value}</output>
    </>
  );
}

describe('TextField', () => {
  it('when a unit is given, then the accessible label spells it out and the unit shows as a suffix', () => {
    render(<Controlled />);
    expect(screen.getByLabelText('Outer diameter, millimetres')).toBeTruthy();
    expect(screen.getByText('Outer diameter (mm)')).toBeTruthy();
    expect(screen.getByText('mm')).toBeTruthy();
  });

  it('when a partial number is typed, then the raw text is kept as typed', () => {
    render(<Controlled />);
    fireEvent.change(screen.getByTestId('od'), { target: { value: '114.' } });
    expect(screen.getByTestId('raw').textContent).toBe('114.');
    expect((screen.getByTestId('od') as HTMLInputElement).value).toBe('114.');
  });

  it('when there is an error, then it is shown, announced and tied to the input', () => {
    render(<Controlled error="Enter a diameter above 0 mm" />);
    const alert = screen.getByRole('alert');
    expect(alert.textContent).toBe('Error: Enter a diameter above 0 mm');
    const input = screen.getByTestId('od');
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(input.getAttribute('aria-describedby')).toContain(alert.id);
  });

  it('when there is no error, then no alert is rendered', () => {
    render(<Controlled />);
    expect(screen.queryByRole('alert')).toBeNull();
  });
});
