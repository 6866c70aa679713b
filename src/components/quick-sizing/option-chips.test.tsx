import { act, fireEvent, render, screen } from '@testing-library/react';
import { useState } from 'react';

import { ChoiceGroup } from '../ui';

import { OptionChips } from './option-chips';

type Kind = 'pipe' | 'vessel' | 'wall';

function Chips() {
  const [v, setV] = useState<Kind>('pipe');
  return (
    <>
      <OptionChips
        label="Shape"
        value={v}
        testID="kind"
        options={[
          { value: 'pipe', label: 'Pipe' },
          { value: 'vessel', label: 'Vessel', disabled: true, note: 'not here' },
          { value: 'wall', label: 'Wall' },
        ]}
        onChange={setV}
      />
      <output data-testid="kind-value">{v}</output>
    </>
  );
}

function Roles() {
  const [v, setV] = useState<'owner' | 'engineer' | 'viewer'>('engineer');
  return (
    <>
      <ChoiceGroup
        label="Role"
        value={v}
        choices={[
          { value: 'owner', label: 'Owner' },
          { value: 'engineer', label: 'Engineer' },
          { value: 'viewer', label: 'Viewer' },
        ]}
        onChange={setV}
      />
      <output data-testid="role-value">{v}</output>
    </>
  );
}

const key = (el: Element, k: string) => act(() => void fireEvent.keyDown(el, { key: k }));

describe('radio groups from the keyboard', () => {
  it('when chips are tabbed to, then only the checked one is a tab stop', () => {
    render(<Chips />);
    const radios = screen.getAllByRole('radio');
    expect(radios.map((r) => r.getAttribute('tabindex'))).toEqual(['0', '-1', '-1']);
  });

  it('when the arrow keys are pressed on chips, then they move to the next available chip, check it and skip the unavailable one', () => {
    render(<Chips />);
    key(screen.getByTestId('kind-pipe'), 'ArrowRight');
    expect(screen.getByTestId('kind-value').textContent).toBe('wall');
    expect(document.activeElement).toBe(screen.getByTestId('kind-wall'));
    expect(screen.getByTestId('kind-wall').getAttribute('aria-checked')).toBe('true');
    // Wraps around, again past the unavailable chip.
    key(screen.getByTestId('kind-wall'), 'ArrowDown');
    expect(screen.getByTestId('kind-value').textContent).toBe('pipe');
    key(screen.getByTestId('kind-pipe'), 'ArrowLeft');
    expect(screen.getByTestId('kind-value').textContent).toBe('wall');
  });

  it('when Space is pressed on a focused chip, then it is checked', () => {
    render(<Chips />);
    key(screen.getByTestId('kind-wall'), ' ');
    expect(screen.getByTestId('kind-value').textContent).toBe('wall');
    // An unavailable chip cannot be checked.
    key(screen.getByTestId('kind-vessel'), ' ');
    expect(screen.getByTestId('kind-value').textContent).toBe('wall');
  });

  it('when a choice group gets arrows and Space, then it behaves as a radio group too', () => {
    render(<Roles />);
    const [owner, engineer, viewer] = screen.getAllByRole('radio');
    expect([owner, engineer, viewer].map((r) => r.getAttribute('tabindex'))).toEqual(['-1', '0', '-1']);
    key(engineer, 'ArrowUp');
    expect(screen.getByTestId('role-value').textContent).toBe('owner');
    expect(document.activeElement).toBe(owner);
    key(viewer, ' ');
    expect(screen.getByTestId('role-value').textContent).toBe('viewer');
  });
});
