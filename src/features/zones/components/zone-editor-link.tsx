// A link from a check's proposed zones to the zone editor, for the review page to place beside them.
import { ButtonLink } from '../../../components/button.tsx';

export const zoneEditorPath = (fieldId: string, checkId?: string) => `/fields/${fieldId}/zones${checkId ? `?checkId=${checkId}` : ''}`;

export function ZoneEditorLink({ fieldId, checkId, label = 'Edit and accept zones' }: { fieldId: string; checkId?: string; label?: string }) {
  return (
    <ButtonLink to={zoneEditorPath(fieldId, checkId)} variant="secondary" size="sm">
      {label}
    </ButtonLink>
  );
}
