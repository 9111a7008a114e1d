import type { CableSchedule, RigChecks } from '../checks/types';
import type { EstimateResult } from './types';

/** The checks of a `panel` answer: everything but the lists only the Review step prints. */
export type PanelChecks = Omit<RigChecks, 'signalChain' | 'cableSchedule'> & {
  signalChain?: RigChecks['signalChain'];
  cableSchedule: Omit<CableSchedule, 'patches' | 'powerLeads'> & Partial<Pick<CableSchedule, 'patches' | 'powerLeads'>>;
};

/** An estimate as `POST /api/estimates?view=panel` answers it (a `full` answer is one too). */
export type EstimatePanel = Omit<EstimateResult, 'checks'> & { checks?: PanelChecks };

/** The whole answer, or the panel's share of it (see estimateQuerySchema). */
export function estimateView(result: EstimateResult, view: 'full' | 'panel'): EstimatePanel {
  if (view === 'full' || !result.checks) return result;
  const { signalChain: _chain, cableSchedule, ...checks } = result.checks;
  const { patches: _patches, powerLeads: _leads, ...counts } = cableSchedule;
  return { ...result, checks: { ...checks, cableSchedule: counts } };
}

/** True when the answer carries the per-cable lists (a `full` answer). */
export const hasCableLists = (checks: PanelChecks | undefined): checks is PanelChecks & { cableSchedule: CableSchedule } =>
  Array.isArray(checks?.cableSchedule.patches) && Array.isArray(checks?.cableSchedule.powerLeads);
