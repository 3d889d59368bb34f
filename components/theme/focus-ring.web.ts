import { colours, borderWidth } from './tokens';

const STYLE_ID = 'frameside-focus-ring';

/**
 * One :focus-visible rule for every control. react-native-web's Pressable reports `focused`
 * for mouse and touch focus too, so a JS-driven ring would flash on every tap; the browser's
 * :focus-visible shows it only for keyboard (and switch) users. The cream offset keeps the
 * ink ring visible against ink-filled buttons.
 */
export function installFocusRing(): void {
  if (typeof document === 'undefined' || document.getElementById(STYLE_ID)) return;
  const style = document.createElement('style');
  style.id = STYLE_ID;
  style.textContent = `
    :focus { outline: none; }
    :focus-visible {
      outline: ${borderWidth.thick}px solid ${colours.ink} !important;
      outline-offset: 3px !important;
      box-shadow: 0 0 0 3px ${colours.onInk};
    }
  `;
  document.head.appendChild(style);
}
