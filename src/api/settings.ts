import { useMutation, useQueryClient } from '@tanstack/react-query';

import { api } from './client';
import { sessionKeys } from './session';
import type { SessionPayload, UserSettings } from './types';

export const settingsKeys = {
  all: ['settings'] as const,
};

/** Saves the user's settings; the session payload carries them, so it is updated in place. */
export function useUpdateSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: UserSettings) => api.patch<UserSettings>('/me/settings', input),
    onSuccess: (result, input) => {
      if (result.kind !== 'ok') return;
      const saved: UserSettings = { ...input, ...(result.data ?? {}) };
      queryClient.setQueryData<SessionPayload>(sessionKeys.current(), (old) => (old ? { ...old, settings: saved } : old));
      void queryClient.invalidateQueries({ queryKey: sessionKeys.all });
      void queryClient.invalidateQueries({ queryKey: settingsKeys.all });
    },
  });
}
