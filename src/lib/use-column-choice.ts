import { useCallback, useState } from 'react';

interface StoredChoice {
  /** Columns the user turned off that are on by default. */
  hidden: string[];
  /** Columns the user turned on that are off by default. */
  shown: string[];
}

function readChoice(storageKey: string): StoredChoice {
  try {
    const raw = window.localStorage.getItem(storageKey);
    const parsed: unknown = raw ? JSON.parse(raw) : null;
    if (parsed && typeof parsed === 'object') {
      const { hidden, shown } = parsed as Partial<StoredChoice>;
      const strings = (value: unknown) =>
        Array.isArray(value) ? value.filter((item): item is string => typeof item === 'string') : [];
      return { hidden: strings(hidden), shown: strings(shown) };
    }
  } catch {
    // Storage can be off (private windows, strict settings): the defaults then apply for this visit.
  }
  return { hidden: [], shown: [] };
}

function writeChoice(storageKey: string, choice: StoredChoice) {
  try {
    window.localStorage.setItem(storageKey, JSON.stringify(choice));
  } catch {
    // Not remembered, still applied.
  }
}

export interface ColumnChoice {
  isVisible: (id: string, defaultVisible: boolean) => boolean;
  setVisible: (id: string, defaultVisible: boolean, visible: boolean) => void;
  reset: () => void;
}

/**
 * Which columns of a table to show, remembered on this device under `storageKey`. Only departures from the
 * defaults are stored, so a column added later (a new price region) follows its default until the user decides.
 * Without a key nothing is stored and every column follows its default.
 */
export function useColumnChoice(storageKey: string | undefined): ColumnChoice {
  const [choice, setChoice] = useState<StoredChoice>(() =>
    storageKey ? readChoice(storageKey) : { hidden: [], shown: [] },
  );

  const isVisible = useCallback(
    (id: string, defaultVisible: boolean) => (defaultVisible ? !choice.hidden.includes(id) : choice.shown.includes(id)),
    [choice],
  );

  const setVisible = useCallback(
    (id: string, defaultVisible: boolean, visible: boolean) => {
      setChoice((current) => {
        const hidden = current.hidden.filter((item) => item !== id);
        const shown = current.shown.filter((item) => item !== id);
        if (defaultVisible && !visible) hidden.push(id);
        if (!defaultVisible && visible) shown.push(id);
        const next = { hidden, shown };
        if (storageKey) writeChoice(storageKey, next);
        return next;
      });
    },
    [storageKey],
  );

  const reset = useCallback(() => {
    const next = { hidden: [], shown: [] };
    if (storageKey) writeChoice(storageKey, next);
    setChoice(next);
  }, [storageKey]);

  return { isVisible, setVisible, reset };
}
