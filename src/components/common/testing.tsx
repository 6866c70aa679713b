/**
 * Helpers for component tests on web (@testing-library/react): a fetch answer, the session of a role, and
 * presses, typing and list choices that let Formik and TanStack Query settle inside act().
 */
import { act, fireEvent, screen } from '@testing-library/react';

import type { Role, SessionPayload } from '../../api/types';

/** What fetch resolves to for a JSON answer of this status. */
export const jsonAnswer = (status: number, body: unknown) =>
  Promise.resolve({ ok: status < 300, status, headers: { get: () => null }, text: async () => JSON.stringify(body) } as unknown as Response);

/** The session payload of a signed-in member of this role (or of a visitor, for null). */
export function sessionOf(role: Role | null): SessionPayload {
  return role
    ? { user: { id: 1, name: 'Test member', email: 'member@example.test' }, team: { id: 1, name: 'Test team' }, role, settings: { unitSystem: 'SI' }, csrfToken: 't' }
    : { user: null, team: null, role: null, settings: null, csrfToken: 't' };
}

/** Requests a fetch mock received with this method and path (under /api/v1). */
export const requestsTo = (fetchMock: jest.Mock, method: string, path: string) =>
  fetchMock.mock.calls.filter(([url, init]) => ((init as RequestInit | undefined)?.method ?? 'GET') === method && String(url) === `/api/v1${path}`);

export const press = async (el: HTMLElement) => {
  await act(async () => {
    fireEvent.click(el);
  });
};

export const type = async (testId: string, value: string) => {
  await act(async () => {
    fireEvent.change(screen.getByTestId(testId), { target: { value } });
  });
};

/** Opens a SelectField and takes one of its options. */
export const pick = async (testId: string, value: string) => {
  await press(screen.getByTestId(testId));
  await press(screen.getByTestId(`${testId}-option-${value}`));
};
