import { CAUTIONS } from '@shared/api';
import { cx } from '../lib/cx';

/** The cautions that go with every result, in full. Printed with the page. */
export function CautionsBlock({ cautions = CAUTIONS, className }: { cautions?: readonly string[]; className?: string }) {
  return (
    <section
      aria-labelledby="cautions-heading"
      data-print="keep"
      data-cautions
      className={cx('rounded-card border border-l-4 border-rule border-l-heed bg-heed-wash px-5 py-4 text-small', className)}
    >
      <h2 id="cautions-heading" className="font-semibold text-heed">
        Cautions
      </h2>
      <ol className="mt-2 flex list-decimal flex-col gap-1 pl-5 text-ink">
        {cautions.map((c) => (
          <li key={c}>{c}</li>
        ))}
      </ol>
    </section>
  );
}
