/** Native apps carry their shell; only the web build registers a service worker. */
export function registerServiceWorker(): void {}
