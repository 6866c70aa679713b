import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, waitFor } from '@testing-library/react';

import type { Member } from '../../api/types';

import { MemberList } from './member-list';

const owner: Member = { userId: 1, name: 'Ada Okafor', email: 'ada@north-ridge.example', role: 'owner', joinedAt: '2026-12-01T00:00:00Z' };
const engineer: Member = { userId: 2, name: 'Bram Lindqvist', email: 'bram@north-ridge.example', role: 'engineer', joinedAt: '2026-12-01T00:00:00Z' };

function renderList(canManage: boolean) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <MemberList members={[owner, engineer]} canManage={canManage} selfId={1} />
    </QueryClientProvider>,
  );
}

/** The slice of a fetch Response the API client reads. */
const answer = (status: number, body: unknown) =>
  Promise.resolve({
    ok: status >= 200 && status < 300,
    status,
    headers: { get: () => null },
    text: async () => (body === null ? '' : JSON.stringify(body)),
  } as unknown as Response);

describe('MemberList removal', () => {
  const realFetch = globalThis.fetch;
  afterEach(() => {
    globalThis.fetch = realFetch;
  });

  it('when the owner presses Remove, then nothing is sent until the removal is confirmed', async () => {
    const fetchMock = jest.fn(() => answer(204, null));
    globalThis.fetch = fetchMock as unknown as typeof fetch;
    renderList(true);
    fireEvent.click(screen.getByRole('button', { name: 'Remove Bram Lindqvist from the team' }));
    expect(fetchMock).not.toHaveBeenCalled();
    fireEvent.click(screen.getByRole('button', { name: 'Yes, remove Bram Lindqvist' }));
    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(1));
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/v1/team/members/2');
    expect(init.method).toBe('DELETE');
  });

  it('when the server refuses to remove the last owner, then its reason is shown at the member', async () => {
    globalThis.fetch = jest.fn(() =>
      answer(409, { errors: [{ code: 'LAST_OWNER', field: 'role', message: 'A team needs at least one owner: make someone else an owner first.' }] }),
    ) as unknown as typeof fetch;
    renderList(true);
    fireEvent.click(screen.getByRole('button', { name: 'Remove Ada Okafor from the team' }));
    expect(screen.getByText(/Remove yourself from the team\?/)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Yes, remove Ada Okafor' }));
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Not removed');
    expect(alert.textContent).toContain('A team needs at least one owner');
  });

  it('when the viewer is not an owner, then no member can be removed from here', () => {
    renderList(false);
    expect(screen.queryByRole('button', { name: /^Remove / })).toBeNull();
  });
});

describe('MemberList role changes', () => {
  const realFetch = globalThis.fetch;
  afterEach(() => {
    globalThis.fetch = realFetch;
  });

  it('when the owner picks a role, then nothing is sent until the change is confirmed, and the confirmation says what the role may do', async () => {
    const fetchMock = jest.fn(() => answer(200, { member: { ...engineer, role: 'safety' } }));
    globalThis.fetch = fetchMock as unknown as typeof fetch;
    renderList(true);
    fireEvent.click(screen.getByRole('button', { name: 'Change role of Bram Lindqvist' }));
    fireEvent.click(screen.getByRole('radio', { name: 'Safety officer' }));
    expect(fetchMock).not.toHaveBeenCalled();
    const confirm = screen.getByTestId('role-confirm-bram@north-ridge.example');
    expect(confirm.textContent).toContain('Make Bram Lindqvist a Safety officer?');
    expect(confirm.textContent).toContain('edit the touch-safety basis of a site');
    expect(confirm.textContent).toContain('Not: invite people, change roles');
    fireEvent.click(screen.getByRole('button', { name: 'Yes, make Bram Lindqvist Safety officer' }));
    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(1));
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/v1/team/members/2');
    expect(init.method).toBe('PATCH');
    expect(JSON.parse(String(init.body))).toEqual({ role: 'safety' });
  });

  it('when the owner proposes a promotion to owner, then the confirmation warns what an owner can do, and Cancel sends nothing', () => {
    const fetchMock = jest.fn(() => answer(200, {}));
    globalThis.fetch = fetchMock as unknown as typeof fetch;
    renderList(true);
    fireEvent.click(screen.getByRole('button', { name: 'Change role of Bram Lindqvist' }));
    fireEvent.click(screen.getByRole('radio', { name: 'Owner' }));
    expect(screen.getByTestId('role-confirm-owner-note').textContent).toContain('could then change your role or remove you');
    expect(screen.getByTestId('role-confirm-bram@north-ridge.example').textContent).toContain('invite people, change roles (their own too) and remove members');
    fireEvent.click(screen.getByRole('button', { name: 'Keep Bram Lindqvist as Engineer' }));
    expect(screen.queryByTestId('role-confirm-bram@north-ridge.example')).toBeNull();
    expect(fetchMock).not.toHaveBeenCalled();
  });
});
