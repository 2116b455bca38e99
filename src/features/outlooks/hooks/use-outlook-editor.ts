import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useReducer, useRef, useState } from 'react';
import { isApiError } from '../../../lib/api-client';
import type { Outlook } from '../../../../shared/contracts/outlooks';
import { getOutlook } from '../../../api/outlooks/get-outlook';
import { outlooksKeys } from '../../../api/outlooks/outlooks-keys';
import { saveOutlook } from '../../../api/outlooks/save-outlook';
import { canRedo, canUndo, historyReducer, startHistory } from '../utils/document-history';
import { documentFromOutlook, sameDocument, saveInputFrom, type OutlookDocument } from '../utils/outlook-document';
import { AUTOSAVE_DELAY_MS, savePhase, shouldAutosave, type SaveFacts } from '../utils/save-state';

interface SavedPoint {
  document: OutlookDocument;
  version: number;
  at: string | null;
}

const CONFLICT_FALLBACK = 'This outlook was changed by someone else since you opened it.';

function messageOf(error: unknown): string {
  if (isApiError(error)) return error.issues[0]?.message ?? error.message;
  return 'The draft could not be saved. Check your connection; we will try again after your next change.';
}

/**
 * The workspace's document: undo/redo history, autosave ~2 s after the last change with the
 * version it was loaded at, and the conflict flow. A stale save (409) never overwrites: the
 * author chooses Reload (take theirs) or Keep mine (re-send this document on the new version).
 */
export function useOutlookEditor(initial: Outlook, editable: boolean) {
  const queryClient = useQueryClient();
  const outlookId = initial.id;
  const [history, dispatch] = useReducer(historyReducer<OutlookDocument>, initial, (outlook) => startHistory(documentFromOutlook(outlook)));
  const [saved, setSaved] = useState<SavedPoint>(() => ({ document: history.present, version: initial.version, at: initial.updatedAt }));
  const [server, setServer] = useState<Outlook>(initial);
  const [saving, setSaving] = useState(false);
  const [conflict, setConflict] = useState<string | null>(null);
  const [error, setError] = useState<{ message: string; document: OutlookDocument } | null>(null);
  const present = history.present;
  const dirty = useMemo(() => !sameDocument(present, saved.document), [present, saved.document]);
  const inFlight = useRef(false);

  const afterSave = useCallback(
    (outlook: Outlook, sent: OutlookDocument) => {
      setSaved({ document: sent, version: outlook.version, at: outlook.updatedAt });
      setServer(outlook);
      setError(null);
      queryClient.setQueryData(outlooksKeys.detail(outlookId), outlook);
      // The detail was just set; the evidence candidates depend on the soundings, not on the draft.
      void queryClient.invalidateQueries({ queryKey: outlooksKeys.all, predicate: (query) => query.queryKey[1] !== 'detail' && query.queryKey[1] !== 'evidence-candidates' });
    },
    [queryClient, outlookId],
  );

  const send = useCallback(
    async (document: OutlookDocument, version: number) => {
      if (inFlight.current) return;
      inFlight.current = true;
      setSaving(true);
      try {
        const outlook = await saveOutlook(outlookId, saveInputFrom(document, version));
        afterSave(outlook, document);
      } catch (cause) {
        if (isApiError(cause) && cause.code === 'CONFLICT') setConflict(cause.message || CONFLICT_FALLBACK);
        else setError({ message: messageOf(cause), document });
      } finally {
        inFlight.current = false;
        setSaving(false);
      }
    },
    [outlookId, afterSave],
  );

  const facts: SaveFacts = {
    editable,
    readOnlyReason: 'Only drafts are edited here.',
    dirty,
    saving,
    conflict,
    error: error?.message ?? null,
    lastSavedAt: saved.at,
  };
  const autosave = shouldAutosave(facts) && error?.document !== present;

  useEffect(() => {
    if (!autosave) return;
    const timer = window.setTimeout(() => void send(present, saved.version), AUTOSAVE_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [autosave, present, saved.version, send]);

  // Leaving with unsaved work asks first (the browser shows its own wording).
  useEffect(() => {
    if (!dirty) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [dirty]);

  const change = useCallback((document: OutlookDocument, group?: string) => dispatch({ type: 'change', document, group, at: Date.now() }), []);

  /** Reload: discard mine, take the current saved version. */
  const reload = useCallback(async () => {
    const outlook = await getOutlook(outlookId);
    const document = documentFromOutlook(outlook);
    dispatch({ type: 'reset', document });
    setSaved({ document, version: outlook.version, at: outlook.updatedAt });
    setServer(outlook);
    setConflict(null);
    setError(null);
    queryClient.setQueryData(outlooksKeys.detail(outlookId), outlook);
  }, [outlookId, queryClient]);

  /** Keep mine: read the current version, then send my document on top of it (a new revision; theirs stays in the history). */
  const keepMine = useCallback(async () => {
    const outlook = await getOutlook(outlookId);
    setConflict(null);
    await send(present, outlook.version);
  }, [outlookId, present, send]);

  return {
    document: present,
    server,
    version: saved.version,
    phase: savePhase(facts),
    dirty,
    change,
    undo: () => dispatch({ type: 'undo' }),
    redo: () => dispatch({ type: 'redo' }),
    canUndo: canUndo(history),
    canRedo: canRedo(history),
    saveNow: () => void send(present, saved.version),
    reload,
    keepMine,
  };
}

export type OutlookEditor = ReturnType<typeof useOutlookEditor>;
