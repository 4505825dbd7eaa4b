import { useId, type ReactNode } from 'react';

export interface ScrollingTableProps {
  caption: ReactNode;
  /** The caption's look; read out only by default. */
  captionClassName?: string;
  /** The table's head and body. */
  children: ReactNode;
}

/**
 * A table in an area that scrolls on its own, at most about a screen high, so its sideways scrollbar is always within
 * reach; the area takes keyboard focus so it can be scrolled without a mouse.
 */
export function ScrollingTable({ caption, captionClassName = 'sr-only', children }: ScrollingTableProps) {
  const captionId = useId();
  return (
    <div
      role="region"
      aria-labelledby={captionId}
      tabIndex={0}
      className="max-h-[max(20rem,calc(100dvh-7rem))] overflow-auto overscroll-x-contain rounded-[3px] border border-rule bg-surface"
    >
      <table className="w-full border-separate border-spacing-0 text-sm">
        <caption id={captionId} className={captionClassName}>
          {caption}
        </caption>
        {children}
      </table>
    </div>
  );
}
