import { useRouter, type Href } from 'expo-router';
import { useCallback } from 'react';

/** After a save: back to where the form was opened from (the hive or apiary page), or to `fallback`. */
export function useLeaveAfterSave(fallback: Href): () => void {
  const router = useRouter();
  return useCallback(() => {
    if (router.canGoBack()) router.back();
    else router.replace(fallback);
  }, [router, fallback]);
}
