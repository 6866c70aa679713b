import { act, fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';

import { SelectField, type SelectOption } from './select-field';

const OPTIONS: SelectOption[] = [
  { value: 'metric', label: 'Metric steps' },
  { value: 'inch', label: 'Half-inch steps' },
  { value: 'custom', label: 'Custom series' },
];

function Harness() {
  const [a, setA] = useState('metric');
  const [b, setB] = useState('inch');
  return (
    <>
      <SelectField label="Series" value={a} options={OPTIONS} onChange={setA} testID="a" />
      <SelectField label="Other" value={b} options={OPTIONS} onChange={setB} testID="b" />
      <output data-testid="a-value">{a}</output>
      <button>elsewhere</button>
    </>
  );
}

const listboxes = () => screen.queryAllByRole('listbox');
const key = (el: HTMLElement, k: string) => act(() => void fireEvent.keyDown(el, { key: k }));

describe('SelectField keyboard and pointer', () => {
  it('when the arrow keys open the list and move, then the active option follows and Escape closes without a change', () => {
    render(<Harness />);
    const field = screen.getByTestId('a');
    expect(field.getAttribute('role')).toBe('combobox');
    expect(field.getAttribute('aria-haspopup')).toBe('listbox');
    key(field, 'ArrowDown');
    expect(field.getAttribute('aria-expanded')).toBe('true');
    expect(listboxes()).toHaveLength(1);
    // Opens on the selected option, then moves down.
    expect(document.getElementById(field.getAttribute('aria-activedescendant')!)?.textContent).toContain('Metric steps');
    key(field, 'ArrowDown');
    expect(document.getElementById(field.getAttribute('aria-activedescendant')!)?.textContent).toContain('Half-inch steps');
    key(field, 'Escape');
    expect(field.getAttribute('aria-expanded')).toBe('false');
    expect(listboxes()).toHaveLength(0);
    expect(screen.getByTestId('a-value').textContent).toBe('metric');
  });

  it('when Space or End and Space are pressed, then the active option is chosen and the list closes', () => {
    render(<Harness />);
    const field = screen.getByTestId('a');
    key(field, ' ');
    key(field, 'End');
    key(field, ' ');
    expect(screen.getByTestId('a-value').textContent).toBe('custom');
    expect(listboxes()).toHaveLength(0);
  });

  it('when a letter is typed, then the next option starting with it becomes active', () => {
    render(<Harness />);
    const field = screen.getByTestId('a');
    key(field, 'h');
    expect(document.getElementById(field.getAttribute('aria-activedescendant')!)?.textContent).toContain('Half-inch steps');
  });

  it('when a second list opens, then the first one closes: never two open at once', () => {
    render(<Harness />);
    key(screen.getByTestId('a'), 'ArrowDown');
    key(screen.getByTestId('b'), 'ArrowDown');
    expect(listboxes()).toHaveLength(1);
    expect(screen.getByTestId('a').getAttribute('aria-expanded')).toBe('false');
    expect(screen.getByTestId('b').getAttribute('aria-expanded')).toBe('true');
  });

  it('when the pointer goes down outside an open list, then it closes; inside it, an option can be picked', () => {
    render(<Harness />);
    key(screen.getByTestId('a'), 'ArrowDown');
    act(() => void fireEvent.pointerDown(screen.getByText('elsewhere')));
    expect(listboxes()).toHaveLength(0);
    key(screen.getByTestId('a'), 'ArrowDown');
    const option = screen.getByTestId('a-option-inch');
    expect(option.getAttribute('role')).toBe('option');
    act(() => void fireEvent.pointerDown(option));
    expect(listboxes()).toHaveLength(1);
    act(() => void fireEvent.click(option));
    expect(screen.getByTestId('a-value').textContent).toBe('inch');
    expect(listboxes()).toHaveLength(0);
  });
});
