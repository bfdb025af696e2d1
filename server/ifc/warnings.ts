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

  list(): ExtractionWarning[] {
    return [...this.byCode.values()].sort((a, b) => a.code.localeCompare(b.code));
  }
}
