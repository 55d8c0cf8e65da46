import { useEffect, useRef } from 'react';

/** Calls `action` once per mount, the first time `ready` is true (the ref keeps React's doubled effects to one call). */
export function useOnceWhen(ready: boolean, action: () => void) {
  const done = useRef(false);
  useEffect(() => {
    if (!ready || done.current) return;
    done.current = true;
    action();
  }, [ready, action]);
}
