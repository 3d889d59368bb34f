import { QueryClient } from '@tanstack/react-query';
import { ApiError } from './client';

/** Errors a retry cannot fix: the server has answered and said no. */
function isFinal(error: unknown): boolean {
  return error instanceof ApiError && error.status >= 400 && error.status < 500;
}

export function createQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        retry: (failures, error) => !isFinal(error) && failures < 2,
        // A keeper switching back from the camera should not trigger a refetch storm.
        refetchOnWindowFocus: false,
      },
      mutations: { retry: false },
    },
  });
}
