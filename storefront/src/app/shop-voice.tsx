import { PageLoading, ShopVoiceProvider } from '@loomwright/shared/ui';
import { useDeferredValue, type ReactNode } from 'react';
import { useShop } from 'src/features/shop/api/get-shop';

/**
 * Waits for the shop's settings (one small request), then speaks in its locale, currency and time
 * zone everywhere below (a page's screen: `Page` puts it there; the layout around it does not wait). If the shop cannot be read (the API is down), pages still render in the
 * default voice and show their own "back shortly" notes.
 */
export function ShopVoice({ children, fallback = <PageLoading /> }: { children: ReactNode; fallback?: ReactNode }) {
  const { shop, waiting } = useShopVoiceWaiting();
  if (waiting) return fallback;
  return <ShopVoiceProvider profile={shop.data}>{children}</ShopVoiceProvider>;
}

/**
 * The shop's settings, and whether figures must still wait for them. Only the first answer is awaited:
 * while the API is failing, pages render (and say so) in the default voice. The answer's own render (a
 * query update, which React draws in one blocking task) keeps the wait; what depends on the voice is then
 * drawn in a deferred render that yields to the browser every few ms.
 */
export function useShopVoiceWaiting() {
  const shop = useShop();
  const waiting = useDeferredValue(shop.isPending && shop.failureCount === 0);
  return { shop, waiting };
}
