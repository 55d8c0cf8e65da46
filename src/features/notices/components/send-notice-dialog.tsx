// Before a notice goes out: who gets it. The farm's contacts are ticked by default; the adviser may leave one out of
// this notice, or add an address for this notice only. The server checks the choice again and stores exactly it.
import { useEffect, useRef, useState, type FormEvent } from 'react';
import { addedRecipientSchema, type NoticeRecipientChoice, type NoticeView } from '@shared/schemas/notices.ts';
import { Button } from '../../../components/button.tsx';
import { FormMessage, TextField } from '../../../components/form-field.tsx';
import { ErrorState, LoadingState } from '../../../components/query-states.tsx';
import { checkForm, errorMessage, type FieldErrors } from '../../../lib/form-errors.ts';
import { useFarms } from '../../../lib/api/get-farms.ts';

interface Added {
  name: string;
  email: string;
}

export function SendNoticeDialog({
  notice,
  open,
  busy,
  error,
  onSend,
  onCancel,
}: {
  notice: NoticeView;
  open: boolean;
  busy: boolean;
  error: unknown;
  onSend: (recipients: NoticeRecipientChoice) => void;
  onCancel: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const farms = useFarms();
  const contacts = farms.data?.find((f) => f.id === notice.farmId)?.contacts.filter((c): c is typeof c & { id: string } => !!c.id) ?? [];
  const [leftOut, setLeftOut] = useState<Set<string>>(new Set());
  const [added, setAdded] = useState<Added[]>([]);
  const [name, setName] = useState('');
  const [email, setEmail] = useState('');
  const [addErrors, setAddErrors] = useState<FieldErrors>({});

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  const kept = contacts.filter((c) => !leftOut.has(c.id));
  const count = kept.length + added.length;

  const toggle = (id: string) =>
    setLeftOut((now) => {
      const next = new Set(now);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });

  const addAddress = (event: FormEvent) => {
    event.preventDefault();
    const checked = checkForm(addedRecipientSchema, { name, email });
    if (!checked.ok) return setAddErrors(checked.errors);
    const known = contacts.find((c) => c.email === checked.value.email);
    if (known) return setAddErrors({ email: `${known.name} is already a contact of this farm; tick them above instead.` });
    if (added.some((a) => a.email === checked.value.email)) return setAddErrors({ email: 'This address is already added.' });
    setAdded((now) => [...now, checked.value]);
    setAddErrors({});
    setName('');
    setEmail('');
  };

  return (
    <dialog
      ref={ref}
      onCancel={(event) => {
        event.preventDefault();
        if (!busy) onCancel();
      }}
      aria-labelledby="send-notice-title"
      className="w-[min(34rem,calc(100vw-2rem))] rounded-lg p-0 shadow-xl backdrop:bg-soil-900/40"
    >
      <div className="space-y-4 p-5">
        <div>
          <h2 id="send-notice-title" className="text-lg font-semibold text-soil-900">
            Send this notice?
          </h2>
          <p className="mt-1 text-sm text-soil-700">
            One e-mail goes to each person below, each with its own link to the notice page. A sent notice cannot be changed; it carries the cautions about the
            product label, local regulations and extension advice as shown in the preview.
          </p>
        </div>

        {farms.isPending ? (
          <LoadingState label="Loading the farm’s contacts…" />
        ) : farms.isError ? (
          <ErrorState error={farms.error} onRetry={() => farms.refetch()} />
        ) : (
          <fieldset>
            <legend className="text-sm font-semibold text-soil-900">Grower contacts of {notice.farmName}</legend>
            {contacts.length === 0 ? (
              <p className="mt-1 text-sm text-soil-700">
                This farm has no grower contacts yet; add an address below for this notice, or add contacts to the farm.
              </p>
            ) : (
              <ul className="mt-1 divide-y divide-straw-200" aria-label="Grower contacts of the farm">
                {contacts.map((c) => (
                  <li key={c.id} className="py-1.5">
                    <label className="flex items-start gap-2 text-sm">
                      <input type="checkbox" className="mt-1 h-4 w-4" checked={!leftOut.has(c.id)} onChange={() => toggle(c.id)} />
                      <span>
                        <span className="font-medium text-soil-900">{c.name}</span> <span className="text-soil-600">{c.email}</span>
                        {leftOut.has(c.id) && <span className="ml-1 text-patch-700">· left out of this notice</span>}
                      </span>
                    </label>
                  </li>
                ))}
              </ul>
            )}
          </fieldset>
        )}

        {added.length > 0 && (
          <div>
            <h3 className="text-sm font-semibold text-soil-900">Added for this notice only</h3>
            <ul className="mt-1 divide-y divide-straw-200" aria-label="Addresses added for this notice">
              {added.map((a) => (
                <li key={a.email} className="flex items-center justify-between gap-2 py-1.5 text-sm">
                  <span>
                    <span className="font-medium text-soil-900">{a.name}</span> <span className="text-soil-600">{a.email}</span>
                  </span>
                  <Button variant="quiet" size="sm" onClick={() => setAdded((now) => now.filter((x) => x.email !== a.email))} aria-label={`Remove ${a.email}`}>
                    Remove
                  </Button>
                </li>
              ))}
            </ul>
          </div>
        )}

        <form className="rounded-md bg-straw-50 p-3" onSubmit={addAddress} noValidate aria-label="Add an address for this notice only">
          <p className="mb-2 text-sm font-semibold text-soil-900">Add an address for this notice only</p>
          <div className="grid gap-2 sm:grid-cols-2">
            <TextField label="Name" value={name} onChange={(e) => setName(e.target.value)} error={addErrors.name} />
            <TextField label="E-mail" type="email" value={email} onChange={(e) => setEmail(e.target.value)} error={addErrors.email} />
          </div>
          <p className="mt-1 text-xs text-soil-600">The farm’s contact list stays as it is.</p>
          <Button type="submit" variant="secondary" size="sm" className="mt-2">
            Add
          </Button>
        </form>

        {error != null && <FormMessage>{errorMessage(error)}</FormMessage>}

        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={onCancel} disabled={busy}>
            Keep it as a draft
          </Button>
          <Button onClick={() => onSend({ contactIds: kept.map((c) => c.id), added })} busy={busy} disabled={count === 0 || farms.isPending || farms.isError}>
            Send to {count} {count === 1 ? 'recipient' : 'recipients'}
          </Button>
        </div>
      </div>
    </dialog>
  );
}
