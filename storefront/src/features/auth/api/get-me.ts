export { authKeys, getMe, meQueryOptions, switchPerson, useMe } from '@loomwright/shared/ui';
