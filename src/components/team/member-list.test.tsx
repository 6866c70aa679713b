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
