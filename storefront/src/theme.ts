import { createLoomwrightTheme } from '@loomwright/shared/joy-theme';

/** The storefront's one theme object. */
export const theme = createLoomwrightTheme();
