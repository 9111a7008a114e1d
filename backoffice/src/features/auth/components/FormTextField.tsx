export { FormTextField } from '@loomwright/shared/ui';
