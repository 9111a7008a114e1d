export { ShopUnavailable } from '@loomwright/shared/ui';
