export * from './firm-quote';
export * from './money-facts';
export {
  currencyUnit,
  toProviderAmount,
  fromProviderAmount,
  PROVIDER_ZERO_DECIMAL,
  PROVIDER_THREE_DECIMAL,
  PROVIDER_WHOLE_UNITS_IN_HUNDREDTHS,
  type CurrencyUnit,
} from './minor-units';
export * from './money-account';
