import { extendTheme, type PaletteRange } from '@mui/joy/styles';
import { colourScales, fontFamily, surfaceColours, typeScale } from './design-tokens';

declare module '@mui/joy/styles' {
  interface ColorPalettePropOverrides {
    accent: true;
  }
  interface Palette {
    accent: PaletteRange;
  }
}

const solidOn = (scale: keyof typeof colourScales) => ({
  ...colourScales[scale],
  solidBg: `var(--joy-palette-${scale}-600)`,
  solidHoverBg: `var(--joy-palette-${scale}-700)`,
  solidActiveBg: `var(--joy-palette-${scale}-800)`,
  solidColor: '#fff',
  plainColor: `var(--joy-palette-${scale}-700)`,
  outlinedColor: `var(--joy-palette-${scale}-700)`,
  softColor: `var(--joy-palette-${scale}-800)`,
});

/**
 * Loomwright's Joy UI theme, built once from the design tokens: calm workshop colours, Manrope,
 * tabular figures for money. Imported by each app's src/theme.ts through '@loomwright/shared/joy-theme'
 * (never by the API, which has no UI).
 */
export const createLoomwrightTheme = () =>
  extendTheme({
    colorSchemes: {
      light: {
        palette: {
          primary: solidOn('primary'),
          accent: {
            ...solidOn('accent'),
            softBg: `var(--joy-palette-accent-100)`,
            outlinedBorder: `var(--joy-palette-accent-300)`,
            plainHoverBg: `var(--joy-palette-accent-100)`,
            outlinedHoverBg: `var(--joy-palette-accent-100)`,
            softHoverBg: `var(--joy-palette-accent-200)`,
            solidDisabledBg: `var(--joy-palette-neutral-200)`,
            solidDisabledColor: `var(--joy-palette-neutral-500)`,
            plainActiveBg: `var(--joy-palette-accent-200)`,
            outlinedActiveBg: `var(--joy-palette-accent-200)`,
            softActiveBg: `var(--joy-palette-accent-300)`,
            plainDisabledColor: `var(--joy-palette-neutral-400)`,
            outlinedDisabledColor: `var(--joy-palette-neutral-400)`,
            outlinedDisabledBorder: `var(--joy-palette-neutral-200)`,
            softDisabledColor: `var(--joy-palette-neutral-400)`,
            softDisabledBg: `var(--joy-palette-neutral-100)`,
          },
          neutral: { ...colourScales.neutral },
          success: solidOn('success'),
          warning: solidOn('warning'),
          danger: solidOn('danger'),
          background: { body: surfaceColours.body, surface: surfaceColours.surface },
          text: { primary: surfaceColours.text, secondary: surfaceColours.textSecondary },
        },
      },
    },
    fontFamily: { body: fontFamily, display: fontFamily },
    fontSize: typeScale,
    fontWeight: { sm: 400, md: 600, lg: 700, xl: 700 },
    radius: { xs: '4px', sm: '6px', md: '8px', lg: '12px', xl: '16px' },
    focus: {
      default: {
        outlineOffset: '2px',
        outline: `3px solid var(--joy-palette-primary-500)`,
      },
    },
    components: {
      JoyTable: {
        styleOverrides: { root: { fontVariantNumeric: 'tabular-nums' } },
      },
    },
  });
