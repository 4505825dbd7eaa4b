import { useId, useRef, type KeyboardEvent, type ReactNode } from 'react';
import { cx } from '../../../lib/class-names';

export interface DetailTab {
  id: string;
  label: string;
  /** A short count or flag after the label, e.g. "2 overdue". */
  badge?: ReactNode;
  content: ReactNode;
}

export interface DetailTabsProps {
  label: string;
  tabs: readonly DetailTab[];
  selected: string;
  onSelect: (id: string) => void;
}

/**
 * Tabs in the ARIA pattern: arrow keys move between tabs (and select), Home/End jump, Tab moves into the panel.
 * Only the selected panel is rendered, so its data loads when it is opened.
 */
export function DetailTabs({ label, tabs, selected, onSelect }: DetailTabsProps) {
  const baseId = useId();
  const refs = useRef(new Map<string, HTMLButtonElement>());
  const current = tabs.find((tab) => tab.id === selected) ?? tabs[0];

  const onKeyDown = (event: KeyboardEvent, index: number) => {
    const last = tabs.length - 1;
    const target =
      event.key === 'ArrowRight'
        ? index === last
          ? 0
          : index + 1
        : event.key === 'ArrowLeft'
          ? index === 0
            ? last
            : index - 1
          : event.key === 'Home'
            ? 0
            : event.key === 'End'
              ? last
              : null;
    if (target === null) return;
    event.preventDefault();
    onSelect(tabs[target].id);
    refs.current.get(tabs[target].id)?.focus();
  };

  return (
    <div>
      <div role="tablist" aria-label={label} className="mb-4 flex gap-1 overflow-x-auto border-b border-rule">
        {tabs.map((tab, index) => {
          const active = tab.id === current.id;
          return (
            <button
              key={tab.id}
              ref={(element) => {
                if (element) refs.current.set(tab.id, element);
                else refs.current.delete(tab.id);
              }}
              type="button"
              role="tab"
              id={`${baseId}-tab-${tab.id}`}
              aria-selected={active}
              aria-controls={`${baseId}-panel-${tab.id}`}
              tabIndex={active ? 0 : -1}
              onClick={() => onSelect(tab.id)}
              onKeyDown={(event) => onKeyDown(event, index)}
              className={cx(
                '-mb-px flex items-center gap-2 border-b-2 px-3 py-2 text-sm font-semibold whitespace-nowrap',
                active ? 'border-copper text-ink' : 'border-transparent text-muted hover:text-ink',
              )}
            >
              {tab.label}
              {tab.badge}
            </button>
          );
        })}
      </div>
      <div
        role="tabpanel"
        id={`${baseId}-panel-${current.id}`}
        aria-labelledby={`${baseId}-tab-${current.id}`}
        tabIndex={0}
        className="outline-none focus-visible:outline-2"
      >
        {current.content}
      </div>
    </div>
  );
}
