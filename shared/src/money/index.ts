export * from './firm-quote';
export * from './money-facts';
