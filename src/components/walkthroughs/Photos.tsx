/**
 * Photos of a walkthrough: take or pick one, tag it (and tie it to a finding), upload it with a
 * small thumbnail the browser makes (no image library), see them as thumbnails, retag or remove.
 * Limits are checked here for a quick answer and again by the server, which reads the bytes.
 */
import { useMutation } from '@tanstack/react-query';
import { useRef, useState } from 'react';
import { PHOTO_MAX_BYTES, PHOTO_TAG_LABELS, PHOTO_TAGS, PHOTO_TYPES, type PhotoTag } from '../../lib/field/walkthrough-form';
import { THUMB_MAX_BYTES } from '../../lib/field/photo-type';
import { formatNumber } from '../../lib/format';
import type { PhotoItem } from '../../server/walkthroughs/photos';
import { api, ApiError } from '../ui/api';
import { Field } from '../ui/Field';

export type Photo = PhotoItem;

const TAG_CHOICES = PHOTO_TAGS.map((t) => ({ value: t, label: PHOTO_TAG_LABELS[t] }));

/** A small JPEG made by the browser's own decoder; null where it cannot decode the file (HEIC in most browsers). */
async function thumbnail(file: File): Promise<Blob | null> {
  try {
    const bmp = await createImageBitmap(file);
    const scale = Math.min(1, 320 / Math.max(bmp.width, bmp.height));
    const canvas = document.createElement('canvas');
    canvas.width = Math.max(1, Math.round(bmp.width * scale));
    canvas.height = Math.max(1, Math.round(bmp.height * scale));
    canvas.getContext('2d')!.drawImage(bmp, 0, 0, canvas.width, canvas.height);
    bmp.close();
    const blob = await new Promise<Blob | null>((res) => canvas.toBlob(res, 'image/jpeg', 0.8));
    return blob && blob.size <= THUMB_MAX_BYTES ? blob : null;
  } catch {
    return null;
  }
}

export function PhotoThumb({ photo, size = 'h-24 w-24' }: { photo: Photo; size?: string }) {
  return (
    <a href={photo.url} target="_blank" rel="noopener" className={`block shrink-0 overflow-hidden rounded-md border border-ink-200 bg-ink-50 ${size}`} aria-label={`Open photo: ${PHOTO_TAG_LABELS[photo.tag]}${photo.caption ? `, ${photo.caption}` : ''}`}>
      {photo.thumbUrl ? (
        <img src={photo.thumbUrl} alt="" loading="lazy" className="h-full w-full object-cover" />
      ) : (
        <span className="flex h-full w-full items-center justify-center p-1 text-center text-xs text-ink-600">{PHOTO_TAG_LABELS[photo.tag]} ({photo.mime.replace('image/', '').toUpperCase()})</span>
      )}
    </a>
  );
}

export function Photos({ walkthroughId, photos, findings, editable, onChange }: { walkthroughId: string; photos: Photo[]; findings: { id: string; title: string }[]; editable: boolean; onChange: () => void }) {
  const [tag, setTag] = useState<PhotoTag | ''>('');
  const [caption, setCaption] = useState('');
  const [findingId, setFindingId] = useState('');
  const [file, setFile] = useState<File | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const upload = useMutation({
    mutationFn: async () => {
      const form = new FormData();
      form.set('file', file!);
      form.set('tag', tag);
      form.set('caption', caption);
      if (findingId) form.set('findingId', findingId);
      const thumb = await thumbnail(file!);
      if (thumb) form.set('thumb', new File([thumb], 'thumb.jpg', { type: 'image/jpeg' }));
      return api<Photo>(`/api/walkthroughs/${walkthroughId}/photos`, { method: 'POST', body: form });
    },
    onSuccess: (p) => {
      setNotice(`Photo saved (${PHOTO_TAG_LABELS[p.tag]}).`);
      setFile(null);
      setCaption('');
      if (fileInput.current) fileInput.current.value = '';
      onChange();
    },
    onError: (e) => setError(e instanceof ApiError && e.status === 0 ? 'Not uploaded: no connection. Keep the photo on your phone and upload it when you are back online.' : (e as Error).message),
  });
  const change = useMutation({
    mutationFn: ({ id, patch }: { id: string; patch: Record<string, unknown> }) => api(`/api/photos/${id}`, { method: 'PATCH', body: patch }),
    onSuccess: onChange,
    onError: (e) => setError((e as Error).message),
  });
  const remove = useMutation({
    mutationFn: (id: string) => api(`/api/photos/${id}`, { method: 'DELETE' }),
    onSuccess: onChange,
    onError: (e) => setError((e as Error).message),
  });
  const pick = (f: File | null) => {
    setError(null);
    setNotice(null);
    if (f && f.size > PHOTO_MAX_BYTES) {
      setError(`This photo is ${formatNumber(f.size / 1024 / 1024, 1)} MB; the limit is ${PHOTO_MAX_BYTES / 1024 / 1024} MB.`);
      return setFile(null);
    }
    if (f && f.type && !(PHOTO_TYPES as readonly string[]).includes(f.type)) {
      setError('Choose a JPEG, PNG, WebP or HEIC photo.');
      return setFile(null);
    }
    setFile(f);
  };
  const findingChoices = [{ value: '', label: 'No finding' }, ...findings.map((f) => ({ value: f.id, label: f.title }))];
  return (
    <section className="card space-y-4 p-4 sm:p-5" aria-labelledby="photos-h">
      <h2 id="photos-h">Photos <span className="text-sm font-normal text-ink-600">({photos.length})</span></h2>
      {editable && (
        <form
          className="space-y-3"
          aria-label="Add a photo"
          onSubmit={(e) => {
            e.preventDefault();
            setError(null);
            if (!file) return setError('Take or choose a photo first.');
            if (!tag) return setError('Choose what the photo shows (its tag).');
            upload.mutate();
          }}
        >
          <Field label="Photo" hint={`JPEG, PNG, WebP or HEIC, up to ${PHOTO_MAX_BYTES / 1024 / 1024} MB`}>
            {({ id, describedBy }) => <input id={id} ref={fileInput} type="file" accept="image/jpeg,image/png,image/webp,image/heic,.heic" aria-describedby={describedBy} className="block w-full text-sm file:mr-3 file:min-h-11 file:rounded-md file:border file:border-ink-300 file:bg-white file:px-3" onChange={(e) => pick(e.target.files?.[0] ?? null)} />}
          </Field>
          <div className="grid gap-3 sm:grid-cols-3">
            <Field label="Tag" required>
              {({ id }) => (
                <select id={id} className="field-input min-h-11" value={tag} onChange={(e) => setTag(e.target.value as PhotoTag)}>
                  <option value="">Choose…</option>
                  {TAG_CHOICES.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
                </select>
              )}
            </Field>
            <Field label="Caption">{({ id }) => <input id={id} className="field-input min-h-11" value={caption} maxLength={500} onChange={(e) => setCaption(e.target.value)} />}</Field>
            <Field label="Finding">
              {({ id }) => (
                <select id={id} className="field-input min-h-11" value={findingId} onChange={(e) => setFindingId(e.target.value)}>
                  {findingChoices.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
                </select>
              )}
            </Field>
          </div>
          <button type="submit" className="btn-primary min-h-11 w-full sm:w-auto" disabled={upload.isPending}>{upload.isPending ? 'Uploading…' : 'Upload photo'}</button>
        </form>
      )}
      {error && <p className="notice-error" role="alert">{error}</p>}
      {notice && <p className="notice-info" role="status">{notice}</p>}
      {photos.length === 0 ? (
        <p className="text-sm text-ink-600">No photos yet.</p>
      ) : (
        <ul className="grid gap-3 sm:grid-cols-2" data-testid="photo-list">
          {photos.map((p) => (
            <li key={p.id} className="flex gap-3 rounded-md border border-ink-200 p-2" data-testid="photo">
              <PhotoThumb photo={p} />
              <div className="min-w-0 flex-1 space-y-2 text-sm">
                {editable ? (
                  <>
                    <label className="sr-only" htmlFor={`tag-${p.id}`}>Tag of this photo</label>
                    <select id={`tag-${p.id}`} className="field-input min-h-11" value={p.tag} onChange={(e) => change.mutate({ id: p.id, patch: { tag: e.target.value } })}>
                      {TAG_CHOICES.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
                    </select>
                    <label className="sr-only" htmlFor={`finding-${p.id}`}>Finding of this photo</label>
                    <select id={`finding-${p.id}`} className="field-input min-h-11" value={p.findingId ?? ''} onChange={(e) => change.mutate({ id: p.id, patch: { findingId: e.target.value || null } })}>
                      {findingChoices.map((c) => <option key={c.value} value={c.value}>{c.label}</option>)}
                    </select>
                  </>
                ) : (
                  <p className="font-medium">{PHOTO_TAG_LABELS[p.tag]}</p>
                )}
                {p.caption && <p className="text-ink-700">{p.caption}</p>}
                <p className="text-xs text-ink-500">
                  {formatNumber(p.bytes / 1024, 0)} KB · <a href={`${p.url}?download=1`}>download</a>
                  {editable && (
                    <>
                      {' · '}
                      <button type="button" className="text-brick-ink underline" onClick={() => window.confirm('Remove this photo?') && remove.mutate(p.id)}>
                        remove
                      </button>
                    </>
                  )}
                </p>
              </div>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
