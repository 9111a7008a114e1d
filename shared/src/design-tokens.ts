/**
 * Loomwright's colour scales and type scale, the one place colour values are written down.
 * Each app builds its Joy UI theme from these (storefront/src/theme.ts, backoffice/src/theme.ts).
 * Contrast (WCAG 2.2 AA): white on primary.600 and accent.600 exceeds 4.5:1; text.900 on
 * neutral.50 exceeds 12:1.
 */
export const colourScales = {
  // A deep, slightly blue green, like a cable jacket.
  primary: {
    50: '#eef6f5',
    100: '#d3e8e5',
    200: '#a9d1cc',
    300: '#77b3ad',
    400: '#4a918b',
    500: '#2f7570',
    600: '#1f5a56',
    700: '#184845',
    800: '#123835',
    900: '#0b2725',
  },
  // Warm copper, kept for the one action that matters on a screen.
  accent: {
    50: '#fbf3ec',
    100: '#f4e0cf',
    200: '#e8c0a0',
    300: '#d99b6d',
    400: '#c77b45',
    500: '#b0642e',
    600: '#9a4f22',
    700: '#7d3f1b',
    800: '#5f3015',
    900: '#41210e',
  },
  // Warm greys on an off-white ground; the darkest steps are near-black brown.
  neutral: {
    50: '#faf8f5',
    100: '#f3efe9',
    200: '#e5ded4',
    300: '#cfc5b8',
    400: '#a99d8e',
    500: '#857868',
    600: '#675b4d',
    700: '#4d4338',
    800: '#352e26',
    900: '#231d17',
  },
  success: {
    50: '#eff6ef',
    100: '#d5e9d6',
    200: '#acd2ae',
    300: '#7db382',
    400: '#55935b',
    500: '#3d7a45',
    600: '#2f6337',
    700: '#264f2c',
    800: '#1c3b21',
    900: '#122716',
  },
  warning: {
    50: '#fcf6e9',
    100: '#f6e6c3',
    200: '#eccd8a',
    300: '#dcae52',
    400: '#c48f2a',
    500: '#a0720f',
    600: '#825c0b',
    700: '#664809',
    800: '#4b3507',
    900: '#312304',
  },
  danger: {
    50: '#fbefed',
    100: '#f3d5d0',
    200: '#e6aaa1',
    300: '#d57b6e',
    400: '#c25446',
    500: '#a9402f',
    600: '#8e3326',
    700: '#71281e',
    800: '#541e16',
    900: '#38140e',
  },
} as const;

export const surfaceColours = {
  body: '#f7f4ef',
  surface: '#fffdfa',
  text: '#231d17',
  textSecondary: '#5a4f43',
} as const;

/** A small type scale: 14 / 16 / 20 / 28 / 40 px. */
export const typeScale = {
  xs: '0.8125rem',
  sm: '0.875rem',
  md: '1rem',
  lg: '1.25rem',
  xl: '1.25rem',
  xl2: '1.75rem',
  xl3: '2.5rem',
  xl4: '2.5rem',
} as const;

export const fontFamily = '"Manrope", "Helvetica Neue", Arial, sans-serif';
