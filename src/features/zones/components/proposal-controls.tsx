// Where the proposal comes from and its threshold and margin; values are checked with the server's schema
// and sent once typing pauses.
import { useEffect, useState } from 'react';
import { zoneProposalSchema, type ZoneProposalRequest } from '@shared/schemas/zones.ts';
import { SelectField, TextField } from '../../../components/form-field.tsx';
import { checkForm } from '../../../lib/form-errors.ts';
import type { ZoneProposal } from '../api/propose-zones.ts';

const PAUSE_MS = 500;

export function ProposalControls({
  proposal,
  countUnit,
  onChange,
}: {
  proposal: ZoneProposal | undefined;
  countUnit: string | null;
  onChange: (request: ZoneProposalRequest) => void;
}) {
  const [source, setSource] = useState<ZoneProposalRequest['source']>('density');
  const [threshold, setThreshold] = useState('');
  const [margin, setMargin] = useState('');
  const toNumber = (text: string) => (text.trim() === '' ? undefined : Number(text));
  const checked = checkForm(zoneProposalSchema, { source, threshold: toNumber(threshold), marginM: toNumber(margin) });
  const errors = checked.ok ? {} : checked.errors;
  const request = checked.ok ? JSON.stringify(checked.value) : null;

  useEffect(() => {
    if (!request) return;
    const timer = setTimeout(() => onChange(JSON.parse(request) as ZoneProposalRequest), PAUSE_MS);
    return () => clearTimeout(timer);
  }, [request, onChange]);

  const thresholdHint =
    source === 'density'
      ? `Sightings per hectare on the density surface; empty uses the engine's default${proposal?.source === 'density' ? ` (${proposal.threshold.toFixed(1)} per ha now)` : ''}.`
      : `Mean count per sighting in a quadrat cell${countUnit ? ` (${countUnit})` : ''}; empty uses the pest's action threshold${proposal?.source === 'quadrat' ? ` (${proposal.threshold} now)` : ''}.`;

  return (
    <div className="grid gap-3 sm:grid-cols-3">
      <SelectField label="Zones from" value={source} onChange={(e) => setSource(e.target.value as ZoneProposalRequest['source'])}>
        <option value="density">Density surface</option>
        <option value="quadrat">Quadrat cells</option>
      </SelectField>
      <TextField
        label="Threshold"
        inputMode="decimal"
        value={threshold}
        onChange={(e) => setThreshold(e.target.value)}
        hint={thresholdHint}
        error={errors.threshold}
        placeholder={proposal ? String(Number(proposal.threshold.toFixed(2))) : ''}
      />
      <TextField
        label="Margin (m)"
        inputMode="decimal"
        value={margin}
        onChange={(e) => setMargin(e.target.value)}
        hint="Buffer added around each patch, in metres."
        error={errors.marginM}
        placeholder={proposal ? String(proposal.marginM) : ''}
      />
    </div>
  );
}
