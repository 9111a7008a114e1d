import { PageLoading, ShopVoiceProvider } from '@loomwright/shared/ui';
import type { ReactNode } from 'react';
import { useShop } from 'src/features/shop/api/get-shop';

/**
 * Waits for the shop's settings (one small request), then speaks in its locale, currency and time
 * zone everywhere below. If the shop cannot be read (the API is down), pages still render in the
 * default voice and show their own "back shortly" notes.
 */
export function ShopVoice({ children }: { children: ReactNode }) {
  const shop = useShop();
  // Only the first answer is awaited: while the API is failing, pages render (and say so) in the default voice.
  if (shop.isPending && shop.failureCount === 0) return <PageLoading />;
  return <ShopVoiceProvider profile={shop.data}>{children}</ShopVoiceProvider>;
}
