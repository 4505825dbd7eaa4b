import { useCallback, useEffect, useLayoutEffect, useRef, useState } from 'react';
import { isApiError } from '../../../lib/api-client';
import {
  staleVersionDetailsSchema,
  type SectionSummary,
  type StaleVersionDetails,
} from '../../../../shared/schemas/write-ups';
import type { WriteUpDocument } from '../../../../shared/schemas/write-up-document';
import { saveSection } from '../api/save-section';

export type SaveStatus = 'saved' | 'unsaved' | 'saving' | 'failed' | 'conflict';

/** How long after the last keystroke the text is saved. */
export const autosaveDelayMs = 2500;

/**
 * Saves the section a moment after each change, naming the version it started from. A 409 stops saving and hands
 * the other version to the page, which offers "reload theirs" or "keep my copy"; any other failure is shown and the
 * next change (or "Try again") saves again. Nothing typed is dropped: the page warns before leaving unsaved text.
 */
export function useAutosave(options: {
  sectionId: number;
  initialVersion: number;
  getContent: () => WriteUpDocument;
  /** The section title to save with the text; undefined while the title field is not valid (the text still saves). */
  getTitle: () => string | undefined;
  onSaved: (summary: SectionSummary) => void;
}) {
  const { sectionId, getContent, getTitle, onSaved } = options;
  const [status, setStatus] = useState<SaveStatus>('saved');
  const [error, setError] = useState<string | null>(null);
  const [conflict, setConflict] = useState<StaleVersionDetails | null>(null);
  const version = useRef(options.initialVersion);
  const dirty = useRef(false);
  const saving = useRef(false);
  const inConflict = useRef(false);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const latest = useRef({ getContent, getTitle, onSaved });
  useLayoutEffect(() => {
    latest.current = { getContent, getTitle, onSaved };
  });
  const flushLater = useRef<() => void>(() => undefined);

  const flush = useCallback(async () => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    if (saving.current || !dirty.current || inConflict.current) return;
    saving.current = true;
    dirty.current = false;
    setStatus('saving');
    try {
      const summary = await saveSection(sectionId, {
        baseVersion: version.current,
        title: latest.current.getTitle(),
        content: latest.current.getContent(),
      });
      version.current = summary.version;
      setError(null);
      latest.current.onSaved(summary);
      setStatus(dirty.current ? 'unsaved' : 'saved');
    } catch (caught) {
      dirty.current = true;
      const details = isApiError(caught) ? staleVersionDetailsSchema.safeParse(caught.details) : null;
      if (isApiError(caught) && caught.code === 'stale_version' && details?.success) {
        inConflict.current = true;
        setConflict(details.data);
        setError(caught.message);
        setStatus('conflict');
      } else {
        setError(isApiError(caught) ? caught.message : 'The section could not be saved.');
        setStatus('failed');
      }
    } finally {
      saving.current = false;
    }
    if (dirty.current && !inConflict.current && timer.current === null) {
      timer.current = setTimeout(() => flushLater.current(), autosaveDelayMs);
    }
  }, [sectionId]);
  useEffect(() => {
    flushLater.current = () => void flush();
  }, [flush]);

  const markChanged = useCallback(() => {
    dirty.current = true;
    if (inConflict.current) return;
    setStatus((current) => (current === 'saving' ? current : 'unsaved'));
    if (timer.current) clearTimeout(timer.current);
    timer.current = setTimeout(() => void flush(), autosaveDelayMs);
  }, [flush]);

  /** After "reload theirs": the editor now shows their version, which is saved. */
  const acceptTheirs = useCallback((theirs: StaleVersionDetails['current']) => {
    version.current = theirs.version;
    dirty.current = false;
    inConflict.current = false;
    setConflict(null);
    setError(null);
    setStatus('saved');
  }, []);

  /** "Keep my copy": save this text on top of theirs (theirs stays in the history). */
  const keepMine = useCallback(
    (theirs: StaleVersionDetails['current']) => {
      version.current = theirs.version;
      inConflict.current = false;
      dirty.current = true;
      setConflict(null);
      void flush();
    },
    [flush],
  );

  /** A restore or reload from the server replaced the text: start from that version. */
  const reset = useCallback((nextVersion: number) => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    version.current = nextVersion;
    dirty.current = false;
    inConflict.current = false;
    setConflict(null);
    setError(null);
    setStatus('saved');
  }, []);

  useEffect(() => {
    const warn = (event: BeforeUnloadEvent) => {
      if (dirty.current || saving.current) event.preventDefault();
    };
    window.addEventListener('beforeunload', warn);
    return () => {
      window.removeEventListener('beforeunload', warn);
      if (timer.current) clearTimeout(timer.current);
      // Leaving the screen inside the autosave pause: save what is there.
      if (dirty.current && !saving.current && !inConflict.current) void flush();
    };
  }, [flush]);

  return { status, error, conflict, markChanged, flush, acceptTheirs, keepMine, reset, version };
}
