export { signOut, useSignOut } from '@loomwright/shared/ui';
