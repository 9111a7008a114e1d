import type { ReactNode } from 'react';
import type { Catalog, RigConfiguration } from '@loomwright/shared';
import type { ConfigurationUpdate } from '../../hooks/use-configuration';
import type { LiveEstimate } from '../../hooks/use-live-estimate';
import type { StepId } from '../../lib/steps';

export interface StepProps {
  catalog: Catalog;
  configuration: RigConfiguration;
  update: (change: ConfigurationUpdate) => void;
  live: LiveEstimate;
  goToStep: (step: StepId) => void;
  /** A step with a form registers a check that runs before Next; false keeps the player on it. */
  setLeaveGuard: (guard: (() => Promise<boolean>) | null) => void;
  /** What the page around the configurator offers for keeping a configuration (save, share, e-mail), shown on Review. */
  keep?: KeepSlot;
}

export type KeepSlot = (configuration: RigConfiguration, ready: boolean) => ReactNode;
