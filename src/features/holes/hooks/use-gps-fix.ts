import { useCallback, useEffect, useRef, useState } from 'react';
import type { ProjectDto } from '@shared/api';
import { lonLatToGrid, projectCrs } from '@shared/geometry/crs';
import { convertLength } from '@shared/units';

/** A phone fix converted to the project's grid. The phone's height is never kept. */
export interface GpsFix {
  lon: number;
  lat: number;
  /** Horizontal accuracy as the browser gave it (metres, 68 % radius per the W3C Geolocation spec). */
  accuracyMetres: number;
  /** The same accuracy in the project unit. */
  accuracy: number;
  easting: number;
  northing: number;
  /** When the fix was taken (ISO 8601). */
  at: string;
}

export type GpsState =
  | { phase: 'idle' }
  | { phase: 'seeking'; best: GpsFix | null }
  | { phase: 'done'; best: GpsFix }
  | { phase: 'error'; message: string; best: GpsFix | null };

const SEEK_MS = 30_000;

function errorMessage(error: GeolocationPositionError): string {
  if (error.code === error.PERMISSION_DENIED) {
    return window.isSecureContext
      ? 'Location permission was refused. Allow location for this site in the browser settings, or type the position.'
      : 'The browser gives a position only to secure (https) sites, and this page was opened over plain http. Type the position, or open Threadline over https.';
  }
  if (error.code === error.TIMEOUT) return 'No position came from the phone in time. Move into the open, away from buildings, and try again, or type the position.';
  return 'The phone could not work out a position. Check that location is switched on, or type the position.';
}

/**
 * Watch the phone's position for up to 30 s with high accuracy, keeping the best fix (smallest
 * accuracy radius) converted to the project's grid with proj4. Stops early once a fix is within
 * half the project's limit. Altitude is ignored on purpose: phone heights are not elevations.
 */
export function useGpsFix(project: Pick<ProjectDto, 'crsCode' | 'crsProj4' | 'unit'>) {
  const [state, setState] = useState<GpsState>({ phase: 'idle' });
  const watchId = useRef<number | null>(null);
  const timer = useRef<number | null>(null);
  const best = useRef<GpsFix | null>(null);

  const clear = useCallback(() => {
    if (watchId.current != null) navigator.geolocation.clearWatch(watchId.current);
    if (timer.current != null) window.clearTimeout(timer.current);
    watchId.current = null;
    timer.current = null;
  }, []);

  useEffect(() => clear, [clear]);

  const stop = useCallback(() => {
    clear();
    setState(best.current ? { phase: 'done', best: best.current } : { phase: 'idle' });
  }, [clear]);

  const start = useCallback(
    (goodEnough: number) => {
      clear();
      best.current = null;
      if (typeof navigator === 'undefined' || !('geolocation' in navigator)) {
        setState({ phase: 'error', message: 'This browser cannot give a position. Type the position instead.', best: null });
        return;
      }
      setState({ phase: 'seeking', best: null });
      let crs: ReturnType<typeof projectCrs>;
      try {
        crs = projectCrs(project.crsCode, project.crsProj4);
      } catch (e) {
        setState({ phase: 'error', message: `The project's coordinate system cannot be used for GPS: ${e instanceof Error ? e.message : String(e)}`, best: null });
        return;
      }
      watchId.current = navigator.geolocation.watchPosition(
        (pos) => {
          const { longitude: lon, latitude: lat, accuracy: accuracyMetres } = pos.coords;
          let grid: [number, number];
          try {
            grid = lonLatToGrid(crs, [lon, lat], { unit: project.unit });
          } catch (e) {
            clear();
            setState({ phase: 'error', message: e instanceof Error ? e.message : String(e), best: best.current });
            return;
          }
          const fix: GpsFix = {
            lon,
            lat,
            accuracyMetres,
            accuracy: convertLength(accuracyMetres, 'm', project.unit),
            easting: grid[0],
            northing: grid[1],
            at: new Date(pos.timestamp || Date.now()).toISOString(),
          };
          if (!best.current || fix.accuracy < best.current.accuracy) best.current = fix;
          if (best.current.accuracy <= goodEnough) {
            clear();
            setState({ phase: 'done', best: best.current });
          } else {
            setState({ phase: 'seeking', best: best.current });
          }
        },
        (error) => {
          clear();
          setState({ phase: 'error', message: errorMessage(error), best: best.current });
        },
        { enableHighAccuracy: true, maximumAge: 0, timeout: SEEK_MS },
      );
      timer.current = window.setTimeout(() => {
        clear();
        setState(best.current ? { phase: 'done', best: best.current } : { phase: 'error', message: 'No position came from the phone in 30 s. Move into the open and try again, or type the position.', best: null });
      }, SEEK_MS);
    },
    [clear, project.crsCode, project.crsProj4, project.unit],
  );

  return { state, start, stop };
}

/**
 * One quick position for photos (time and place the form records itself, because phone
 * browsers strip both from uploaded pictures). Resolves to null when none is available.
 */
export function quickPosition(timeoutMs = 8000): Promise<{ lat: number; lon: number; accuracy: number } | null> {
  if (typeof navigator === 'undefined' || !('geolocation' in navigator)) return Promise.resolve(null);
  return new Promise((resolve) => {
    navigator.geolocation.getCurrentPosition(
      (pos) => resolve({ lat: pos.coords.latitude, lon: pos.coords.longitude, accuracy: pos.coords.accuracy }),
      () => resolve(null),
      { enableHighAccuracy: true, maximumAge: 60_000, timeout: timeoutMs },
    );
  });
}
