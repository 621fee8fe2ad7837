import { createSystem, defaultConfig, defineConfig } from '@chakra-ui/react';

/**
 * Skyhours' own design system. Components take their colours from semantic tokens (`bg`, `fg`,
 * `brand.solid`, `blocker.fg` …) so that light and dark mode come from one definition here.
 *
 * Palettes usable as `colorPalette`: `brand` (the night-sky blue), `gray` (a cool neutral),
 * and the four signal palettes `blocker`, `warning`, `note`, `success`. A signal colour never
 * carries meaning alone: pair it with an icon and words (see components/ui/status-indicator).
 */

type Shade = '50' | '100' | '200' | '300' | '400' | '500' | '600' | '700' | '800' | '900' | '950';
type Scale = Record<Shade, { value: string }>;

const scale = (values: Record<Shade, string>): Scale =>
  Object.fromEntries(Object.entries(values).map(([shade, value]) => [shade, { value }])) as Scale;

/** The keys every Chakra recipe reads from `colorPalette.*`. */
interface PaletteRoles {
  solid: string;
  contrast: string;
  fg: string;
  subtle: string;
  muted: string;
  emphasized: string;
  focusRing: string;
  border: string;
}

const palette = (light: PaletteRoles, dark: PaletteRoles) =>
  Object.fromEntries(
    (Object.keys(light) as (keyof PaletteRoles)[]).map((role) => [
      role,
      { value: { _light: light[role], _dark: dark[role] } },
    ]),
  );

/** A palette built from a token scale, the way Chakra's own palettes are. */
const scalePalette = (name: string, solidDark: Shade, contrastDark: string) =>
  palette(
    {
      solid: `{colors.${name}.600}`,
      contrast: '{colors.white}',
      fg: `{colors.${name}.700}`,
      subtle: `{colors.${name}.50}`,
      muted: `{colors.${name}.100}`,
      emphasized: `{colors.${name}.200}`,
      focusRing: `{colors.${name}.500}`,
      border: `{colors.${name}.500}`,
    },
    {
      solid: `{colors.${name}.${solidDark}}`,
      contrast: contrastDark,
      fg: `{colors.${name}.200}`,
      subtle: `{colors.${name}.950}`,
      muted: `{colors.${name}.900}`,
      emphasized: `{colors.${name}.800}`,
      focusRing: `{colors.${name}.300}`,
      border: `{colors.${name}.400}`,
    },
  );

const fallbackSans = 'system-ui, -apple-system, "Segoe UI", Roboto, Helvetica, Arial, sans-serif';
const fallbackMono =
  'ui-monospace, "SFMono-Regular", Menlo, Consolas, "Liberation Mono", monospace';

const config = defineConfig({
  globalCss: {
    // Chakra's default enables an Inter-only feature; Plex has no such variant.
    '*': { fontFeatureSettings: 'normal' },
    html: { colorPalette: 'brand' },
    body: { fontFamily: 'body', textStyle: 'md' },
    // A visible focus ring on everything that can take keyboard focus, in both modes.
    ':focus-visible': {
      outline: '2px solid',
      outlineColor: 'brand.focusRing',
      outlineOffset: '2px',
    },
  },
  theme: {
    keyframes: {
      'skyhours-progress': {
        from: { transform: 'translateX(-100%)' },
        to: { transform: 'translateX(250%)' },
      },
    },
    tokens: {
      colors: {
        // Night-sky blue, from the first light after dusk (50) to deep night (950).
        brand: scale({
          50: '#eef2fa',
          100: '#dce4f4',
          200: '#bac9e8',
          300: '#8fa6d6',
          400: '#6482c0',
          500: '#4565a8',
          600: '#344f8c',
          700: '#2a3f71',
          800: '#213259',
          900: '#182542',
          950: '#0f172c',
        }),
        // A cool neutral that sits with the brand; it replaces Chakra's gray everywhere.
        gray: scale({
          50: '#f6f7f9',
          100: '#eceef2',
          200: '#dadee6',
          300: '#bcc3cf',
          400: '#8f98a8',
          500: '#6b7485',
          600: '#535b6a',
          700: '#3f4653',
          800: '#2a303b',
          900: '#1a1f28',
          950: '#0f131a',
        }),
      },
      fonts: {
        heading: { value: `"IBM Plex Sans", ${fallbackSans}` },
        body: { value: `"IBM Plex Sans", ${fallbackSans}` },
        mono: { value: `"IBM Plex Mono", ${fallbackMono}` },
      },
      // A minor-third scale (×1.2) from a 16 px body size.
      fontSizes: {
        xs: { value: '0.75rem' },
        sm: { value: '0.875rem' },
        md: { value: '1rem' },
        lg: { value: '1.2rem' },
        xl: { value: '1.44rem' },
        '2xl': { value: '1.728rem' },
        '3xl': { value: '2.074rem' },
        '4xl': { value: '2.488rem' },
      },
      fontWeights: {
        normal: { value: '400' },
        medium: { value: '500' },
        semibold: { value: '600' },
        bold: { value: '700' },
      },
    },
    semanticTokens: {
      colors: {
        bg: {
          DEFAULT: { value: { _light: '{colors.white}', _dark: '{colors.gray.950}' } },
          panel: { value: { _light: '{colors.white}', _dark: '{colors.gray.900}' } },
        },
        fg: {
          DEFAULT: { value: { _light: '{colors.gray.950}', _dark: '{colors.gray.50}' } },
          // Field error text: Chakra's default red is too light on white for WCAG AA.
          error: { value: '{colors.blocker.fg}' },
        },
        brand: scalePalette('brand', '300', '{colors.brand.950}'),
        // The header is always night-sky, in either mode.
        header: {
          bg: { value: '{colors.brand.900}' },
          border: { value: '{colors.brand.800}' },
        },
        blocker: palette(
          {
            solid: '#b42318',
            contrast: '#ffffff',
            fg: '#9b1c1c',
            subtle: '#fdeceb',
            muted: '#fad3d0',
            emphasized: '#f5aaa4',
            focusRing: '#d93a30',
            border: '#e0564d',
          },
          {
            solid: '#c53030',
            contrast: '#ffffff',
            fg: '#ffa09a',
            subtle: '#3a1414',
            muted: '#552020',
            emphasized: '#702a2a',
            focusRing: '#f06b63',
            border: '#b84040',
          },
        ),
        warning: palette(
          {
            solid: '#a15c07',
            contrast: '#ffffff',
            fg: '#8a4b05',
            subtle: '#fdf3e1',
            muted: '#fae0b0',
            emphasized: '#f4c677',
            focusRing: '#d08a1a',
            border: '#d69220',
          },
          {
            solid: '#f0b34a',
            contrast: '#0f131a',
            fg: '#f5c46e',
            subtle: '#33240b',
            muted: '#4d3610',
            emphasized: '#6b4b15',
            focusRing: '#e8a73a',
            border: '#a87420',
          },
        ),
        note: palette(
          {
            solid: '#17707f',
            contrast: '#ffffff',
            fg: '#0f5e6b',
            subtle: '#e6f5f7',
            muted: '#c2e8ee',
            emphasized: '#95d5df',
            focusRing: '#2b93a3',
            border: '#3ea3b3',
          },
          {
            solid: '#3fb6c6',
            contrast: '#0f131a',
            fg: '#7fd3de',
            subtle: '#0e2b31',
            muted: '#15414a',
            emphasized: '#1d5863',
            focusRing: '#4fc0cf',
            border: '#2a8190',
          },
        ),
        success: palette(
          {
            solid: '#1d7a3e',
            contrast: '#ffffff',
            fg: '#17663a',
            subtle: '#e7f6ec',
            muted: '#c4ebd1',
            emphasized: '#94d9ac',
            focusRing: '#2f9a55',
            border: '#3aa862',
          },
          {
            solid: '#3fb26b',
            contrast: '#0f131a',
            fg: '#7fdba0',
            subtle: '#0f2b1a',
            muted: '#17402a',
            emphasized: '#1f5738',
            focusRing: '#4cc27a',
            border: '#2f8a52',
          },
        ),
      },
    },
  },
});

export const system = createSystem(defaultConfig, config);
