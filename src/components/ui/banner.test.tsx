import { fireEvent, render, screen } from '@testing-library/react';

import { Banner } from './banner';
import { EmptyState } from './empty-state';

describe('Banner', () => {
  it('when a caution is shown, then it says so in words and is announced, not only coloured', () => {
    render(<Banner tone="caution">Surface above the touch limit.</Banner>);
    const alert = screen.getByRole('alert');
    expect(alert.textContent).toContain('Caution');
    expect(alert.textContent).toContain('Surface above the touch limit.');
  });

  it('when a confirmation is shown, then it is a polite status, not an alert', () => {
    render(<Banner tone="pass" title="Saved">Units saved.</Banner>);
    expect(screen.queryByRole('alert')).toBeNull();
    expect(screen.getByRole('status').textContent).toContain('Saved');
  });
});

describe('EmptyState', () => {
  it('when the viewer may act, then the one action is offered and runs', () => {
    const onAction = jest.fn();
    render(<EmptyState title="No sites yet" message="Sites hold line lists." actionLabel="Create a site" onAction={onAction} />);
    fireEvent.click(screen.getByRole('button', { name: 'Create a site' }));
    expect(onAction).toHaveBeenCalledTimes(1);
  });

  it('when the viewer may not act, then no button is offered and the note says who can', () => {
    render(<EmptyState title="No sites yet" message="Sites hold line lists." note="An owner or engineer can create the first site." />);
    expect(screen.queryByRole('button')).toBeNull();
    expect(screen.getByText('An owner or engineer can create the first site.')).toBeTruthy();
  });
});
