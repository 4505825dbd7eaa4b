import { useState, type Dispatch, type ReactNode, type SetStateAction } from 'react';
import type { BenchProfile } from '../../../../shared/schemas/bench-profiles';
import type { LoadConfiguration } from '../../../../shared/schemas/load-configurations';
import { BenchProfileDialog } from './bench-profile-dialog';
import { LoadConfigurationDialog } from './load-configuration-dialog';

export interface PlanDialogs {
  /** What was made here so far; the lists from the server catch up on their next read. */
  madeProfiles: BenchProfile[];
  madeConfigurations: LoadConfiguration[];
  newProfile: () => void;
  newConfiguration: () => void;
  /** The two dialogs, rendered once by the plan. */
  dialogs: ReactNode;
}

/** Making a bench profile or a load configuration from within a plan, and taking it into the plan at once. */
export function usePlanDialogs({
  onProfile,
  onConfiguration,
}: {
  onProfile: (profile: BenchProfile) => void;
  onConfiguration: (configuration: LoadConfiguration) => void;
}): PlanDialogs {
  const [madeProfiles, setMadeProfiles] = useState<BenchProfile[]>([]);
  const [madeConfigurations, setMadeConfigurations] = useState<LoadConfiguration[]>([]);
  const [open, setOpen] = useState<'profile' | 'configuration' | null>(null);
  const close = () => setOpen(null);
  /** Keeps what a dialog made, hands it to the plan and closes the dialog. */
  const take =
    <T,>(keep: Dispatch<SetStateAction<T[]>>, use: (made: T) => void) =>
    (made: T) => {
      keep((current) => [...current, made]);
      use(made);
      close();
    };
  const dialogs = (
    <>
      <BenchProfileDialog open={open === 'profile'} onClose={close} onCreated={take(setMadeProfiles, onProfile)} />
      <LoadConfigurationDialog
        open={open === 'configuration'}
        onClose={close}
        onCreated={take(setMadeConfigurations, onConfiguration)}
      />
    </>
  );
  return {
    madeProfiles,
    madeConfigurations,
    newProfile: () => setOpen('profile'),
    newConfiguration: () => setOpen('configuration'),
    dialogs,
  };
}

/** The lists joined, each id once (its first appearance kept). */
export function uniqueById<T extends { id: number }>(...lists: readonly (readonly T[])[]): T[] {
  const seen = new Set<number>();
  return lists.flat().filter((item) => !seen.has(item.id) && Boolean(seen.add(item.id)));
}
