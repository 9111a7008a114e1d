import { createApiClient } from '@loomwright/shared';

/** The storefront's one way to reach the API (same origin, session in an httpOnly cookie). */
export const api = createApiClient('/api');
