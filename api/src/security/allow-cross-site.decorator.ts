import { SetMetadata } from '@nestjs/common';

export const ALLOW_CROSS_SITE = 'loomwright:allowCrossSite';

/**
 * Lets another site's server call this route (the Origin check is skipped; the content type is
 * still checked). Only for a route that proves who is calling by itself, such as the payment
 * provider's webhook, whose body is signed: a cookie is never what lets such a call through.
 */
export const AllowCrossSite = () => SetMetadata(ALLOW_CROSS_SITE, true);
