export { signIn, useSignIn } from '@loomwright/shared/ui';
