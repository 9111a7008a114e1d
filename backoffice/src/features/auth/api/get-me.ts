export { authKeys, getMe, ME_RETRY_MS, meQueryOptions, switchPerson, useMe } from '@loomwright/shared/ui';
