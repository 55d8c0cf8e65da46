// The pest and batch count the scout is working with; the pest is remembered, since a walk is usually for one.
import { useEffect, useState } from 'react';

const LAST_PEST_KEY = 'patchwise.scout.last-pest';

export function useBatchTags() {
  const [pestId, setPestId] = useState(() => localStorage.getItem(LAST_PEST_KEY) ?? '');
  const [count, setCount] = useState('');
  useEffect(() => {
    if (pestId) localStorage.setItem(LAST_PEST_KEY, pestId);
  }, [pestId]);
  return { pestId, setPestId, count, setCount };
}
