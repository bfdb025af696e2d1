import type { CSSProperties, ReactNode } from 'react';

const ROW = 'flex w-full items-center gap-2 rounded-control px-1.5 py-1 text-left text-small hover:bg-ledger aria-[pressed=false]:opacity-55';

interface KeyLineProps {
  swatch: CSSProperties;
  label: ReactNode;
  description: ReactNode;
  count: number;
  shown: boolean;
  onToggle(): void;
  /** Extra data attributes that tests and the page use to find a line. */
  data?: Record<`data-${string}`, string>;
}

/** One line of a 3D key: swatch, words, count; pressing it shows or hides what it names. */
export function KeyLine({ swatch, label, description, count, shown, onToggle, data }: KeyLineProps) {
  return (
    <li>
      <button type="button" className={ROW} aria-pressed={shown} onClick={onToggle} {...data}>
        <span aria-hidden="true" className="inline-block size-4 shrink-0 rounded-[2px] border border-ink/30" style={swatch} />
        <span className="min-w-0 flex-1">
          {label}
          <span className="block text-fine text-muted">{description}</span>
        </span>
        <span className="figures font-semibold">{count}</span>
      </button>
    </li>
  );
}
