import { useRef, type KeyboardEvent } from 'react';

/**
 * For a `<details>` menu: Escape folds it and puts focus back on its summary, as a menu button would.
 * Spread the result on the `<details>` element.
 */
export function useDisclosureEscape() {
  const ref = useRef<HTMLDetailsElement>(null);
  const onKeyDown = (event: KeyboardEvent<HTMLDetailsElement>) => {
    if (event.key !== 'Escape' || !ref.current?.open) return;
    event.preventDefault();
    ref.current.open = false;
    ref.current.querySelector('summary')?.focus();
  };
  return { ref, onKeyDown };
}
