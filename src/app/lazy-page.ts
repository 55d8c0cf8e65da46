import { lazy, type ComponentType } from 'react';

/** React.lazy for a named export, so page modules need no default export. */
export function lazyPage<M extends Record<string, unknown>, K extends keyof M>(load: () => Promise<M>, name: K) {
  return lazy(async () => ({ default: (await load())[name] as ComponentType }));
}
