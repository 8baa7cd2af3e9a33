'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import type { Editor, EditorState } from '@/lib/editor';
import type { Panel } from '@/lib/knit/panel';
import { api, ApiError } from '@/lib/api/client';

export type SaveStatus =
  | { kind: 'saved'; at: Date | null }
  | { kind: 'unsaved' }
  | { kind: 'saving' }
  | { kind: 'retrying'; attempt: number; message: string; nextInMs: number }
  | { kind: 'conflict'; message: string }
  | { kind: 'invalid'; message: string }
  | { kind: 'read-only' };

const DEBOUNCE_MS = 1200;
const backupKey = (styleId: string) => `needlemap:body-map-backup:${styleId}`;

/**
 * Saves the body map shortly after edits (never during a drag), retries with backoff while the
 * network or the server is down, stops at a conflict (409) and keeps a local backup of unsaved work.
 */
export function useAutosave(editor: Editor, state: EditorState, styleId: string) {
  const [status, setStatus] = useState<SaveStatus>(state.readOnly ? { kind: 'read-only' } : { kind: 'saved', at: null });
  const inFlight = useRef(false);
  const attempt = useRef(0);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const stopped = useRef(false);
  // The latest save function, for timers set inside it (a retry calls the save that is current then).
  const saveRef = useRef<() => Promise<void>>(async () => {});

  const dirty = state.revision !== state.savedRevision;

  const save = useCallback(async () => {
    if (inFlight.current || stopped.current) return;
    const s = editor.getState();
    if (s.readOnly || s.revision === s.savedRevision) return;
    if (s.gesture) return; // the drag's end triggers another pass
    inFlight.current = true;
    const revision = s.revision;
    setStatus({ kind: 'saving' });
    try {
      const res = await api<{ version: number }>(`/api/styles/${styleId}/body-map`, {
        method: 'PUT',
        json: { version: s.doc.version, panels: s.doc.panels },
      });
      attempt.current = 0;
      editor.markSaved(revision, res.version);
      window.localStorage.removeItem(backupKey(styleId));
      setStatus(editor.getState().revision === revision ? { kind: 'saved', at: new Date() } : { kind: 'unsaved' });
    } catch (err) {
      if (err instanceof ApiError && err.status === 409) {
        stopped.current = true;
        setStatus({ kind: 'conflict', message: err.message });
      } else if (err instanceof ApiError && err.status >= 400 && err.status < 500 && err.status !== 429) {
        const detail = Object.values(err.fieldErrors).flat()[0];
        setStatus({ kind: 'invalid', message: detail ? `${err.message} ${detail}` : err.message });
      } else {
        attempt.current += 1;
        const nextInMs = Math.min(30_000, 1000 * 2 ** Math.min(attempt.current, 5));
        setStatus({
          kind: 'retrying',
          attempt: attempt.current,
          nextInMs,
          message: err instanceof Error ? err.message : 'The server could not be reached.',
        });
        timer.current = setTimeout(() => void saveRef.current(), nextInMs);
      }
    } finally {
      inFlight.current = false;
    }
  }, [editor, styleId]);
  useEffect(() => { saveRef.current = save; }, [save]);

  // Schedule a save after each change (and keep a local backup of the unsaved document).
  useEffect(() => {
    if (state.readOnly || stopped.current || !dirty) return;
    try {
      window.localStorage.setItem(backupKey(styleId), JSON.stringify({ savedAt: Date.now(), version: state.doc.version, panels: state.doc.panels }));
    } catch {
      /* storage full or disabled: the server save still runs */
    }
    setStatus((st) => (st.kind === 'retrying' || st.kind === 'saving' ? st : { kind: 'unsaved' }));
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => void save(), attempt.current > 0 ? 500 : DEBOUNCE_MS);
    return () => { if (timer.current) clearTimeout(timer.current); };
  }, [state.revision, state.gesture, dirty, state.readOnly, state.doc, save, styleId]);

  // Warn before leaving with unsaved work.
  useEffect(() => {
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      const s = editor.getState();
      if (s.revision !== s.savedRevision) { e.preventDefault(); }
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, [editor]);

  // Retry at once when the browser comes back online.
  useEffect(() => {
    const online = () => { if (attempt.current > 0) void save(); };
    window.addEventListener('online', online);
    return () => window.removeEventListener('online', online);
  }, [save]);

  const reloadLatest = useCallback(async () => {
    const res = await api<{ version: number; panels: Panel[] }>(`/api/styles/${styleId}/body-map`);
    editor.loadDocument({ version: res.version, panels: res.panels });
    stopped.current = false;
    attempt.current = 0;
    window.localStorage.removeItem(backupKey(styleId));
    setStatus({ kind: 'saved', at: new Date() });
  }, [editor, styleId]);

  /** Downloads the local document as JSON, so nothing is lost whatever the designer decides. */
  const keepCopy = useCallback(() => {
    const s = editor.getState();
    const blob = new Blob([JSON.stringify({ styleId, version: s.doc.version, panels: s.doc.panels }, null, 2)], { type: 'application/json' });
    const a = document.createElement('a');
    a.href = URL.createObjectURL(blob);
    a.download = `body-map-${styleId.slice(0, 8)}-my-copy.json`;
    a.click();
    URL.revokeObjectURL(a.href);
  }, [editor, styleId]);

  /** After a conflict: save the local document over the newer one, on purpose. */
  const overwrite = useCallback(async () => {
    const latest = await api<{ version: number }>(`/api/styles/${styleId}/body-map`);
    const s = editor.getState();
    editor.markSaved(s.savedRevision, latest.version);
    stopped.current = false;
    await save();
  }, [editor, save, styleId]);

  return { status, reloadLatest, keepCopy, overwrite, saveNow: save };
}
