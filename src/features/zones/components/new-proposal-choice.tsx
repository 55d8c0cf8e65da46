// Shown when a new proposal arrives after the adviser has edited zones by hand: their edits stay until they choose.
import { Button } from '../../../components/button.tsx';

export function NewProposalChoice({ zoneCount, onTake, onKeep }: { zoneCount: number; onTake: () => void; onKeep: () => void }) {
  return (
    <div role="alert" className="rounded-md border border-straw-300 bg-straw-50 p-3 text-sm text-soil-800">
      <p>
        A new proposal is ready ({zoneCount} zone{zoneCount === 1 ? '' : 's'}). Taking it replaces the zones you edited or drew by hand.
      </p>
      <div className="mt-2 flex flex-wrap gap-2">
        <Button size="sm" onClick={onTake}>
          Use the new proposal
        </Button>
        <Button size="sm" variant="secondary" onClick={onKeep}>
          Keep my edits
        </Button>
      </div>
    </div>
  );
}
