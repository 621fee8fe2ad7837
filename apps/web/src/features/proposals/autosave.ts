import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useLayoutEffect, useRef, useState } from 'react';
import { useWatch, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form';
import { isApiError } from '@/lib/api-client';
import { setServerErrors } from '@/lib/form-errors';
import type { Proposal } from './api';
import { isStale, writeProposal } from './hooks';

export type SaveState =
  | { kind: 'idle' }
  | { kind: 'saving' }
  | { kind: 'saved'; at: Date }
  /** The server refused some fields; their messages are under them. */
  | { kind: 'invalid' }
  /** No answer, or the server failed: the same change can be sent again. */
  | { kind: 'failed'; message: string }
  /** Someone else saved first (409): nothing more is sent until the user decides. */
  | { kind: 'conflict' };

export interface AutosaveOptions<T extends FieldValues> {
  reference: string;
  form: UseFormReturn<T>;
  /** The fields saved; a server issue about any other goes to the form's own error. */
  fields: readonly Path<T>[];
  /** The write for the fields that changed since the last save. */
  send: (version: number, changed: Partial<T>) => Promise<Proposal>;
  enabled: boolean;
  delayMs?: number;
}

/** The fields whose value differs from what the server is known to hold. */
function changedFields<T extends FieldValues>(
  values: T,
  saved: T,
  fields: readonly Path<T>[],
): Partial<T> | null {
  const changed: Partial<T> = {};
  let any = false;
  for (const field of fields) {
    const key = field as keyof T;
    if (values[key] !== saved[key]) {
      changed[key] = values[key];
      any = true;
    }
  }
  return any ? changed : null;
}

/**
 * Saves a form as the user types: a moment (800 ms) after the typing stops, at once when a
 * field loses focus, and as the form goes away. One write at a time, each with the newest
 * version the client holds; what is typed during a write goes in the next. A failed write never
 * touches the form, so no typed text is lost.
 */
export function useAutosave<T extends FieldValues>({
  reference,
  form,
  fields,
  send,
  enabled,
  delayMs = 800,
}: AutosaveOptions<T>) {
  const queryClient = useQueryClient();
  const [state, setState] = useState<SaveState>({ kind: 'idle' });
  const saved = useRef<T>(form.getValues());
  const inFlight = useRef(false);
  const again = useRef(false);
  const halted = useRef(false);
  const timer = useRef<number | undefined>(undefined);
  // The latest options, for a save that runs after a re-render (or after the form has gone).
  const latest = useRef({ send, enabled, fields });
  useLayoutEffect(() => {
    latest.current = { send, enabled, fields };
  });

  const save = useCallback(async (): Promise<void> => {
    window.clearTimeout(timer.current);
    if (!latest.current.enabled || halted.current) return;
    if (inFlight.current) {
      again.current = true;
      return;
    }
    inFlight.current = true;
    try {
      // What is typed while a write is on its way goes in the next one, with the new version.
      for (;;) {
        again.current = false;
        const { send: write, fields: names } = latest.current;
        const changed = changedFields(form.getValues(), saved.current, names);
        if (!changed) break;
        setState({ kind: 'saving' });
        try {
          await writeProposal(queryClient, reference, (version) => write(version, changed));
        } catch (error) {
          if (isStale(error)) {
            halted.current = true;
            setState({ kind: 'conflict' });
          } else if (isApiError(error, 400)) {
            setServerErrors(error, form.setError, names);
            setState({ kind: 'invalid' });
          } else {
            setState({
              kind: 'failed',
              message: error instanceof Error ? error.message : 'The change was not saved.',
            });
          }
          break;
        }
        saved.current = { ...saved.current, ...changed };
        for (const name of Object.keys(changed)) form.clearErrors(name as Path<T>);
        setState({ kind: 'saved', at: new Date() });
        if (!again.current) break;
      }
    } finally {
      inFlight.current = false;
    }
  }, [form, queryClient, reference]);

  const values = useWatch({ control: form.control });
  const snapshot = JSON.stringify(values);
  useEffect(() => {
    if (!enabled || halted.current) return;
    if (!changedFields(form.getValues(), saved.current, fields)) return;
    timer.current = window.setTimeout(() => void save(), delayMs);
    return () => window.clearTimeout(timer.current);
    // `snapshot` stands for the values: a new object each render, the same text when unchanged.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [snapshot, enabled, delayMs, save]);

  // Leaving the section (or the editor) saves what is pending rather than dropping it.
  useEffect(() => () => void save(), [save]);

  /**
   * After a conflict: take the server's version as the new starting point. `keepMine` keeps the
   * fields the user changed and sends them again on top of it (the other fields show theirs);
   * otherwise the form shows their version whole.
   */
  const resolve = useCallback(
    (theirs: T, keepMine: boolean) => {
      const mine = keepMine
        ? changedFields(form.getValues(), saved.current, latest.current.fields)
        : null;
      saved.current = theirs;
      halted.current = false;
      if (!mine) {
        form.reset(theirs);
        setState({ kind: 'idle' });
        return;
      }
      form.reset({ ...theirs, ...mine }, { keepDirty: false });
      void save();
    },
    [form, save],
  );

  return { state, save, resolve };
}
