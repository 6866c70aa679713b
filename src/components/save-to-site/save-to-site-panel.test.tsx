import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, waitFor } from '@testing-library/react';

import { FINISHES, INSULATION_MATERIALS } from '../../../shared/calc/library';
import { libraryKeys } from '../../api/library';
import { sessionKeys } from '../../api/session';
import { siteKeys } from '../../api/sites';
import type { LibraryPayload, Role } from '../../api/types';
import { defaultDraft, type Draft } from '../../calc/quick-case';
import { jsonAnswer as answer, pick, press, sessionOf, type } from '../common/testing';

import { SaveToSite } from './save-to-site-panel';

jest.mock('expo-router', () => ({
  Link: ({ href, children, testID }: { href: string; children: string; testID?: string }) => (
    <a href={href} data-testid={testID}>
      {children}
    </a>
  ),
}));

const library: LibraryPayload = {
  materials: INSULATION_MATERIALS.map((m) => ({ ...m, origin: 'builtIn' })) as unknown as LibraryPayload['materials'],
  finishes: FINISHES.map((f) => ({ ...f, origin: 'builtIn' })) as unknown as LibraryPayload['finishes'],
  teamMaterials: [
    { id: 3, materialId: 'team-material-3', name: 'Flexible aerogel blanket', source: 'Invented datasheet', minServiceTemperatureC: -50, maxServiceTemperatureC: 650 },
  ] as unknown as LibraryPayload['teamMaterials'],
  teamFinishes: [],
};

function setup(opts: { role?: Role | null; draft?: Partial<Draft>; fetchMock?: jest.Mock } = {}) {
  const fetchMock = opts.fetchMock ?? jest.fn(() => answer(500, {}));
  globalThis.fetch = fetchMock as unknown as typeof fetch;
  const client = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity }, mutations: { retry: false } } });
  client.setQueryData(sessionKeys.current(), sessionOf(opts.role === undefined ? 'engineer' : opts.role));
  client.setQueryData(siteKeys.list(), [
    { id: 4, name: 'Boiler house' },
    { id: 5, name: 'Tank farm' },
  ]);
  client.setQueryData(libraryKeys.detail(), library);
  const draft = { ...defaultDraft(), ...opts.draft };
  render(
    <QueryClientProvider client={client}>
      <SaveToSite draft={draft} system="SI" calculable />
    </QueryClientProvider>,
  );
  return { fetchMock };
}


/** Every request that would write, whatever its path. */
const posts = (fetchMock: jest.Mock) => fetchMock.mock.calls.filter((c) => (c[1] as RequestInit | undefined)?.method === 'POST');

describe('SaveToSite', () => {
  const realFetch = globalThis.fetch;
  afterEach(() => {
    globalThis.fetch = realFetch;
  });

  it('when nobody is signed in, then the action is disabled and says to sign in', () => {
    setup({ role: null });
    expect(screen.getByTestId('qs-save-to-site').getAttribute('aria-disabled')).toBe('true');
    expect(screen.getByTestId('qs-save-note').textContent).toBe('Sign in to save this to a site');
  });

  it('when the member may not edit line lists, then the action is disabled and says who may', () => {
    setup({ role: 'viewer' });
    expect(screen.getByTestId('qs-save-to-site').getAttribute('aria-disabled')).toBe('true');
    expect(screen.getByTestId('qs-save-note').textContent).toMatch(/Owners and engineers/);
  });

  it('when the case is a wall, then the action is not offered, with the reason', () => {
    setup({ draft: { kind: 'wall' } });
    expect(screen.getByTestId('qs-save-to-site').getAttribute('aria-disabled')).toBe('true');
    expect(screen.getByTestId('qs-save-note').textContent).toMatch(/not a line-list item/);
  });

  it('when an engineer saves a pipe, then one request creates the line in the chosen site, a taken tag shows at the tag, and the saved line is linked', async () => {
    const fetchMock = jest
      .fn()
      .mockImplementationOnce(() => answer(409, { errors: [{ code: 'TAG_TAKEN', message: 'The site already has a line tagged "QS-1".', field: 'tag' }] }))
      .mockImplementationOnce(() => answer(201, { line: { id: 77, tag: 'QS-2', siteId: 4 } }));
    setup({ fetchMock });
    await press(screen.getByTestId('qs-save-to-site'));
    expect(screen.getByTestId('qs-save-indoor').textContent).toMatch(/indoor/);
    expect(screen.getByTestId('qs-save-summary').textContent).toMatch(/Line NPS 4, horizontal/);
    expect(screen.getByTestId('qs-save-summary').textContent).toMatch(/Your surface limit of 55.0 °C: the site’s touch-safety basis sets it/);

    // Nothing is sent while the site, tag and length are missing; each says so at its field.
    await press(screen.getByTestId('qs-save-submit'));
    expect(screen.getByText('Error: Choose the site to save it to')).toBeTruthy();
    expect(screen.getByText('Error: Tag is required')).toBeTruthy();
    expect(screen.getByText(/Error: Give the line’s length/)).toBeTruthy();
    expect(posts(fetchMock)).toHaveLength(0);

    await pick('qs-save-site', '4');
    await type('qs-save-tag', 'QS-1');
    await type('qs-save-length', '80');
    await press(screen.getByTestId('qs-save-submit'));
    await waitFor(() => expect(screen.getByText('Error: The site already has a line tagged "QS-1".')).toBeTruthy());
    const [url, init] = posts(fetchMock)[0] as [string, RequestInit];
    expect(url).toBe('/api/v1/sites/4/lines');
    expect(JSON.parse(String(init.body))).toEqual({
      tag: 'QS-1',
      nps: '4',
      orientation: 'horizontal',
      lengthM: 80,
      operatingTemperatureC: 180,
      location: 'indoor',
      purposes: ['personnelProtection'],
      buildUp: { layers: [{ materialId: 'mineral-fibre-pipe-c547-type-i' }], finishId: 'aluminium-oxidised' },
      notes: 'Saved from quick sizing.',
    });

    await type('qs-save-tag', 'QS-2');
    await press(screen.getByTestId('qs-save-submit'));
    await waitFor(() => expect(screen.getByTestId('qs-saved')).toBeTruthy());
    expect(screen.getByTestId('qs-saved-open').getAttribute('href')).toBe('/lines/77');
    expect(screen.getByTestId('qs-saved-list').getAttribute('href')).toBe('/sites/4/lines');
    expect(posts(fetchMock)).toHaveLength(2);
  });

  it('when a layer has a custom k(T) and the case has wind, then saving waits for a stand-in material and a location', async () => {
    const calsil = INSULATION_MATERIALS.find((m) => m.id === 'calcium-silicate-c533-type-i')!;
    const fetchMock = jest.fn(() => answer(201, { line: { id: 8, tag: 'QS-3', siteId: 5 } }));
    setup({
      fetchMock,
      draft: { windSpeedMS: 3, processTemperatureC: 300, layers: [{ materialId: 'custom', conductivity: [...calsil.conductivity], maxServiceTemperatureC: 500, thicknessM: 0.05 }] },
    });
    await press(screen.getByTestId('qs-save-to-site'));
    await pick('qs-save-site', '5');
    await type('qs-save-tag', 'QS-3');
    await type('qs-save-length', '40');
    await press(screen.getByTestId('qs-save-submit'));
    expect(screen.getByText(/Error: Layer 1 has a custom k\(T\)/)).toBeTruthy();
    expect(screen.getByText(/Error: The case has wind/)).toBeTruthy();
    expect(posts(fetchMock)).toHaveLength(0);

    // The nearest library material is offered; a team material may stand in as well.
    expect(screen.getByTestId('qs-save-layer-0-nearest').textContent).toContain(calsil.name);
    await pick('qs-save-layer-0-material', 'team-material-3');
    await press(screen.getByRole('radio', { name: /^Outdoor/ }));
    await press(screen.getByTestId('qs-save-submit'));
    await waitFor(() => expect(screen.getByTestId('qs-saved')).toBeTruthy());
    const body = JSON.parse(String((posts(fetchMock)[0] as [string, RequestInit])[1].body));
    expect(body).toMatchObject({ location: 'outdoor', buildUp: { layers: [{ materialId: 'team-material-3' }] } });
  });
});
