/** Native apps have no document title; the web variant names the browser tab. */
export function useDocumentTitle(_title: string | undefined): void {}
