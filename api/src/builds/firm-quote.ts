// The firm quote's arithmetic lives with the other money facts in the shared package.
export { firmQuoteFigures, type FirmQuoteFigures } from '@loomwright/shared';
