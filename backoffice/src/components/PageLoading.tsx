export { PageLoading } from '@loomwright/shared/ui';
