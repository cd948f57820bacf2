/** Creating or editing a kit (custodians): code, name, where it lives, and whether it is in service. */
import { useState } from 'react';
import { kitInputSchema } from '../../lib/kits/schemas';
import { api } from '../ui/api';
import { Field, FormError } from '../ui/Field';
import type { KitDetail } from './types';
import { useCheckedSave } from './use-checked-save';

type Values = { code: string; name: string; description: string; homeLocation: string; active: boolean };

export function KitForm({ kit, onDone, onCancel }: { kit: Pick<KitDetail, 'id' | 'code' | 'name' | 'description' | 'homeLocation' | 'active'> | null; onDone: (saved: KitDetail) => void; onCancel?: () => void }) {
  const [v, setV] = useState<Values>({ code: kit?.code ?? '', name: kit?.name ?? '', description: kit?.description ?? '', homeLocation: kit?.homeLocation ?? '', active: kit?.active ?? true });
  const { fieldErrors, error, submit, pending } = useCheckedSave(
    kitInputSchema,
    v,
    () => {
      if (!kit) return api<KitDetail>('/api/kits', { method: 'POST', body: { code: v.code, name: v.name, description: v.description, homeLocation: v.homeLocation } });
      const patch = Object.fromEntries(Object.entries(v).filter(([k, x]) => x !== kit[k as keyof Values]));
      return api<KitDetail>(`/api/kits/${kit.id}`, { method: 'PATCH', body: Object.keys(patch).length ? patch : { name: v.name } });
    },
    onDone,
  );
  const set = (k: 'code' | 'name' | 'description' | 'homeLocation') => (e: React.ChangeEvent<HTMLInputElement | HTMLTextAreaElement>) => setV({ ...v, [k]: e.target.value });
  return (
    <form onSubmit={submit} noValidate className="space-y-3" aria-label={kit ? `Edit kit ${kit.code}` : 'New kit'}>
      <FormError message={error} />
      <div className="grid gap-3 sm:grid-cols-2">
        <Field label="Code" required error={fieldErrors.code} hint="2 to 20 letters, digits or dashes, e.g. KIT-ELEC-1.">
          {({ id, describedBy, invalid }) => <input id={id} className="field-input figure uppercase" value={v.code} onChange={set('code')} aria-describedby={describedBy} aria-invalid={invalid} maxLength={20} autoFocus={!kit} />}
        </Field>
        <Field label="Name" required error={fieldErrors.name}>
          {({ id, describedBy, invalid }) => <input id={id} className="field-input" value={v.name} onChange={set('name')} aria-describedby={describedBy} aria-invalid={invalid} maxLength={120} />}
        </Field>
        <Field label="Where it lives" error={fieldErrors.homeLocation} hint="The shelf or room it is shipped from and returned to.">
          {({ id, describedBy, invalid }) => <input id={id} className="field-input" value={v.homeLocation} onChange={set('homeLocation')} aria-describedby={describedBy} aria-invalid={invalid} maxLength={200} />}
        </Field>
        <Field label="Description" error={fieldErrors.description}>
          {({ id, describedBy, invalid }) => <textarea id={id} rows={2} className="field-input" value={v.description} onChange={set('description')} aria-describedby={describedBy} aria-invalid={invalid} maxLength={1000} />}
        </Field>
      </div>
      {kit && (
        <div>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={v.active} onChange={(e) => setV({ ...v, active: e.target.checked })} aria-describedby="kit-active-hint" /> In service (may be borrowed)
          </label>
          <p id="kit-active-hint" className="field-hint">A kit can be taken out of service once no loan holds it.</p>
          {fieldErrors.active && <p className="field-error" role="alert">{fieldErrors.active}</p>}
        </div>
      )}
      <div className="flex flex-wrap gap-2">
        <button type="submit" className="btn-primary" disabled={pending}>{pending ? 'Saving…' : kit ? 'Save kit' : 'Create kit'}</button>
        {onCancel && <button type="button" className="btn-secondary" onClick={onCancel}>Cancel</button>}
      </div>
    </form>
  );
}
