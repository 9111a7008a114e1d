import { shopFormat, type ShopFormat } from '../format/shop-format';
import { currentShopVoice, useShopVoice } from './shop-voice';

/** The one formatter in the voice `ShopVoiceProvider` set (the default voice before the shop has answered). */
export function currentShopFormat(): ShopFormat {
  return shopFormat(currentShopVoice());
}

/** The same, for components that prefer a hook. */
export function useShopFormat(): ShopFormat {
  return shopFormat(useShopVoice());
}
