import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, waitFor } from '@testing-library/react';

import { jobKeys } from '../../api/jobs';
import { lineKeys } from '../../api/lines';
import type { Job } from '../../api/types';

import { SizingStatus } from './size-all';

const answer = (body: unknown) =>
  Promise.resolve({ ok: true, status: 200, headers: { get: () => null }, text: async () => JSON.stringify(body) } as unknown as Response);

const job = (patch: Partial<Job>): Job => ({ id: 5, siteId: 1, status: 'running', done: 250, total: 1000, error: null, ...patch });

describe('SizingStatus', () => {
  const realFetch = globalThis.fetch;
  afterEach(() => {
    globalThis.fetch = realFetch;
  });

  function renderWith(first: Job, next: Job) {
    const fetchMock = jest.fn(() => answer({ job: next }));
    globalThis.fetch = fetchMock as unknown as typeof fetch;
    const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    client.setQueryData(jobKeys.forSite(1), first.id);
    client.setQueryData(jobKeys.detail(first.id), first);
    client.setQueryData(lineKeys.overview(1), { stale: true });
    render(
      <QueryClientProvider client={client}>
        <SizingStatus siteId={1} />
      </QueryClientProvider>,
    );
    return { client, fetchMock };
  }

  it('when a job runs, then a progress bar says how far it is, in words and as a value', async () => {
    renderWith(job({}), job({}));
    const bar = screen.getByRole('progressbar', { name: 'Sizing progress' });
    expect(bar.getAttribute('aria-valuenow')).toBe('25');
    expect(screen.getByText('Sizing 250 of 1,000 items…')).toBeTruthy();
  });

  it('when the polled job is done, then it says so and the site’s lists and totals are refetched', async () => {
    const { client, fetchMock } = renderWith(job({}), job({ status: 'done', done: 1000 }));
    await waitFor(() => expect(screen.getByTestId('sizing-done')).toBeTruthy());
    expect(fetchMock).toHaveBeenCalledWith('/api/v1/jobs/5', expect.anything());
    expect(screen.queryByRole('progressbar')).toBeNull();
    expect(client.getQueryState(lineKeys.overview(1))?.isInvalidated).toBe(true);
  });

  it('when the job failed, then its error is shown', async () => {
    renderWith(job({}), job({ status: 'failed', error: 'The worker stopped.' }));
    await waitFor(() => expect(screen.getByTestId('sizing-failed').textContent).toContain('The worker stopped.'));
  });
});
