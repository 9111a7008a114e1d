/** The estimate engine and rig checks, in one import for the API and both apps. */
export { estimateRig, depositFor } from './estimate-rig';
export { estimateView, hasCableLists, type EstimatePanel, type PanelChecks } from './estimate-view';
export { EstimateInputError } from './errors';
export { minorUnitDigits, isKnownCurrency, roundToMinorUnit, formatMoney } from './money';
export * from './schema';
export * from '../price-book/schema';
export { demoPriceBook } from '../price-book/demo-price-book';
export * from '../checks/types';
export { typicalHardware, DEFAULT_VOLTAGE, BARREL_CONNECTOR } from '../checks/typical-hardware';
export { signalChainOf, listedPedals } from '../checks/signal-chain';
export { cableScheduleOf } from '../checks/cable-schedule';
export { powerBudgetOf, wattsOf, ohmsOf } from '../checks/power-budget';
export { boardFitOf, rowLayout, SPACING_MM } from '../checks/board-fit';
export { complexityOf } from '../checks/complexity';
export { DEFAULT_POWER_RULES, planPower, ownOutputReason } from '../checks/power-plan';
