import { act, fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';

import type { UnitSystem } from '../../calc/units';

import { NumberField } from './number-field';

function Harness({ initial }: { initial: number | null }) {
  const [si, setSi] = useState<number | null>(initial);
  const [system, setSystem] = useState<UnitSystem>('SI');
  return (
    <>
      <NumberField label="Outside diameter" quantity="diameter" system={system} value={si} onChange={setSi} testID="od" />
      <button onClick={() => setSystem((s) => (s === 'SI' ? 'US' : 'SI'))}>toggle</button>
      <output data-testid="si">{String(si)}</output>
    </>
  );
}

const input = () => screen.getByTestId('od') as HTMLInputElement;

describe('NumberField', () => {
  it('when a value is typed, then the SI value follows and the label speaks the unit', () => {
    render(<Harness initial={0.1143} />);
    expect(input().value).toBe('114.3');
    expect(input().getAttribute('aria-label')).toBe('Outside diameter, millimetres');
    fireEvent.change(input(), { target: { value: '60,3' } });
    expect(screen.getByTestId('si').textContent).toBe(String(0.0603));
  });

  it('when units switch to US and back, then the field shows the same text as before', () => {
    render(<Harness initial={0.1143} />);
    fireEvent.change(input(), { target: { value: '168.3' } });
    act(() => screen.getByText('toggle').click());
    expect(input().value).toBe('6.62598');
    act(() => screen.getByText('toggle').click());
    expect(input().value).toBe('168.3');
    expect(screen.getByTestId('si').textContent).toBe(String(0.1683));
  });

  it('when the text is not a number, then the field says so and keeps the text', () => {
    render(<Harness initial={0.1143} />);
    fireEvent.change(input(), { target: { value: '4 inch' } });
    expect(screen.getByTestId('si').textContent).toBe('null');
    expect(input().value).toBe('4 inch');
    expect(screen.getByRole('alert').textContent).toContain('Enter outside diameter as a number.');
  });
});
