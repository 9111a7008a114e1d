export { createQueryClient } from '@loomwright/shared/ui';
