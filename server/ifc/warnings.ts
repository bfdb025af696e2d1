/** Collects extraction warnings aggregated by code, keeping a few examples of each. */
import type { ExtractionWarning } from './types.ts';

const MAX_EXAMPLES = 5;

export class WarningCollector {
  private byCode = new Map<string, ExtractionWarning>();

  add(code: string, message: string, example?: string): void {
    this.record(code, message, 1, example ? [example] : []);
  }

  /** Adds warnings collected elsewhere after this collector's own, as if added here in that order. */
  merge(warnings: ExtractionWarning[]): void {
    for (const w of warnings) this.record(w.code, w.message, w.count, w.examples);
  }

  private record(code: string, message: string, count: number, examples: readonly string[]): void {
    let w = this.byCode.get(code);
    if (!w) {
      w = { code, message, count: 0, examples: [] };
      this.byCode.set(code, w);
    }
    w.count += count;
    for (const e of examples) if (w.examples.length < MAX_EXAMPLES && !w.examples.includes(e)) w.examples.push(e);
  }

  list(): ExtractionWarning[] {
    return [...this.byCode.values()].sort((a, b) => a.code.localeCompare(b.code));
  }
}
