import { useCallback, useEffect, useRef, useState } from 'react';
import type { CheckKind } from '@shared/schemas/limits';
import { discardDraft, openDraft, saveDraft, type CheckDraft, type DraftOwner } from './check-draft';

export interface CheckDraftState {
  draft: CheckDraft | null;
  /** False when the tablet's storage failed: the check runs, but a reload would lose it. */
  stored: boolean;
  update: (change: (current: CheckDraft) => CheckDraft) => void;
  /** Stops saving and removes the kept draft (after the server accepted it, or it went to the send queue). */
  discard: () => Promise<void>;
}

/** The draft of this owner's check, loaded from the tablet and saved back on every change. */
export function useCheckDraft(owner: DraftOwner, airframeId: number, kind: CheckKind): CheckDraftState {
  const [draft, setDraft] = useState<CheckDraft | null>(null);
  const [stored, setStored] = useState(true);
  const discarded = useRef(false);

  useEffect(() => {
    let live = true;
    discarded.current = false;
    setDraft(null);
    void openDraft(owner, airframeId, kind).then((opened) => {
      if (!live) return;
      setStored(opened.stored);
      setDraft(opened.draft);
    });
    return () => {
      live = false;
    };
  }, [owner, airframeId, kind]);

  useEffect(() => {
    if (draft && !discarded.current) saveDraft(owner, draft).catch(() => setStored(false));
  }, [owner, draft]);

  const update = useCallback(
    (change: (current: CheckDraft) => CheckDraft) =>
      setDraft((current) => (current ? change(current) : current)),
    [],
  );
  const discard = useCallback(async () => {
    discarded.current = true;
    await discardDraft(owner, airframeId, kind).catch(() => undefined);
  }, [owner, airframeId, kind]);

  return { draft, stored, update, discard };
}
