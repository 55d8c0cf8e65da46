// Two ways in: the camera (capture) for a photo now, and the gallery for photos already taken.
import type { ChangeEvent } from 'react';
import { buttonClass } from '../../../components/button.tsx';

export function PhotoPicker({ onFiles, disabled }: { onFiles: (files: File[]) => void; disabled?: boolean }) {
  function take(event: ChangeEvent<HTMLInputElement>) {
    const files = Array.from(event.target.files ?? []);
    if (files.length) onFiles(files);
    // Clear the input so choosing the same photo again (to retry) still fires a change.
    event.target.value = '';
  }

  const look = buttonClass('primary', 'lg', 'w-full min-h-14 cursor-pointer px-3 text-lg');
  return (
    <div className="grid grid-cols-2 gap-3">
      <label className={`${look} ${disabled ? 'pointer-events-none opacity-50' : ''}`}>
        <input type="file" accept="image/*" multiple capture="environment" className="sr-only" onChange={take} disabled={disabled} data-testid="camera-input" />
        Camera
      </label>
      <label className={`${buttonClass('secondary', 'lg', 'w-full min-h-14 cursor-pointer px-3 text-lg')} ${disabled ? 'pointer-events-none opacity-50' : ''}`}>
        <input type="file" accept="image/*" multiple className="sr-only" onChange={take} disabled={disabled} data-testid="gallery-input" />
        From gallery
      </label>
    </div>
  );
}
