import { createContext, useContext, type ReactNode } from 'react';
import type { UnitSystem } from '#shared/schemas/account';
import { useMe } from '../session';

export type { UnitSystem };

export const unitSystemNames: Record<UnitSystem, string> = {
  si: 'SI',
  us: 'US customary',
};

const UnitSystemContext = createContext<UnitSystem>('si');

/** Shows everything below in `system` (a shared study's own switch, a report's `?units=`). */
export function UnitSystemProvider({ system, children }: { system: UnitSystem; children: ReactNode }) {
  return <UnitSystemContext value={system}>{children}</UnitSystemContext>;
}

/** The signed-in user's unit system (SI while nobody is signed in), for every page below. */
export function UserUnitSystem({ children }: { children: ReactNode }) {
  const { data } = useMe();
  return <UnitSystemProvider system={data?.user.unitSystem ?? 'si'}>{children}</UnitSystemProvider>;
}

/** The unit system the screen shows: the user's, unless a page chose another for what it holds. */
export function useUnitSystem(): UnitSystem {
  return useContext(UnitSystemContext);
}
