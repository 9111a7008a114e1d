import type { RigConfiguration } from '@loomwright/shared';

/**
 * The configurator keeps an unsaved draft in this browser, so a closed tab does not lose a rig.
 * Whoever saves the configuration to the player's account (the request page) calls
 * clearConfigurationDraft() once the booking exists.
 */
const DRAFT_KEY = 'lw-configurator-draft';

export interface ConfigurationDraft {
  configuration: Partial<RigConfiguration>;
  savedAt: string;
}

export function readConfigurationDraft(): ConfigurationDraft | undefined {
  try {
    const raw = window.localStorage.getItem(DRAFT_KEY);
    if (!raw) return undefined;
    const draft = JSON.parse(raw) as ConfigurationDraft;
    return draft && typeof draft.configuration === 'object' ? draft : undefined;
  } catch {
    return undefined;
  }
}

export function writeConfigurationDraft(configuration: Partial<RigConfiguration>): void {
  try {
    const draft: ConfigurationDraft = { configuration, savedAt: new Date().toISOString() };
    window.localStorage.setItem(DRAFT_KEY, JSON.stringify(draft));
  } catch {
    // Private windows and full storage refuse writes; the URL still holds the configuration.
  }
}

export function clearConfigurationDraft(): void {
  try {
    window.localStorage.removeItem(DRAFT_KEY);
  } catch {
    // nothing stored, nothing to clear
  }
}
