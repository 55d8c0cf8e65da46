// The phone's position as it moves (watchPosition), for the "you are here" dot; the watch ends with the component.
import { useEffect, useState } from 'react';
import type { PhonePosition } from './use-current-position.ts';

export type WatchedPosition = { kind: 'waiting' } | { kind: 'found'; position: PhonePosition } | { kind: 'unavailable'; message: string };

export function useWatchedPosition(enabled = true): WatchedPosition {
  const [state, setState] = useState<WatchedPosition>({ kind: 'waiting' });
  useEffect(() => {
    if (!enabled) return;
    if (!('geolocation' in navigator)) {
      setState({ kind: 'unavailable', message: 'This browser cannot share the phone’s location.' });
      return;
    }
    const id = navigator.geolocation.watchPosition(
      ({ coords }) => setState({ kind: 'found', position: { lon: coords.longitude, lat: coords.latitude, accuracyM: coords.accuracy } }),
      (error) =>
        setState({
          kind: 'unavailable',
          message:
            error.code === error.PERMISSION_DENIED
              ? 'Your position is not shown: allow location for this site in the browser settings.'
              : 'Your position is not shown yet: the phone has no fix (step into the open).',
        }),
      { enableHighAccuracy: true, maximumAge: 10_000, timeout: 30_000 },
    );
    return () => navigator.geolocation.clearWatch(id);
  }, [enabled]);
  return state;
}
