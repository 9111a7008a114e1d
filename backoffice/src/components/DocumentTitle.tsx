import { useRouteTitle } from '@loomwright/shared/ui';
import { Outlet } from 'react-router';
import { useShop } from 'src/features/shop/api/get-shop';

/** The root of every backoffice page, signed in or not: keeps the tab titled "Page · Shop · Backoffice". */
export function DocumentTitle() {
  const shop = useShop();
  useRouteTitle(shop.data?.name, 'Backoffice');
  return <Outlet />;
}
