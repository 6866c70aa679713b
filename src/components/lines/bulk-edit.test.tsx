import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, fireEvent, render, screen, waitFor } from '@testing-library/react';

import { BulkEdit } from './bulk-edit';

const answer = (status: number, body: unknown) =>
  Promise.resolve({ ok: status < 300, status, headers: { get: () => null }, text: async () => JSON.stringify(body) } as unknown as Response);

const materials = [{ value: 'mineral-fibre-pipe-c547-type-ii', label: 'Mineral-fibre pipe insulation' }];
const finishes = [{ value: 'aluminium-oxidised', label: 'Aluminium jacket, oxidised' }];

function setup(fetchMock: jest.Mock) {
  globalThis.fetch = fetchMock as unknown as typeof fetch;
  const onDone = jest.fn();
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <BulkEdit siteId={4} kind="line" ids={[11, 12]} system="US" materials={materials} finishes={finishes} onDone={onDone} onCancel={jest.fn()} />
    </QueryClientProvider>,
  );
  const press = async (el: HTMLElement) => {
    await act(async () => {
      fireEvent.click(el);
    });
  };
  return { onDone, press };
}

describe('BulkEdit', () => {
  const realFetch = globalThis.fetch;
  afterEach(() => {
    globalThis.fetch = realFetch;
  });

  it('when purposes and a build-up are applied, then one request carries the selection and both, in SI', async () => {
    const fetchMock = jest.fn(() => answer(200, { updated: 2, unchanged: 0 }));
    const { onDone, press } = setup(fetchMock);
    await press(screen.getByTestId('bulk-set-purposes'));
    await press(screen.getByTestId('bulk-purpose-heatConservation'));
    await press(screen.getByRole('radio', { name: 'This build-up' }));
    await press(screen.getByRole('radio', { name: 'Existing insulation: check only' }));
    await act(async () => {
      fireEvent.change(screen.getByTestId('bulk-buildup-layer-0-thickness'), { target: { value: '2' } });
    });
    await press(screen.getByTestId('bulk-apply'));
    await waitFor(() => expect(onDone).toHaveBeenCalledTimes(1));
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe('/api/v1/sites/4/lines/bulk');
    expect(JSON.parse(init.body as string)).toEqual({
      ids: [11, 12],
      purposes: ['personnelProtection', 'heatConservation'],
      buildUp: { layers: [{ materialId: 'mineral-fibre-pipe-c547-type-ii', thicknessM: 0.0508 }], finishId: 'aluminium-oxidised', fixed: true },
    });
    expect(onDone.mock.calls[0][0]).toMatch(/^2 lines changed, 0 already so/);
  });

  it('when nothing is chosen, then nothing is sent and the form says what is missing', async () => {
    const fetchMock = jest.fn(() => answer(200, {}));
    const { press } = setup(fetchMock);
    await press(screen.getByTestId('bulk-apply'));
    expect(screen.getByText('Choose purposes or a build-up to apply.')).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });
});
