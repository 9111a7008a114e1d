import { SetMetadata } from '@nestjs/common';

export const IS_PUBLIC_KEY = 'isPublic';

/** Opens a route to anyone. Every route is closed by the global auth guard until marked so. */
export const Public = () => SetMetadata(IS_PUBLIC_KEY, true);
