import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, waitFor } from '@testing-library/react';
import { SafeAreaProvider } from 'react-native-safe-area-context';

import { revisionKeys, type Readiness } from '../../api/revisions';
import { sessionKeys } from '../../api/session';
import type { Role } from '../../api/types';
import { jsonAnswer as answer, press, requestsTo as calls, sessionOf, type } from '../common/testing';

import { PrepareRevisionScreen } from './prepare-revision-screen';
import { RevisionSchemePanel, schemeInput, schemeWords } from './revision-scheme-panel';

jest.mock('expo-router', () => ({
  useRouter: () => ({ push: jest.fn(), replace: jest.fn() }),
  Link: ({ href, children, testID }: { href: string; children: string; testID?: string }) => (
    <a href={href} data-testid={testID}>
      {children}
    </a>
  ),
}));

type Route = (url: string, init: RequestInit) => Promise<Response> | undefined;

function setup(ui: React.ReactElement, route: Route, role: Role = 'engineer') {
  const fetchMock = jest.fn((url: string, init: RequestInit = {}) => route(url, init) ?? answer(404, { errors: [{ code: 'NOT_FOUND', message: `No route ${url}` }] }));
  globalThis.fetch = fetchMock as unknown as typeof fetch;
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  client.setQueryData(sessionKeys.current(), sessionOf(role));
  render(
    <SafeAreaProvider initialMetrics={{ frame: { x: 0, y: 0, width: 390, height: 844 }, insets: { top: 0, left: 0, right: 0, bottom: 0 } }}>
      <QueryClientProvider client={client}>{ui}</QueryClientProvider>
    </SafeAreaProvider>,
  );
  return { fetchMock, client };
}

describe('the numbering scheme', () => {
  const realFetch = globalThis.fetch;
  afterEach(() => {
    globalThis.fetch = realFetch;
  });

  it('when schemes are put in words, then the trade scheme names both series and the team’s own its first marks', () => {
    expect(schemeWords({ kind: 'trade' })).toMatch(/review A, B, C … \(no I or O\), issues for construction 0, 1, 2/);
    expect(schemeWords({ kind: 'counter', prefix: 'P-', start: 1, digits: 2 })).toBe('The team’s own: one counter for every issue, P-01, P-02, P-03 …');
    expect(schemeInput({ kind: 'counter', prefix: ' X/', start: '7', digits: 'two' })).toEqual({ kind: 'counter', prefix: 'X/', start: 7, digits: 'two' });
    expect(schemeInput({ kind: 'trade', prefix: 'P-', start: '1', digits: '2' })).toEqual({ kind: 'trade' });
  });

  it('when an engineer switches to the team’s own counter, then a bad field is refused at the field, the preview follows, and the PUT carries the scheme', async () => {
    let saved: unknown = { kind: 'trade' };
    const { fetchMock } = setup(<RevisionSchemePanel siteId="3" nextNumbers={{ review: 'B', construction: '0' }} />, (url, init) => {
      if (url !== '/api/v1/sites/3/revision-scheme') return undefined;
      if (init.method === 'PUT') {
        saved = JSON.parse(String(init.body));
        return answer(200, { scheme: saved });
      }
      return answer(200, { scheme: saved });
    });
    await waitFor(() => expect(screen.getByTestId('scheme-current').textContent).toMatch(/Trade practice/));
    expect(screen.getByTestId('scheme-next').textContent).toBe('Next: Rev B for review, Rev 0 for construction.');

    await press(screen.getByTestId('scheme-edit'));
    await press(screen.getByRole('radio', { name: /^Our own prefix and counter/ }));
    await type('scheme-prefix', 'INS-');
    await type('scheme-start', '5');
    await type('scheme-digits', '9');
    await press(screen.getByTestId('scheme-save'));
    expect(screen.getByText('Error: Digits must be at most 6')).toBeTruthy();
    expect(screen.getByTestId('scheme-preview').textContent).toBe('Fix the marked fields to see the numbers.');
    expect(calls(fetchMock, 'PUT', '/sites/3/revision-scheme')).toHaveLength(0);

    await type('scheme-digits', '3');
    expect(screen.getByTestId('scheme-preview').textContent).toBe('The team’s own: one counter for every issue, INS-005, INS-006, INS-007 …');
    await press(screen.getByTestId('scheme-save'));
    await waitFor(() => expect(screen.getByTestId('scheme-saved')).toBeTruthy());
    expect(saved).toEqual({ kind: 'counter', prefix: 'INS-', start: 5, digits: 3 });
    expect(screen.getByTestId('scheme-current').textContent).toMatch(/INS-005, INS-006/);
  });

  it('when the server refuses a field, then its message sits at that field', async () => {
    setup(<RevisionSchemePanel siteId="3" />, (url, init) => {
      if (url !== '/api/v1/sites/3/revision-scheme') return undefined;
      if (init.method === 'PUT') return answer(400, { errors: [{ code: 'VALIDATION_FAILED', message: 'Prefix is in use by another site’s series', field: 'prefix' }] });
      return answer(200, { scheme: { kind: 'counter', prefix: 'P-', start: 1, digits: 2 } });
    });
    await waitFor(() => expect(screen.getByTestId('scheme-edit')).toBeTruthy());
    await press(screen.getByTestId('scheme-edit'));
    await type('scheme-prefix', 'Q-');
    await press(screen.getByTestId('scheme-save'));
    await waitFor(() => expect(screen.getByText('Error: Prefix is in use by another site’s series')).toBeTruthy());
  });

  it('when a viewer reads the panel, then the scheme is shown and there is nothing to change', async () => {
    setup(<RevisionSchemePanel siteId="3" />, (url) => (url === '/api/v1/sites/3/revision-scheme' ? answer(200, { scheme: { kind: 'trade' } }) : undefined), 'viewer');
    await waitFor(() => expect(screen.getByTestId('scheme-current')).toBeTruthy());
    expect(screen.queryByTestId('scheme-edit')).toBeNull();
    expect(screen.getByText('Owners and engineers set the numbering.')).toBeTruthy();
  });
});

describe('"Size all" on the prepare screen', () => {
  const realFetch = globalThis.fetch;
  afterEach(() => {
    globalThis.fetch = realFetch;
  });

  const readiness = (blocked: boolean): Readiness => ({
    ready: !blocked,
    itemCount: 2,
    blockerCount: blocked ? 2 : 0,
    blockers: blocked
      ? [
          { itemId: 1, kind: 'line', tag: 'L-1', reason: 'stale', message: 'Its inputs changed since it was sized.' },
          { itemId: 2, kind: 'line', tag: 'L-2', reason: 'unsized', message: 'It has not been sized.' },
        ]
      : [],
    failingCount: 0,
    failing: [],
    inProgress: null,
    scheme: { kind: 'trade' },
    nextNumbers: { review: 'A', construction: '0' },
  });

  it('when stale and unsized items block the revision, then "Size all" starts the site’s job, shows its progress, and the blockers are asked for again when it is done', async () => {
    let sized = false;
    let polls = 0;
    const { fetchMock, client } = setup(<PrepareRevisionScreen siteId="1" />, (url, init) => {
      if (url === '/api/v1/sites/1') return answer(200, { site: { id: 1, name: 'Boiler house', designBases: {} } });
      if (url === '/api/v1/sites/1/revisions/readiness') return answer(200, { readiness: readiness(!sized) });
      if (url === '/api/v1/sites/1/sizing' && init.method === 'POST') return answer(202, { job: { id: 5, siteId: 1, status: 'running', done: 0, total: 2, error: null } });
      if (url === '/api/v1/jobs/5') {
        polls += 1;
        sized = polls >= 2;
        return answer(200, { job: { id: 5, siteId: 1, status: sized ? 'done' : 'running', done: sized ? 2 : 1, total: 2, error: null } });
      }
      return undefined;
    });
    await waitFor(() => expect(screen.getByTestId('prepare-blocked')).toBeTruthy());
    expect(screen.getByTestId('blocker-L-1').textContent).toContain('Stale');
    expect(screen.getByTestId('prepare-submit').getAttribute('aria-disabled')).toBe('true');

    await press(screen.getByTestId('size-all'));
    expect(calls(fetchMock, 'POST', '/sites/1/sizing')).toHaveLength(1);
    await waitFor(() => expect(screen.getByRole('progressbar', { name: 'Sizing progress' })).toBeTruthy());
    // While the job runs the button gives way to the progress bar (no second job).
    await waitFor(() => expect(screen.queryByTestId('size-all')).toBeNull());

    await waitFor(() => expect(screen.queryByTestId('prepare-blocked')).toBeNull(), { timeout: 5000 });
    expect(calls(fetchMock, 'GET', '/sites/1/revisions/readiness').length).toBeGreaterThanOrEqual(2);
    expect(client.getQueryData<Readiness>(revisionKeys.readiness('1'))?.ready).toBe(true);
    expect(screen.getByTestId('sizing-done')).toBeTruthy();
    expect(screen.getByTestId('prepare-submit').getAttribute('aria-disabled')).not.toBe('true');
  });

  it('when the only blockers cannot be sized, then "Size all" is not offered', async () => {
    const r = { ...readiness(true), blockerCount: 1, blockers: [{ itemId: 3, kind: 'vessel' as const, tag: 'V-1', reason: 'error' as const, message: 'There is no material "x" in the library.' }] };
    setup(<PrepareRevisionScreen siteId="1" />, (url) => {
      if (url === '/api/v1/sites/1') return answer(200, { site: { id: 1, name: 'Boiler house', designBases: {} } });
      if (url === '/api/v1/sites/1/revisions/readiness') return answer(200, { readiness: r });
      return undefined;
    });
    await waitFor(() => expect(screen.getByTestId('prepare-blocked')).toBeTruthy());
    await waitFor(() => expect(screen.queryByTestId('size-all')).toBeNull());
    expect(screen.getByTestId('prepare-blocked').textContent).toMatch(/Fix these items in the line list/);
  });
});
