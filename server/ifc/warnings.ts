/** Collects extraction warnings aggregated by code, keeping a few examples of each. */
import type { ExtractionWarning } from './types.ts';

const MAX_EXAMPLES = 5;

export class WarningCollector {
  private byCode = new Map<string, ExtractionWarning>();

  add(code: string, message: string, example?: string): void {
    let w = this.byCode.get(code);
    if (!w) {
      w = { code, message, count: 0, examples: [] };
      this.byCode.set(code, w);
    }
    w.count++;
    if (example && w.examples.length < MAX_EXAMPLES && !w.examples.includes(example)) w.examples.push(example);
  }

  /** Adds warnings collected elsewhere after this collector's own, as if added here in that order. */
  merge(warnings: ExtractionWarning[]): void {
    for (const w of warnings) {
      let mine = this.byCode.get(w.code);
      if (!mine) {
        mine = { code: w.code, message: w.message, count: 0, examples: [] };
        this.byCode.set(w.code, mine);
      }
      mine.count += w.count;
      for (const e of w.examples) if (mine.examples.length < MAX_EXAMPLES && !mine.examples.includes(e)) mine.examples.push(e);
    }
  }

  list(): ExtractionWarning[] {
    return [...this.byCode.values()].sort((a, b) => a.code.localeCompare(b.code));
  }
}
