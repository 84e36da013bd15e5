/**
 * What the inline edit of a harvest and of bought food share: the PATCH through TanStack Query
 * (checked first with the same zod schema as the endpoint, the API's field messages shown next to
 * the fields), and the row that holds the form with its title and Save / Cancel buttons. Each list
 * brings only its own fields.
 */
import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import { useState, type FormEvent, type ReactNode } from 'react';
import type { z } from 'zod';
import { zodErrorBody } from '@/lib/entry-schemas';
import { ApiError, request } from './api';
import type { Errors } from './ui';

/**
 * Validates a changed entry with `schema` and sends it as a PATCH to `url`; on success refreshes
 * `invalidate`, hands the answer to `onSaved` (to offer Undo) and calls `onDone`.
 * Example: `const { errors, send, saving } = useEntryPatch(harvestPatch, url, [keys.harvests(7)], close)`
 */
export function useEntryPatch<A = unknown>(schema: z.ZodType, url: string, invalidate: QueryKey[], onDone: () => void, onSaved?: (answer: A) => void) {
  const qc = useQueryClient();
  const [errors, setErrors] = useState<Errors>({});
  const save = useMutation({
    mutationFn: (body: unknown) => request<A>('PATCH', url, body),
    onSuccess: (answer) => {
      for (const queryKey of invalidate) void qc.invalidateQueries({ queryKey });
      onSaved?.(answer);
      onDone();
    },
    onError: (e) => setErrors(e instanceof ApiError && Object.keys(e.fields).length ? e.fields : { _form: (e as Error).message }),
  });
  function send(value: unknown) {
    const r = schema.safeParse(value);
    if (!r.success) return setErrors(zodErrorBody(r.error).fields);
    setErrors({});
    save.mutate(r.data);
  }
  return { errors, send, saving: save.isPending };
}

/**
 * The table row around an edit form. `layout` names the grid's Tailwind classes as literals at the
 * call site (e.g. `{ grid: 'sm:grid-cols-5', span: 'sm:col-span-5' }`), so the build keeps them.
 */
export function EditRowShell(props: {
  colSpan: number;
  label: string;
  title: string;
  layout: { grid: string; span: string };
  saving: boolean;
  formError: string | undefined;
  /** Why the changes cannot be saved yet (Save is disabled and this is said beside it), or undefined. */
  blocked?: string | undefined;
  onSubmit: () => void;
  onCancel: () => void;
  children: ReactNode;
}) {
  const { span } = props.layout;
  const blockedId = `${props.label.replace(/[^A-Za-z0-9]+/g, '-')}-blocked`;
  function submit(e: FormEvent) {
    e.preventDefault();
    if (!props.blocked) props.onSubmit();
  }
  return (
    <tr className="border-b border-loam-200 bg-rind-100/50 max-sm:block">
      <td colSpan={props.colSpan} className="px-3 py-3 max-sm:block">
        <form onSubmit={submit} noValidate aria-label={props.label} className={`grid gap-3 ${props.layout.grid} sm:items-start`}>
          <p className={`font-bold ${span}`}>{props.title}</p>
          {props.children}
          <div className={`flex flex-wrap gap-2 ${span}`}>
            <button type="submit" className="btn-primary" disabled={props.saving || props.blocked !== undefined} aria-describedby={props.blocked ? blockedId : undefined}>
              {props.saving ? 'Saving…' : 'Save changes'}
            </button>
            <button type="button" className="btn-quiet" onClick={props.onCancel}>
              Cancel
            </button>
          </div>
          {props.blocked ? (
            <p id={blockedId} className={`font-semibold text-berry-700 ${span}`} data-testid="edit-blocked">
              {props.blocked}
            </p>
          ) : null}
          {props.formError ? (
            <p role="alert" className={`font-semibold text-berry-700 ${span}`}>
              {props.formError}
            </p>
          ) : null}
        </form>
      </td>
    </tr>
  );
}
