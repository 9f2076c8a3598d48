import { createContext, useContext, type ReactNode } from 'react';
import { useWindowDimensions } from 'react-native';
import { layoutForWidth, theme, type Layout, type Theme } from './theme';

const ThemeContext = createContext<Theme>(theme);

export function ThemeProvider({ children }: { children: ReactNode }) {
  return <ThemeContext.Provider value={theme}>{children}</ThemeContext.Provider>;
}

export function useTheme(): Theme {
  return useContext(ThemeContext);
}

/** The layout for the current window width; re-renders when the window crosses a breakpoint. */
export function useLayout(): Layout {
  return layoutForWidth(useWindowDimensions().width);
}
