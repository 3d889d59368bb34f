import { Slot } from 'expo-router';

/**
 * Web: only the current screen is in the page. The web stack keeps every earlier screen in the
 * DOM (display: none), so the same test id — and the same heading for a screen reader's
 * element list — would appear twice after going back and forth. The browser's own history
 * does the stacking.
 */
export function RouteStack() {
  return <Slot />;
}
