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

/** A place and date another tab asks the Twilight tab to show (a reopened saved setup's). */
export interface PlaceRequest {
  latitude: number;
  longitude: number;
  date: string;
  timeZone: string;
  sky: 'clear' | 'partly-cloudy' | 'overcast';
  /** Counts requests, so asking twice for the same place still applies it. */
  seq: number;
}

interface SceneValue {
  moment: SceneMoment | null;
  setMoment: (moment: SceneMoment | null) => void;
  placeRequest: PlaceRequest | null;
  requestPlace: (place: Omit<PlaceRequest, 'seq'>) => void;
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
  const [placeRequest, setPlaceRequest] = useState<PlaceRequest | null>(null);
  const requestPlace = useCallback(
    (place: Omit<PlaceRequest, 'seq'>) =>
      setPlaceRequest((previous) => ({ ...place, seq: (previous?.seq ?? 0) + 1 })),
    [],
  );
  const cautions = useCallback(
    (stands: number) => cautionsFor({ ...conditions, standsCount: stands }),
    [conditions],
  );
  const value = useMemo(
    () => ({
      moment,
      setMoment,
      placeRequest,
      requestPlace,
      conditions,
      setConditions,
      cautionsFor: cautions,
    }),
    [moment, placeRequest, requestPlace, conditions, cautions],
  );
  return <SceneContext.Provider value={value}>{children}</SceneContext.Provider>;
}

export function usePlaygroundScene(): SceneValue {
  const value = useContext(SceneContext);
  if (!value) throw new Error('usePlaygroundScene needs <PlaygroundSceneProvider>');
  return value;
}

/**
 * The calculation whose tab is on screen (null outside the tabbed playground): hidden tabs stay
 * mounted so their inputs survive, but only the visible one asks the API to confirm its result.
 */
export const VisibleCalculationContext = createContext<string | null>(null);
