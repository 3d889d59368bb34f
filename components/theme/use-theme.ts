import { createContext, useContext } from 'react';
import { tokens, type Tokens } from './tokens';

/**
 * The active theme. Only the light wax-and-ash theme exists today (outdoor use favours a light
 * page); the context is here so a later high-contrast or dark theme changes one provider, not
 * every component.
 */
export const ThemeContext = createContext<Tokens>(tokens);

export function useTheme(): Tokens {
  return useContext(ThemeContext);
}
