export * from './api-types';
export * from './api-client';
export * from './design-tokens';
