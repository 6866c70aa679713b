import { act, fireEvent, render, screen, waitFor } from '@testing-library/react';

import type { ApiResult } from '../../api/client';
import type { Item } from '../../api/types';

import { ItemForm } from './item-form';

const materials = [
  { value: 'mineral-fibre-pipe-c547-type-ii', label: 'Mineral-fibre pipe insulation, up to 650 °C' },
  { value: 'team-material-1', label: 'Flexible aerogel blanket (team)' },
];
const finishes = [{ value: 'aluminium-oxidised', label: 'Aluminium jacket, oxidised' }];

function setup(system: 'SI' | 'US', answer: ApiResult<Record<string, Item>> = { kind: 'ok', status: 201, data: { line: { id: 9 } as Item } }) {
  const submit = jest.fn(async (_input: Record<string, unknown>) => answer);
  const onDone = jest.fn();
  render(<ItemForm kind="line" system={system} materials={materials} finishes={finishes} submit={submit} onDone={onDone} onCancel={jest.fn()} />);
  // Formik validates after each change; letting that settle keeps every update inside act().
  const type = async (testId: string, value: string) => {
    await act(async () => {
      fireEvent.change(screen.getByTestId(testId), { target: { value } });
    });
  };
  const press = async (el: HTMLElement) => {
    await act(async () => {
      fireEvent.click(el);
    });
  };
  return { submit, onDone, type, press };
}

describe('ItemForm', () => {
  it('when a line is typed in US units and saved, then the API gets SI values and the form is done', async () => {
    const { submit, onDone, type, press } = setup('US');
    await type('item-tag', '3"-TO-7');
    await press(screen.getByRole('radio', { name: 'Outside diameter' }));
    await type('item-outerDiameter', '3.5');
    await type('item-length', '328.084');
    await type('item-operatingTemperature', '554');
    expect(screen.getByLabelText('Operating temperature, degrees Fahrenheit')).toBeTruthy();
    await press(screen.getByTestId('item-save'));
    await waitFor(() => expect(submit).toHaveBeenCalledTimes(1));
    const body = submit.mock.calls[0][0];
    expect(body.outerDiameterM).toBeCloseTo(0.0889, 12);
    expect(body.lengthM).toBeCloseTo(100, 4);
    expect(body.operatingTemperatureC).toBeCloseTo(290, 10);
    expect(body).not.toHaveProperty('nps');
    await waitFor(() => expect(onDone).toHaveBeenCalledWith({ id: 9 }));
  });

  it('when saved with problems, then nothing is sent and each field names its problem', async () => {
    const { submit, type, press } = setup('SI');
    await type('item-operatingTemperature', 'hot');
    await press(screen.getByTestId('item-save'));
    await waitFor(() => expect(screen.getByText('Error: Operating temperature must be a number')).toBeTruthy());
    expect(screen.getByText('Error: Tag is required')).toBeTruthy();
    expect(screen.getByText('Error: Length is required')).toBeTruthy();
    expect(submit).not.toHaveBeenCalled();
  });

  it('when no problem has been submitted yet, then no error shows', async () => {
    const { type } = setup('SI');
    await type('item-operatingTemperature', 'hot');
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('when the server refuses the tag, then its message sits at the tag field', async () => {
    const { type, press } = setup('SI', { kind: 'validation', code: 'TAG_TAKEN', message: 'The site already has a line tagged "A-1".', fieldErrors: { tag: 'The site already has a line tagged "A-1".' } });
    await type('item-tag', 'A-1');
    await type('item-length', '10');
    await type('item-operatingTemperature', '120');
    await press(screen.getByTestId('item-save'));
    await waitFor(() => expect(screen.getByText('Error: The site already has a line tagged "A-1".')).toBeTruthy());
  });

  it('when a purpose needs parameters, then its fields appear only once it is chosen', async () => {
    const { press } = setup('SI');
    expect(screen.queryByTestId('item-holdingMassFlow')).toBeNull();
    await press(screen.getByRole('checkbox', { name: /Process temperature holding/ }));
    expect(screen.getByTestId('item-holdingMassFlow')).toBeTruthy();
    expect(screen.getByLabelText('Mass flow, kilograms per second')).toBeTruthy();
  });
});
