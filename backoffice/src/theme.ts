import { createLoomwrightTheme } from '@loomwright/shared/joy-theme';

/** The backoffice's one theme object. */
export const theme = createLoomwrightTheme();
