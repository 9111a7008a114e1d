import type { ShopSettingsView } from '@loomwright/shared';

/** What each section of the Settings page is given: the shop's settings, whether this person may change them, and where to say what was saved. */
export interface SettingsSectionProps {
  settings: ShopSettingsView;
  canEdit: boolean;
  onSaved: (message: string) => void;
}
