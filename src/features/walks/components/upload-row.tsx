// One photo on its way: name, progress bar, and what became of it, in words a scout reads at a glance.
import { useEffect, useRef, useState } from 'react';
import { Link } from 'react-router';
import type { PhotoOutcome } from '@shared/schemas/sightings.ts';
import { Button, buttonClass } from '../../../components/button.tsx';
import type { UploadEntry } from '../upload-queue.ts';
import { scoutPaths } from '../paths.ts';

const metres = new Intl.NumberFormat('en', { maximumFractionDigits: 0 });

const tone = {
  good: 'border-field-600 bg-field-50 text-field-900',
  attention: 'border-straw-500 bg-straw-100 text-soil-900',
  bad: 'border-patch-600 bg-patch-50 text-patch-700',
  neutral: 'border-soil-300 bg-white text-soil-900',
};

function headline(outcome: PhotoOutcome, pinned: boolean) {
  if (pinned) return { text: `Pinned by hand in ${outcome.fieldName ?? 'the field'}`, look: tone.good };
  switch (outcome.outcome) {
    case 'placed':
      return { text: `Placed in ${outcome.fieldName ?? 'the field'}`, look: tone.good };
    case 'needs-pin':
      return { text: 'Needs a pin: no usable position in this photo', look: tone.attention };
    case 'outside':
      return { text: 'Outside every field you scout', look: tone.bad };
    case 'duplicate':
      return { text: 'Already sent: this photo is a sighting already', look: tone.neutral };
    default:
      return { text: 'Not accepted', look: tone.bad };
  }
}

function stateHeadline(state: UploadEntry['state']) {
  switch (state) {
    case 'waiting':
      return { text: 'Waiting on this phone to be sent', look: tone.attention };
    case 'sending':
      return { text: 'Sending…', look: tone.neutral };
    case 'refused':
      return { text: 'Not accepted', look: tone.bad };
    default:
      return { text: 'Ready to send', look: tone.neutral };
  }
}

/**
 * An object URL for the preview, revoked when the row goes. Each read of the outbox hands back a new Blob of the same
 * bytes (a preview is made once, when the photo is queued), so the URL follows the preview's size and type, not its
 * identity: otherwise every item sent would decode every row's image again.
 */
function usePreviewUrl(preview: Blob | undefined) {
  const [url, setUrl] = useState<string>();
  const latest = useRef(preview);
  latest.current = preview;
  const sameBytes = preview ? `${preview.size}:${preview.type}` : '';
  useEffect(() => {
    if (!sameBytes || !latest.current) return;
    const made = URL.createObjectURL(latest.current);
    setUrl(made);
    return () => {
      URL.revokeObjectURL(made);
      setUrl(undefined);
    };
  }, [sameBytes]);
  return url;
}

export function UploadRow({
  entry,
  pinned,
  onSendNow,
  onRemove,
  onCount,
  batchCount,
  linkToWalk,
}: {
  entry: UploadEntry & { preview?: Blob };
  /** A needs-a-pin photo that has been pinned since it was sent. */
  pinned: boolean;
  /** Tries the waiting photos now rather than at the next signal. */
  onSendNow: () => void;
  onRemove: () => void;
  onCount: (count: string) => void;
  batchCount: string;
  /** When Patchwise chose the walk, offer a way to it. */
  linkToWalk: boolean;
}) {
  const { outcome, error } = entry;
  const shown = outcome ? headline(outcome, pinned) : stateHeadline(entry.state);
  const previewUrl = usePreviewUrl(entry.preview);
  return (
    <li
      className={`rounded-lg border-l-8 p-3 shadow-sm ring-1 ring-soil-300/60 ${shown.look}`}
      data-upload-state={entry.state}
      data-outcome={outcome?.outcome ?? ''}
    >
      <div className="flex items-start justify-between gap-2">
        {previewUrl && <img src={previewUrl} alt={`Preview of ${entry.fileName}`} className="h-14 w-14 shrink-0 rounded object-cover" />}
        <div className="min-w-0 flex-1">
          <p className="truncate text-sm text-soil-700">{entry.fileName}</p>
          <p className="text-base font-semibold">{shown.text}</p>
        </div>
        {(entry.state === 'ready' || entry.state === 'refused') && (
          <Button variant="quiet" size="lg" onClick={onRemove} aria-label={`Remove ${entry.fileName}`}>
            Remove
          </Button>
        )}
      </div>

      {entry.state === 'sending' && (
        <progress
          className="mt-2 h-3 w-full overflow-hidden rounded-full accent-field-700"
          max={1}
          value={entry.progress}
          aria-label={`Upload of ${entry.fileName}`}
        />
      )}

      {entry.state === 'ready' && (
        <label className="mt-2 flex items-center gap-2 text-sm text-soil-800">
          Count for this photo
          <input
            type="number"
            inputMode="decimal"
            min={0}
            step="any"
            value={entry.count}
            placeholder={batchCount || '–'}
            onChange={(e) => onCount(e.target.value)}
            className="min-h-12 w-24 rounded-md border-0 px-3 text-base ring-1 ring-inset ring-soil-300 focus:ring-2 focus:ring-field-600"
          />
        </label>
      )}

      {outcome && outcome.outcome !== 'placed' && !pinned && <p className="mt-1 text-sm">{outcome.message}</p>}
      {outcome?.outcome === 'outside' && outcome.nearestField && (
        <p className="mt-1 text-sm font-medium">
          Nearest field: {outcome.nearestField.name}, {metres.format(outcome.nearestField.distanceM)} m away.
        </p>
      )}
      {error && <p className="mt-1 text-sm font-medium">{error.message}</p>}

      <div className="mt-2 flex flex-wrap gap-2 empty:hidden">
        {outcome?.outcome === 'needs-pin' && !pinned && outcome.walkId && outcome.sightingId && (
          <Link to={scoutPaths.pin(outcome.walkId, outcome.sightingId)} className={buttonClass('primary', 'lg')}>
            Pin it on the map
          </Link>
        )}
        {linkToWalk && outcome?.walkId && (outcome.outcome === 'placed' || outcome.outcome === 'duplicate') && (
          <Link to={scoutPaths.walk(outcome.walkId)} className={buttonClass('secondary', 'lg')}>
            Open the walk
          </Link>
        )}
        {entry.state === 'waiting' && (
          <Button size="lg" variant="secondary" onClick={onSendNow}>
            Send now
          </Button>
        )}
      </div>
    </li>
  );
}
