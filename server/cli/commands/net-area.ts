/**
 * `gaugeline net-area PATTERN.json` — minimum net area of a flat strip with holes.
 * PATTERN: { width mm, thickness mm, holes: [{ x, y, d }] }, d = deducted width (no allowance added).
 * Prints { grossArea, netArea, netWidth, chain } (mm², mm; chain = 0-based input indices, increasing y).
 */
import { netAreaPatternSchema } from '../../../shared/engine/schemas.ts';
import { solveNetArea } from '../../../shared/engine/net-area/index.ts';
import { readJsonInput } from '../read-json.ts';

export async function run(args: string[]): Promise<void> {
  const pattern = await readJsonInput(args[0], netAreaPatternSchema, 'PATTERN');
  const grossArea = pattern.width * pattern.thickness;
  const result = solveNetArea({ grossArea, thickness: pattern.thickness, holes: pattern.holes, alternatives: 0 });
  const netArea = Math.min(result.netArea, grossArea);
  const out = {
    grossArea: round(grossArea),
    netArea: round(netArea),
    netWidth: round(netArea / pattern.thickness),
    chain: result.governing?.holes ?? [],
  };
  process.stdout.write(`${JSON.stringify(out)}\n`);
}

function round(v: number): number {
  return Math.round(v * 1e6) / 1e6;
}
