// Deletes a farm after a confirmation; the server keeps a farm that still has fields and says so.
import { useState } from 'react';
import { useNavigate } from 'react-router';
import { Button } from '../../../components/button.tsx';
import { ConfirmDialog } from '../../../components/confirm-dialog.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { errorMessage } from '../../../lib/form-errors.ts';
import type { FarmView as Farm } from '@shared/schemas/farms.ts';
import { useDeleteFarm } from '../api/delete-farm.ts';

export function DeleteFarmButton({ farm }: { farm: Farm }) {
  const [asking, setAsking] = useState(false);
  const remove = useDeleteFarm();
  const navigate = useNavigate();
  return (
    <div className="flex flex-col items-end gap-2">
      <Button variant="quiet" className="text-patch-700" onClick={() => setAsking(true)}>
        Delete farm
      </Button>
      {remove.isError && <FormMessage>{errorMessage(remove.error)}</FormMessage>}
      <ConfirmDialog
        open={asking}
        title={`Delete ${farm.name}?`}
        confirmLabel="Delete farm"
        busy={remove.isPending}
        onCancel={() => setAsking(false)}
        onConfirm={() => remove.mutate(farm.id, { onSuccess: () => navigate('/admin/farms'), onSettled: () => setAsking(false) })}
      >
        The farm, its grower contacts and its grower links are removed. A farm that still has fields is kept: delete its fields first.
      </ConfirmDialog>
    </div>
  );
}
