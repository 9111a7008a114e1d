import { useEffect, type ComponentType } from 'react';
import { documentTitle } from '@loomwright/shared/ui';
import { ShopVoice } from 'src/app/shop-voice';
import { useShop } from 'src/features/shop/api/get-shop';

/**
 * One page of the storefront: its screen, and the browser tab named after it and the shop
 * ("My builds · <shop name>"), so a player with several tabs, a bookmark or the history list can
 * tell the pages apart and knows whose shop it is. Without a title the tab shows the shop alone.
 *
 * A screen that writes figures (`voice`, the default) waits for the shop's settings and speaks in
 * its locale, currency and time zone (`ShopVoice`); the layout around it draws at once. A screen that
 * writes none (`voice={false}`) draws without waiting, so the build's prerender holds its words.
 */
export function Page({ title, screen: Screen, voice = true }: { title?: string; screen: ComponentType; voice?: boolean }) {
  const shop = useShop();
  const tab = documentTitle(title, shop.data?.name);
  useEffect(() => {
    document.title = tab;
  }, [tab]);
  return voice ? (
    <ShopVoice>
      <Screen />
    </ShopVoice>
  ) : (
    <Screen />
  );
}
