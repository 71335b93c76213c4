'use client';
import { useEffect, useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { mutate } from 'swr';
import { ApiError, sendJson } from '@/components/fetcher';
import { useOnline } from '@/components/offline/offline-banner';
import type { NoteDto } from '@/lib/data/notes';
import { noteInputSchema, type NoteInput, type NoteStatus } from '@/lib/validation/notes';
import { LinkPicker, onOwnLine } from './link-picker';

const PREVIEW_DELAY_MS = 350;

function usePreview(body: string) {
  const [html, setHtml] = useState<string>('');
  const [state, setState] = useState<'idle' | 'loading' | 'error'>('idle');
  useEffect(() => {
    const ctrl = new AbortController();
    const t = setTimeout(async () => {
      setState('loading');
      try {
        const res = await fetch('/api/notes/preview', {
          method: 'POST',
          headers: { 'content-type': 'application/json', accept: 'application/json' },
          body: JSON.stringify({ body }),
          signal: ctrl.signal,
        });
        if (!res.ok) throw new Error(String(res.status));
        setHtml(((await res.json()) as { html: string }).html);
        setState('idle');
      } catch (e) {
        if ((e as Error).name !== 'AbortError') setState('error');
      }
    }, PREVIEW_DELAY_MS);
    return () => {
      clearTimeout(t);
      ctrl.abort();
    };
  }, [body]);
  return { html, state };
}

export function NoteEditor({ note }: { note?: NoteDto }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const online = useOnline();
  const bodyRef = useRef<HTMLTextAreaElement | null>(null);
  const {
    register,
    handleSubmit,
    watch,
    setValue,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<NoteInput>({
    resolver: zodResolver(noteInputSchema),
    defaultValues: note
      ? { title: note.title, meetingDate: note.meetingDate, body: note.body, status: note.status }
      : { title: '', meetingDate: new Date().toISOString().slice(0, 10), body: '', status: 'draft' },
  });
  const body = watch('body');
  const preview = usePreview(body);
  const { ref: bodyRegisterRef, ...bodyField } = register('body');

  function insertAtCursor(markdown: string) {
    const el = bodyRef.current;
    const current = el?.value ?? body;
    const start = el?.selectionStart ?? current.length;
    const end = el?.selectionEnd ?? current.length;
    const { text, caret } = onOwnLine(current.slice(0, start), markdown, current.slice(end));
    setValue('body', text, { shouldDirty: true });
    requestAnimationFrame(() => {
      if (!el) return;
      el.focus();
      el.setSelectionRange(caret, caret);
    });
  }

  const save = (status: NoteStatus) =>
    handleSubmit(async (values) => {
      setMessage(null);
      try {
        const payload = { ...values, status };
        const res = note
          ? await sendJson<{ note: NoteDto }>(`/api/notes/${note.slug}`, 'PATCH', { ...payload, expectedUpdatedAt: note.updatedAt })
          : await sendJson<{ note: NoteDto }>('/api/notes', 'POST', payload);
        await mutate((k) => typeof k === 'string' && k.startsWith('/api/notes'));
        router.push(`/notes/${res.note.slug}?saved=${res.note.status}`);
        router.refresh();
      } catch (e) {
        if (e instanceof ApiError && e.body.fields) {
          for (const [field, msgs] of Object.entries(e.body.fields)) setError(field as keyof NoteInput, { message: msgs[0] });
        }
        setMessage(e instanceof Error ? e.message : 'Could not save the note.');
      }
    })();

  const published = note?.status === 'published';

  return (
    <form
      onSubmit={(e) => {
        e.preventDefault();
        void save(published ? 'published' : 'draft');
      }}
      className="space-y-5"
      noValidate
      data-testid="note-editor"
    >
      <div className="grid gap-4 sm:grid-cols-[1fr_14rem]">
        <div>
          <label htmlFor="title" className="field-label">
            Title
          </label>
          <input
            id="title"
            className="field-input"
            {...register('title')}
            aria-invalid={!!errors.title}
            aria-describedby={errors.title ? 'title-error' : undefined}
          />
          {errors.title ? (
            <p id="title-error" className="field-error">
              {errors.title.message}
            </p>
          ) : null}
        </div>
        <div>
          <label htmlFor="meetingDate" className="field-label">
            Meeting date
          </label>
          <input
            id="meetingDate"
            type="date"
            className="field-input"
            {...register('meetingDate')}
            aria-invalid={!!errors.meetingDate}
            aria-describedby={errors.meetingDate ? 'meetingDate-error' : undefined}
          />
          {errors.meetingDate ? (
            <p id="meetingDate-error" className="field-error">
              {errors.meetingDate.message}
            </p>
          ) : null}
        </div>
      </div>

      <LinkPicker onInsert={insertAtCursor} />

      <div className="grid gap-4 lg:grid-cols-2">
        <div>
          <label htmlFor="body" className="field-label">
            Note (Markdown)
          </label>
          <textarea
            id="body"
            rows={22}
            className="field-input font-mono text-sm"
            {...bodyField}
            ref={(el) => {
              bodyRegisterRef(el);
              bodyRef.current = el;
            }}
            aria-invalid={!!errors.body}
            aria-describedby={`body-hint${errors.body ? ' body-error' : ''}`}
          />
          <p id="body-hint" className="mt-1 text-sm text-stone-700">
            Links to <code>/answers/…</code> and <code>/species/…</code> become preview cards. Raw HTML is removed.
          </p>
          {errors.body ? (
            <p id="body-error" className="field-error">
              {errors.body.message}
            </p>
          ) : null}
        </div>
        <section aria-labelledby="preview-heading" className="min-w-0">
          <h2 id="preview-heading" className="field-label font-sans text-sm">
            Preview {preview.state === 'loading' ? <span className="font-normal text-stone-600">(updating…)</span> : null}
            {preview.state === 'error' ? <span className="font-normal text-clay-700">(could not update)</span> : null}
          </h2>
          <div
            className="card prose prose-stone max-w-none min-h-40 overflow-auto"
            data-testid="note-preview"
            // Sanitized on the server by the shared Markdown pipeline.
            dangerouslySetInnerHTML={{ __html: preview.html }}
          />
        </section>
      </div>

      <div className="flex flex-wrap items-center gap-3">
        {published ? (
          <>
            <button type="button" className="btn-primary" disabled={isSubmitting || !online} onClick={() => void save('published')}>
              Save and keep published
            </button>
            <button type="button" className="btn-secondary" disabled={isSubmitting || !online} onClick={() => void save('draft')}>
              Unpublish (back to draft)
            </button>
          </>
        ) : (
          <>
            <button type="button" className="btn-secondary" disabled={isSubmitting || !online} onClick={() => void save('draft')}>
              Save draft
            </button>
            <button type="button" className="btn-primary" disabled={isSubmitting || !online} onClick={() => void save('published')}>
              Publish
            </button>
          </>
        )}
        {!online && (
          <span className="text-sm text-stone-900" data-testid="note-offline">
            Saving a note needs a connection; keep this page open and save when you are back online.
          </span>
        )}
        <span role="status" className="text-sm text-clay-700">
          {message}
        </span>
      </div>
    </form>
  );
}
