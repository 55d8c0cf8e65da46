// Leaving the zone editor with edits no Accept has stored: a question inside the app, and the browser's own
// warning when the tab is closed or reloaded.
import { useEffect } from 'react';
import { ConfirmDialog } from '../../../components/confirm-dialog.tsx';

export function LeaveWithoutAccepting({ onStay, onLeave }: { onStay: () => void; onLeave: () => void }) {
  return (
    <ConfirmDialog open title="Leave without accepting your zones?" confirmLabel="Leave and lose the edits" onConfirm={onLeave} onCancel={onStay}>
      Your changes to the zones are not stored yet. Accept the zones to keep them as the field’s next version, or leave and lose the edits.
    </ConfirmDialog>
  );
}

/** While `active`, closing or reloading the tab asks the browser to confirm. */
export function useWarnBeforeUnload(active: boolean) {
  useEffect(() => {
    if (!active) return;
    const warn = (event: BeforeUnloadEvent) => {
      event.preventDefault();
      // Older browsers show the prompt only when returnValue is set.
      event.returnValue = '';
    };
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [active]);
}
