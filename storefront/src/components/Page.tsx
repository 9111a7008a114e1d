import { useEffect, type ComponentType } from 'react';
import { documentTitle } from '@loomwright/shared/ui';
import { useShop } from 'src/features/shop/api/get-shop';

/**
 * One page of the storefront: its screen, and the browser tab named after it and the shop
 * ("My builds · <shop name>"), so a player with several tabs, a bookmark or the history list can
 * tell the pages apart and knows whose shop it is. Without a title the tab shows the shop alone.
 */
export function Page({ title, screen: Screen }: { title?: string; screen: ComponentType }) {
  const shop = useShop();
  const tab = documentTitle(title, shop.data?.name);
  useEffect(() => {
    document.title = tab;
  }, [tab]);
  return <Screen />;
}
