import { useEffect } from 'react';

/** Names the browser tab after the screen, so a keeper with several tabs open can tell them apart. */
export function useDocumentTitle(title: string | undefined): void {
  useEffect(() => {
    if (typeof document !== 'undefined') document.title = title ? `${title} · Frameside` : 'Frameside';
  }, [title]);
}
