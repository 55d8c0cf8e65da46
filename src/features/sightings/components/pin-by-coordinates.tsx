// Placing the pin without tapping the map: typed latitude and longitude, or the phone's own position, so a
// scout using a keyboard, a switch or a screen reader can pin a photo too. The boxes follow every choice.
import { useEffect, useState, type FormEvent } from 'react';
import { positionSchema, type Position } from '@shared/schemas/sightings.ts';
import { Button } from '../../../components/button.tsx';
import { TextField } from '../../../components/form-field.tsx';
import { checkForm, type FieldErrors } from '../../../lib/form-errors.ts';
import { useCurrentPosition } from '../../../lib/use-current-position.ts';

const asText = (degrees: number) => degrees.toFixed(6);
// An empty box reads as missing (the schema's own message), not as zero degrees.
const asNumber = (text: string) => (text.trim() === '' ? undefined : Number(text.trim()));

export function PinByCoordinates({ chosen, onChoose }: { chosen: Position | null; onChoose: (position: Position) => void }) {
  const [lat, setLat] = useState(chosen ? asText(chosen.lat) : '');
  const [lon, setLon] = useState(chosen ? asText(chosen.lon) : '');
  const [errors, setErrors] = useState<FieldErrors>({});
  const { status, locate } = useCurrentPosition();

  useEffect(() => {
    if (!chosen) return;
    setLat(asText(chosen.lat));
    setLon(asText(chosen.lon));
  }, [chosen]);

  const place = (event: FormEvent) => {
    event.preventDefault();
    const checked = checkForm(positionSchema, { lat: asNumber(lat), lon: asNumber(lon) });
    if (!checked.ok) return setErrors(checked.errors);
    setErrors({});
    onChoose({ lat: checked.value.lat, lon: checked.value.lon });
  };

  const useMyPosition = async () => {
    const found = await locate();
    if (!found) return;
    setErrors({});
    onChoose({ lat: found.lat, lon: found.lon });
  };

  return (
    <section aria-labelledby="pin-without-map" className="space-y-3 rounded-lg bg-straw-50 p-4 ring-1 ring-straw-200">
      <h2 id="pin-without-map" className="text-base font-semibold text-soil-900">
        Or give the place without the map
      </h2>
      <Button variant="secondary" size="lg" className="w-full" onClick={useMyPosition} busy={status.kind === 'locating'}>
        Use where I am standing now
      </Button>
      <p className="text-sm text-soil-700" aria-live="polite">
        {status.kind === 'locating' && 'Finding the phone’s position…'}
        {status.kind === 'failed' && <span className="font-medium text-patch-700">{status.message}</span>}
      </p>
      <form onSubmit={place} noValidate className="grid gap-3 sm:grid-cols-2">
        <TextField
          label="Latitude"
          inputMode="decimal"
          autoComplete="off"
          value={lat}
          error={errors.lat}
          onChange={(e) => setLat(e.target.value)}
          hint="Decimal degrees; south is negative."
        />
        <TextField
          label="Longitude"
          inputMode="decimal"
          autoComplete="off"
          value={lon}
          error={errors.lon}
          onChange={(e) => setLon(e.target.value)}
          hint="Decimal degrees; west is negative."
        />
        <Button type="submit" variant="secondary" size="lg" className="sm:col-span-2">
          Put the pin at these coordinates
        </Button>
      </form>
    </section>
  );
}
