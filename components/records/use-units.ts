import { useCallback, useState } from 'react';
import { readLocal, writeLocal } from './local-store';

/** How amounts are shown: litres and kilograms, or US gallons and pounds. Stored amounts are always L / kg. */
export const UNIT_SYSTEMS = ['metric', 'us'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

const KEY = 'frameside:units';

export function readUnits(): UnitSystem {
  const v = readLocal(KEY);
  return v === 'us' ? 'us' : 'metric';
}

/** The keeper's units, remembered on this device. */
export function useUnits(): [UnitSystem, (u: UnitSystem) => void] {
  const [units, setUnits] = useState<UnitSystem>(readUnits);
  const set = useCallback((u: UnitSystem) => {
    writeLocal(KEY, u);
    setUnits(u);
  }, []);
  return [units, set];
}
