import { cautionsFor, type Caution } from '@lumenwright/shared';
import { createContext, useCallback, useContext, useMemo, useState } from 'react';

/** The evening minute chosen on the twilight tab, offered to the other calculations. */
export interface SceneMoment {
  latitude: number;
  longitude: number;
  /** ISO 8601 local time with offset. */
  time: string;
  timeZone: string;
  date: string;
  sky: 'clear' | 'partly-cloudy' | 'overcast';
  ev100: number;
  sunAltitudeDeg: number;
  /** Where the sun set, degrees clockwise from north (null if it did not). */
  sunsetAzimuthDeg: number | null;
}

/** What the site is like: drives the cautions every tab shows. */
export interface SiteConditions {
  windKmh?: number;
  nearRoad: boolean;
  nearWater: boolean;
  coldFogOrHaze: boolean;
  modellingLamps: boolean;
}

interface SceneValue {
  moment: SceneMoment | null;
  setMoment: (moment: SceneMoment | null) => void;
  conditions: SiteConditions;
  setConditions: (conditions: SiteConditions) => void;
  /** Cautions for a result that puts `stands` light stands on the site. */
  cautionsFor: (stands: number) => Caution[];
}

const initialConditions: SiteConditions = {
  nearRoad: false,
  nearWater: false,
  coldFogOrHaze: false,
  modellingLamps: false,
};

const SceneContext = createContext<SceneValue | null>(null);

export function PlaygroundSceneProvider({ children }: { children: React.ReactNode }) {
  const [moment, setMoment] = useState<SceneMoment | null>(null);
  const [conditions, setConditions] = useState<SiteConditions>(initialConditions);
  const cautions = useCallback(
    (stands: number) => cautionsFor({ ...conditions, standsCount: stands }),
    [conditions],
  );
  const value = useMemo(
    () => ({ moment, setMoment, conditions, setConditions, cautionsFor: cautions }),
    [moment, conditions, cautions],
  );
  return <SceneContext.Provider value={value}>{children}</SceneContext.Provider>;
}

export function usePlaygroundScene(): SceneValue {
  const value = useContext(SceneContext);
  if (!value) throw new Error('usePlaygroundScene needs <PlaygroundSceneProvider>');
  return value;
}
