import { useTheme } from '@mui/joy/styles';
import useMediaQuery from '@mui/system/useMediaQuery';

/**
 * True from the theme's `sm` breakpoint (600 px) up: wide enough for a table of several columns.
 * Below it, lists show as cards so a phone at 390 px never clips a column. Where the browser
 * cannot tell (tests without matchMedia) the wide layout is assumed.
 */
export function useWideScreen(): boolean {
  const theme = useTheme();
  return useMediaQuery(theme.breakpoints.up('sm'), { defaultMatches: true, noSsr: true });
}
