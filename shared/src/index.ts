export * from './api-types';
export * from './api-client';
export * from './design-tokens';
export * from './domain';
export * from './price-book/types';
export * from './estimate/types';
export * from './booking-types';
export * from './estimate/url-codec';
