/** The shop's public profile and the API's health; a settings change invalidates `all`. */
export const shopKeys = {
  all: ['shop'] as const,
  profile: () => [...shopKeys.all, 'profile'] as const,
  health: () => [...shopKeys.all, 'health'] as const,
};
