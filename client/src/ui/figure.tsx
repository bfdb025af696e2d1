import type { Measure } from '../lib/units';
import { cx } from '../lib/cx';

/** A figure with its unit in muted ink: "96.4 kN". A missing value reads as a dash. */
export function Figure({ measure, className, missing = '—' }: { measure: Measure | null | undefined; className?: string; missing?: string }) {
  if (!measure) return <span className={cx('text-muted', className)}>{missing}</span>;
  return (
    <span className={cx('figures whitespace-nowrap', className)}>
      {measure.value}
      {measure.unit && <span className="ml-0.5 font-normal text-muted"> {measure.unit}</span>}
    </span>
  );
}
