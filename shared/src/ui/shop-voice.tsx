import { createContext, useContext, useMemo, type ReactNode } from 'react';
import type { ShopProfile } from '../api-types';
import type { ShopVoice } from '../format/shop-format';

/**
 * The shop's voice for a whole app: once `GET /api/shop` has answered, every amount, date and time
 * on every page is written by `shopFormat` with the shop's locale, currency and time zone.
 *
 * This module holds only the settings (it is in every page's first load); the formatter itself is
 * built in `current-shop-format.ts`, loaded with the first page that writes a figure. The apps'
 * `src/lib/format.ts` helpers read `currentShopFormat()`, which follows the voice the provider set
 * before its children render; the children are keyed by the voice, so a change of settings
 * re-renders every page in the new voice.
 */
let current: ShopVoice | undefined;

export function currentShopVoice(): ShopVoice | undefined {
  return current;
}

const ShopVoiceContext = createContext<ShopVoice | undefined>(undefined);

export function ShopVoiceProvider({ profile, children }: { profile: ShopProfile | undefined; children: ReactNode }) {
  const voice = useMemo(
    () => (profile ? { locale: profile.locale, currency: profile.currency, timeZone: profile.timezone } : undefined),
    [profile],
  );
  current = voice;
  const key = voice ? `${voice.locale}|${voice.currency}|${voice.timeZone}` : 'default';
  return (
    <ShopVoiceContext.Provider value={voice} key={key}>
      {children}
    </ShopVoiceContext.Provider>
  );
}

export function useShopVoice(): ShopVoice | undefined {
  return useContext(ShopVoiceContext);
}
