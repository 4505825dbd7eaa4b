import { useCallback, useState } from 'react';

const storageKey = 'benchwire:catalog:columns';

interface StoredChoice {
  /** Columns the user turned off that are on by default. */
  hidden: string[];
  /** Columns the user turned on that are off by default. */
  shown: string[];
}

function readChoice(): StoredChoice {
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

function writeChoice(choice: StoredChoice) {
  try {
    window.localStorage.setItem(storageKey, JSON.stringify(choice));
  } catch {
    // Not remembered, still applied.
  }
}

/**
 * Which catalog columns to show, remembered on this device. Only departures from the defaults are stored, so a
 * column added later (a new price region) follows its default until the user decides.
 */
export function useColumnChoice() {
  const [choice, setChoice] = useState<StoredChoice>(readChoice);

  const isVisible = useCallback(
    (id: string, defaultVisible: boolean) => (defaultVisible ? !choice.hidden.includes(id) : choice.shown.includes(id)),
    [choice],
  );

  const setVisible = useCallback((id: string, defaultVisible: boolean, visible: boolean) => {
    setChoice((current) => {
      const hidden = current.hidden.filter((item) => item !== id);
      const shown = current.shown.filter((item) => item !== id);
      if (defaultVisible && !visible) hidden.push(id);
      if (!defaultVisible && visible) shown.push(id);
      const next = { hidden, shown };
      writeChoice(next);
      return next;
    });
  }, []);

  const reset = useCallback(() => {
    const next = { hidden: [], shown: [] };
    writeChoice(next);
    setChoice(next);
  }, []);

  return { isVisible, setVisible, reset };
}
