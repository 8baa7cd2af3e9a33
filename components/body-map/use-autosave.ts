'use client';

import { useCallback, useEffect, useRef, useState } from 'react';
import { commands, type Editor, type EditorState } from '@/lib/editor';
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
/** During a drag the local backup is written at most this often (and once more when it ends). */
const BACKUP_DURING_DRAG_MS = 500;
const backupKey = (styleId: string) => `needlemap:body-map-backup:${styleId}`;

/** A local copy of unsaved work, as written to localStorage. */
export interface BodyMapBackup { savedAt: number; version: number; panels: Panel[] }

function readBackup(styleId: string): BodyMapBackup | null {
  try {
    const raw = window.localStorage.getItem(backupKey(styleId));
    const b = raw ? (JSON.parse(raw) as Partial<BodyMapBackup>) : null;
    if (!b || typeof b.savedAt !== 'number' || typeof b.version !== 'number' || !Array.isArray(b.panels)) return null;
    return { savedAt: b.savedAt, version: b.version, panels: b.panels };
  } catch {
    return null;
  }
}

/**
 * Saves the body map shortly after edits (never during a drag), retries with backoff while the
 * network or the server is down, stops at a conflict (409) and keeps a local backup of unsaved work,
 * offered back when the map is opened again.
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
  // A backup found on opening that differs from the server's map, offered to restore.
  const [offer, setOffer] = useState<BodyMapBackup | null>(null);
  const backupTimer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const lastBackupAt = useRef(0);

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

  const writeBackup = useCallback(() => {
    const s = editor.getState();
    if (s.readOnly || stopped.current || s.revision === s.savedRevision) return;
    lastBackupAt.current = Date.now();
    try {
      window.localStorage.setItem(backupKey(styleId), JSON.stringify({ savedAt: lastBackupAt.current, version: s.doc.version, panels: s.doc.panels }));
    } catch {
      /* storage full or disabled: the server save still runs */
    }
  }, [editor, styleId]);

  // Keep a local backup of the unsaved document: at once after an edit, at most every 500 ms during a drag, and when the drag ends.
  useEffect(() => {
    if (state.readOnly || stopped.current || !dirty) return;
    if (!state.gesture) {
      if (backupTimer.current) { clearTimeout(backupTimer.current); backupTimer.current = null; }
      writeBackup();
    } else if (!backupTimer.current) {
      backupTimer.current = setTimeout(() => { backupTimer.current = null; writeBackup(); }, Math.max(0, BACKUP_DURING_DRAG_MS - (Date.now() - lastBackupAt.current)));
    }
  }, [state.revision, state.gesture, dirty, state.readOnly, writeBackup]);
  useEffect(() => () => { if (backupTimer.current) clearTimeout(backupTimer.current); }, []);

  // Schedule a save after each change.
  useEffect(() => {
    if (state.readOnly || stopped.current || !dirty) return;
    setStatus((st) => (st.kind === 'retrying' || st.kind === 'saving' ? st : { kind: 'unsaved' }));
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => void save(), attempt.current > 0 ? 500 : DEBOUNCE_MS);
    return () => { if (timer.current) clearTimeout(timer.current); };
  }, [state.revision, state.gesture, dirty, state.readOnly, state.doc, save, styleId]);

  // On opening: a backup of work that never reached the server, based on this version or an older one, is offered back.
  useEffect(() => {
    const s = editor.getState();
    if (s.readOnly) return;
    const b = readBackup(styleId);
    if (!b || b.version > s.doc.version) return;
    const restored = commands.restorePanels(s.doc, b.panels);
    // Panels that no longer match (the garment changed) are left in storage, not offered.
    if (!restored) return;
    if (restored === s.doc) { window.localStorage.removeItem(backupKey(styleId)); return; }
    // Shown after the first paint, so the server-rendered page and the first client render agree.
    const shown = setTimeout(() => setOffer(b), 0);
    return () => clearTimeout(shown);
  }, [editor, styleId]);

  /** Puts the offered backup in place as an undoable edit; it autosaves, at the version it was based on (a newer map gets the conflict). */
  const restoreBackup = useCallback(() => {
    if (!offer) return;
    setOffer(null);
    if (!editor.restorePanels(offer.panels)) return;
    const s = editor.getState();
    if (offer.version < s.doc.version) editor.markSaved(s.savedRevision, offer.version);
  }, [editor, offer]);

  const discardBackup = useCallback(() => {
    if (!offer) return;
    setOffer(null);
    // Only the copy that was offered: edits made since wrote a backup of their own.
    if (readBackup(styleId)?.savedAt === offer.savedAt) window.localStorage.removeItem(backupKey(styleId));
  }, [offer, styleId]);

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

  return { status, reloadLatest, keepCopy, overwrite, saveNow: save, backupOffer: offer, restoreBackup, discardBackup };
}
