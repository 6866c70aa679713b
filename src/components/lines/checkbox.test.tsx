import { fireEvent, render, screen } from '@testing-library/react';

import { Checkbox } from './checkbox';

describe('Checkbox', () => {
  it('when Space or a click reaches it, then it toggles; its state is announced', () => {
    const onChange = jest.fn();
    render(<Checkbox label="Select 4&quot;-HS-101" checked={false} onChange={onChange} testID="cb" />);
    const box = screen.getByRole('checkbox', { name: 'Select 4"-HS-101' });
    expect(box.getAttribute('aria-checked')).toBe('false');
    fireEvent.keyDown(box, { key: ' ' });
    fireEvent.click(box);
    expect(onChange).toHaveBeenNthCalledWith(1, true);
    expect(onChange).toHaveBeenNthCalledWith(2, true);
  });

  it('when disabled, then Space does nothing', () => {
    const onChange = jest.fn();
    render(<Checkbox label="Select" checked onChange={onChange} disabled />);
    fireEvent.keyDown(screen.getByRole('checkbox'), { key: ' ' });
    expect(onChange).not.toHaveBeenCalled();
  });
});
