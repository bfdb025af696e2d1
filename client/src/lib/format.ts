/** Formatting shared by every view, so dates and numbers read the same everywhere. */

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
const dateTimeFormat = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  hour: '2-digit',
  minute: '2-digit',
});

function parse(value: string | null | undefined): Date | null {
  if (!value) return null;
  const date = new Date(value);
  return Number.isNaN(date.getTime()) ? null : date;
}

/** "3 Mar 2026", or the fallback when there is no date. */
export function formatDate(value: string | null | undefined, fallback = '—'): string {
  const date = parse(value);
  return date ? dateFormat.format(date) : fallback;
}

/** "3 Mar 2026, 14:05", or the fallback when there is no date. */
export function formatDateTime(value: string | null | undefined, fallback = '—'): string {
  const date = parse(value);
  return date ? dateTimeFormat.format(date) : fallback;
}

const integerFormat = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 0 });
export function formatCount(value: number): string {
  return integerFormat.format(value);
}
