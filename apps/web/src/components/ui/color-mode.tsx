import { IconButton, type IconButtonProps } from '@chakra-ui/react';
import { Moon, Sun } from 'lucide-react';
import {
  createContext,
  useCallback,
  useContext,
  useEffect,
  useMemo,
  useState,
  type ReactNode,
} from 'react';

export type ColorMode = 'light' | 'dark';

const STORAGE_KEY = 'skyhours-color-mode';
const DARK_QUERY = '(prefers-color-scheme: dark)';

function storedMode(): ColorMode | null {
  try {
    const value = window.localStorage.getItem(STORAGE_KEY);
    return value === 'light' || value === 'dark' ? value : null;
  } catch {
    return null; // storage can be blocked; the system preference still applies
  }
}

const systemMode = (): ColorMode => (window.matchMedia?.(DARK_QUERY).matches ? 'dark' : 'light');

/** Chakra's `_dark` styles follow a `dark` class on the root element. */
export function applyColorMode(mode: ColorMode): void {
  const root = document.documentElement;
  root.classList.toggle('dark', mode === 'dark');
  root.classList.toggle('light', mode === 'light');
  root.style.colorScheme = mode;
}

/** The mode to paint first: the user's last choice, else their system's. */
export const initialColorMode = (): ColorMode => storedMode() ?? systemMode();

interface ColorModeContextValue {
  colorMode: ColorMode;
  setColorMode: (mode: ColorMode) => void;
  toggleColorMode: () => void;
}

const ColorModeContext = createContext<ColorModeContextValue | null>(null);

/**
 * Light and dark mode. Follows the system until the user picks one with the toggle; the pick is
 * remembered in this browser.
 */
export function ColorModeProvider({ children }: { children: ReactNode }) {
  const [colorMode, setMode] = useState<ColorMode>(initialColorMode);
  const [chosen, setChosen] = useState(() => storedMode() !== null);

  useEffect(() => applyColorMode(colorMode), [colorMode]);

  useEffect(() => {
    if (chosen || !window.matchMedia) return;
    const query = window.matchMedia(DARK_QUERY);
    const follow = () => setMode(query.matches ? 'dark' : 'light');
    query.addEventListener('change', follow);
    return () => query.removeEventListener('change', follow);
  }, [chosen]);

  const setColorMode = useCallback((mode: ColorMode) => {
    setMode(mode);
    setChosen(true);
    try {
      window.localStorage.setItem(STORAGE_KEY, mode);
    } catch {
      // not remembered, but still applied for this visit
    }
  }, []);

  const value = useMemo(
    () => ({
      colorMode,
      setColorMode,
      toggleColorMode: () => setColorMode(colorMode === 'dark' ? 'light' : 'dark'),
    }),
    [colorMode, setColorMode],
  );

  return <ColorModeContext.Provider value={value}>{children}</ColorModeContext.Provider>;
}

export function useColorMode(): ColorModeContextValue {
  const context = useContext(ColorModeContext);
  if (!context) throw new Error('useColorMode needs a ColorModeProvider above it.');
  return context;
}

/** The header's switch between light and dark; says which mode a press will give. */
export function ColorModeButton(props: Omit<IconButtonProps, 'aria-label' | 'onClick'>) {
  const { colorMode, toggleColorMode } = useColorMode();
  const next = colorMode === 'dark' ? 'light' : 'dark';
  return (
    <IconButton
      variant="ghost"
      size="sm"
      aria-label={`Switch to ${next} mode`}
      title={`Switch to ${next} mode`}
      onClick={toggleColorMode}
      {...props}
    >
      {colorMode === 'dark' ? <Sun aria-hidden /> : <Moon aria-hidden />}
    </IconButton>
  );
}
