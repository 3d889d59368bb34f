import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { MeDto, SignInInput, SignUpInput, UserDto } from '@/shared/schemas/auth';
import { cacheLife } from './cache';
import { ApiError, apiFetch } from './client';

/** Key root for the session. */
export const meKey = ['me'] as const;

/** The signed-in person and their memberships, or null when signed out (the API answers 401). */
export async function fetchMe(): Promise<MeDto | null> {
  try {
    return await apiFetch<MeDto>('/api/me');
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export function useMeQuery() {
  return useQuery({ queryKey: meKey, queryFn: fetchMe, ...cacheLife.session });
}

export function useSignInMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => apiFetch<{ user: UserDto }>('/api/auth/sign-in', { method: 'POST', body: input }),
    // A different person may have signed in on this device: drop everything cached before.
    onSuccess: async () => {
      qc.removeQueries();
      await qc.fetchQuery({ queryKey: meKey, queryFn: fetchMe, ...cacheLife.session });
    },
  });
}

export function useSignUpMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: SignUpInput) => apiFetch<{ user: UserDto }>('/api/auth/sign-up', { method: 'POST', body: input }),
    onSuccess: async () => {
      qc.removeQueries();
      await qc.fetchQuery({ queryKey: meKey, queryFn: fetchMe, ...cacheLife.session });
    },
  });
}

export function useSignOutMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => {
      // Signing out clears this device, and with it the records waiting to be sent: refuse until
      // they are sent or discarded (the offline queue in the app shell lists them).
      const waiting = qc
        .getMutationCache()
        .getAll()
        .filter((m) => {
          if (m.options.mutationKey?.[0] !== 'records' || m.options.mutationKey?.[1] !== 'create') return false;
          return m.state.status === 'pending' || (m.state.status === 'error' && (m.state.variables as { queued?: boolean } | undefined)?.queued === true);
        }).length;
      if (waiting > 0) {
        const what = waiting === 1 ? '1 record is' : `${waiting} records are`;
        return Promise.reject(new ApiError(0, 'records_waiting', `${what} still waiting on this device. Send or discard them before signing out.`));
      }
      return apiFetch<void>('/api/auth/sign-out', { method: 'POST' });
    },
    // Runs offline too, so the keeper hears why instead of waiting on a paused request.
    networkMode: 'always',
    // Nothing of the last person's apiaries may linger on a shared device. Only on success:
    // a failed request leaves the session cookie alive, so the screen must not pretend otherwise.
    onSuccess: () => {
      qc.clear();
    },
  });
}
