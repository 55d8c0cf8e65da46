// The phone's position through the browser's geolocation, with its accuracy and a plain sentence when it fails.
import { useCallback, useState } from 'react';

export interface PhonePosition {
  lon: number;
  lat: number;
  accuracyM: number;
}

type Status = { kind: 'idle' } | { kind: 'locating' } | { kind: 'found'; position: PhonePosition } | { kind: 'failed'; message: string };

const LOCATE_TIMEOUT_MS = 15_000;
// A fix this young is still where the scout stands (a few steps at walking pace); older ones are asked for afresh.
const POSITION_MAX_AGE_MS = 10_000;

function explain(error: GeolocationPositionError) {
  if (error.code === error.PERMISSION_DENIED) {
    return window.isSecureContext
      ? 'Patchwise may not read this phone’s location. Allow location for this site in the browser settings, then tap again.'
      : 'The browser only shares location with a secure (https) address. Open Patchwise through its https address and tap again.';
  }
  if (error.code === error.TIMEOUT)
    return 'The phone did not find its position within 15 seconds. Step into the open, away from buildings and trees, check that location is on, and tap again.';
  return 'The phone could not work out its position. Check that location is switched on, then tap again.';
}

/** Asks for one high-accuracy fix (at most 10 s old) each time `locate` is called, giving up after 15 s with what to do. */
export function useCurrentPosition() {
  const [status, setStatus] = useState<Status>({ kind: 'idle' });

  const locate = useCallback(
    () =>
      new Promise<PhonePosition | null>((resolve) => {
        if (!('geolocation' in navigator)) {
          setStatus({ kind: 'failed', message: 'This browser cannot share the phone’s location; open Patchwise in another browser.' });
          resolve(null);
          return;
        }
        setStatus({ kind: 'locating' });
        navigator.geolocation.getCurrentPosition(
          ({ coords }) => {
            const position = { lon: coords.longitude, lat: coords.latitude, accuracyM: coords.accuracy };
            setStatus({ kind: 'found', position });
            resolve(position);
          },
          (error) => {
            setStatus({ kind: 'failed', message: explain(error) });
            resolve(null);
          },
          { enableHighAccuracy: true, timeout: LOCATE_TIMEOUT_MS, maximumAge: POSITION_MAX_AGE_MS },
        );
      }),
    [],
  );

  return { status, locate };
}
