import { useId, type ReactNode } from 'react';
import { BAND_STYLE, type ResultBand } from '@shared/api';
import type { Section } from '@shared/engine/section-types';
import type { MemberEndDetail } from '@shared/api/member-detail';
import { developedStrip } from '@shared/engine/sections/developed-strip';
import { useUnits } from '../../../lib/units';
import type { ChainView } from './sheet-model';

/**
 * One bolted end drawn as the developed plate: the section unfolded along its
 * centre-line, the member's end on the left, the member running on to the right (broken).
 * x runs along the member from its end, y across the developed width from the y = 0 edge.
 * Drawn: plate edges, element boundaries (the heel of an angle), gauge lines, holes with
 * their bolts and numbers, dimension lines (end distance, pitch or stagger along the
 * member; edge distances and gauges across), and the fracture chains: the governing one
 * always, any other one while it is highlighted in the list.
 */
export interface EndDrawingProps {
  section: Section;
  end: MemberEndDetail;
  /** Width deducted for holes whose diameter the model does not give, mm. */
  fallbackHoleDiameter: number | null;
  chains: readonly ChainView[];
  highlighted: string | null;
  band: ResultBand;
  title: string;
}

const TOL = 0.5;

function distinct(values: number[]): number[] {
  const sorted = [...values].sort((a, b) => a - b);
  const out: number[] = [];
  for (const v of sorted) if (!out.length || v - out[out.length - 1] > TOL) out.push(v);
  return out;
}

export function EndDrawing({ section, end, fallbackHoleDiameter, chains, highlighted, band, title }: EndDrawingProps) {
  const units = useUnits();
  const uid = useId().replace(/:/g, '');
  const strip = developedStrip(section);
  const W = strip.width;
  const holes = end.holes.map((h, i) => ({ ...h, n: i + 1, dd: h.d ?? fallbackHoleDiameter ?? 18 }));
  const xs = distinct(holes.map((h) => h.x));
  const gauges = distinct(holes.map((h) => h.y));
  const maxX = xs.length ? xs[xs.length - 1] : 0;
  const runOn = Math.max(80, 0.5 * W, maxX * 0.35);
  const L = maxX + runOn;

  const k = Math.min(560 / L, 250 / W, 5);
  const m = { left: 92, top: 70, right: 130, bottom: 44 };
  const plateW = L * k;
  const plateH = W * k;
  const VW = m.left + plateW + m.right;
  const VH = m.top + plateH + m.bottom;
  const X = (x: number) => m.left + x * k;
  const Y = (y: number) => m.top + y * k;
  const len = (mm: number) => units.length(mm, units.system === 'si' ? (Math.abs(mm - Math.round(mm)) < 0.05 ? 0 : 1) : 2).text;

  // Break line at the run-on end: a zig-zag across the plate.
  const bx = X(L);
  const zig = `M ${bx} ${Y(0) - 6} L ${bx} ${Y(W * 0.4)} L ${bx - 7} ${Y(W * 0.47)} L ${bx + 7} ${Y(W * 0.53)} L ${bx} ${Y(W * 0.6)} L ${bx} ${Y(W) + 6}`;

  const over = band === 'over';
  const ink = 'var(--color-ink)';
  const copper = 'var(--color-copper)';

  // Along the member: end distance, then spacing between successive hole positions.
  // Spacing between holes on one gauge line is a pitch (p); between gauge lines a stagger (s).
  const along: ReactNode[] = [];
  if (xs.length) {
    along.push(<Dim key="e" x1={X(0)} x2={X(xs[0])} y={m.top - 22} label={`e ${len(xs[0])}`} ext={[Y(0), Y(0)]} />);
    for (let i = 1; i < xs.length; i++) {
      const a = xs[i - 1];
      const b = xs[i];
      const linesA = new Set(holes.filter((h) => Math.abs(h.x - a) <= TOL).map((h) => gauges.findIndex((g) => Math.abs(g - h.y) <= TOL)));
      const shared = holes.some((h) => Math.abs(h.x - b) <= TOL && linesA.has(gauges.findIndex((g) => Math.abs(g - h.y) <= TOL)));
      along.push(<Dim key={`x${i}`} x1={X(a)} x2={X(b)} y={m.top - 22} label={`${shared ? 'p' : 's'} ${len(b - a)}`} ext={[Y(0), Y(0)]} />);
    }
  }

  // Across: edge distance, gauges, edge distance — to the right of the plate.
  const acrossX = X(L) + 26;
  const stops = [0, ...gauges, W];
  const across: ReactNode[] = [];
  for (let i = 1; i < stops.length; i++) {
    const a = stops[i - 1];
    const b = stops[i];
    if (b - a < 0.01) continue;
    const edge = i === 1 || i === stops.length - 1;
    across.push(<Dim key={`y${i}`} vertical y1={Y(a)} y2={Y(b)} x={acrossX} label={`${edge ? 'edge' : 'g'} ${len(b - a)}`} ext={[X(L) + 8, X(L) + 8]} />);
  }

  const hatchId = `${uid}-over`;
  const chainPath = (c: ChainView) => {
    const pts = c.chain.holes.map((i) => holes[i]).filter(Boolean);
    if (!pts.length) return '';
    const first = pts[0];
    const last = pts[pts.length - 1];
    const all = [
      [first.x, 0],
      ...pts.map((h) => [h.x, h.y]),
      [last.x, W],
    ];
    return all.map(([x, y]) => `${X(x).toFixed(1)},${Y(y).toFixed(1)}`).join(' ');
  };

  return (
    <svg
      viewBox={`0 0 ${VW} ${VH}`}
      className="h-auto w-full max-w-4xl"
      role="img"
      aria-labelledby={`${uid}-t ${uid}-d`}
      data-end-drawing={end.end}
    >
      <title id={`${uid}-t`}>{title}</title>
      <desc id={`${uid}-d`}>
        {`Developed width ${len(W)}; ${holes.length} holes on ${gauges.length} gauge ${gauges.length === 1 ? 'line' : 'lines'}; first hole ${xs.length ? len(xs[0]) : '—'} from the end.`}
      </desc>
      <defs>
        <pattern id={hatchId} width="7" height="7" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <line x1="0" y1="0" x2="0" y2="7" stroke={BAND_STYLE.over.colour} strokeWidth="1.6" strokeOpacity="0.55" />
        </pattern>
      </defs>

      {/* plate */}
      <rect x={X(0)} y={Y(0)} width={plateW} height={plateH} fill="#f1ede4" />
      {over && <rect x={X(0)} y={Y(0)} width={plateW} height={plateH} fill={`url(#${hatchId})`} data-hatch="over" />}
      <path d={`M ${bx} ${Y(0)} L ${X(0)} ${Y(0)} L ${X(0)} ${Y(W)} L ${bx} ${Y(W)}`} fill="none" stroke={ink} strokeWidth="1.6" />
      <path d={zig} fill="none" stroke={ink} strokeWidth="1" />
      <text x={X(0)} y={Y(W) + 30} fontSize="11" fill="var(--color-muted)">
        member end
      </text>
      <text x={bx - 4} y={Y(W) + 30} fontSize="11" fill="var(--color-muted)" textAnchor="end">
        member continues →
      </text>

      {/* element boundaries and names */}
      {strip.segments.map((s, i) => (
        <g key={`${s.element}-${i}`}>
          {i > 0 && Math.abs(s.y0 - strip.segments[i - 1].y1) < 0.01 && (
            <>
              <line x1={X(0)} x2={bx} y1={Y(s.y0)} y2={Y(s.y0)} stroke={ink} strokeWidth="0.9" strokeDasharray="10 3 2 3" />
              <text x={X(0) - 8} y={Y(s.y0) + 4} fontSize="10" textAnchor="end" fill="var(--color-muted)">
                {section.shape === 'angle' ? 'heel' : 'fold'}
              </text>
            </>
          )}
          <text x={X(0) - 8} y={Y((s.y0 + s.y1) / 2) + 4} fontSize="11" fontWeight="600" textAnchor="end" fill={ink}>
            {s.element}
          </text>
        </g>
      ))}
      {strip.branched && (
        <text x={X(0)} y={Y(W) + 16} fontSize="10" fill="var(--color-muted)">
          parts laid end to end; chains do not cross between parts
        </text>
      )}
      {/* width across the whole strip, at the left */}
      <Dim vertical y1={Y(0)} y2={Y(W)} x={m.left - 70} label={`${len(W)}`} ext={[X(0) - 4, X(0) - 4]} rotateLabel />

      {/* gauge lines */}
      {gauges.map((g) => (
        <line key={g} x1={X(0)} x2={bx} y1={Y(g)} y2={Y(g)} stroke={copper} strokeOpacity="0.55" strokeWidth="0.8" strokeDasharray="6 4" data-gauge-line={g} />
      ))}

      {/* chains: highlighted alternative under the governing one */}
      {chains
        .filter((c) => !c.governing && c.key === highlighted)
        .map((c) => (
          <polyline key={c.key} points={chainPath(c)} fill="none" stroke={ink} strokeWidth="2.2" strokeDasharray="7 4" data-chain={c.key} />
        ))}
      {chains
        .filter((c) => c.governing)
        .map((c) => (
          <polyline
            key={c.key}
            points={chainPath(c)}
            fill="none"
            stroke={copper}
            strokeWidth={highlighted === c.key ? 4 : 2.6}
            strokeLinejoin="round"
            data-chain="governing"
          />
        ))}

      {/* holes, bolts, numbers */}
      {holes.map((h) => (
        <g key={h.n} data-hole={h.n}>
          <circle cx={X(h.x)} cy={Y(h.y)} r={(h.dd / 2) * k} fill="#fff" stroke={ink} strokeWidth="1.3" />
          {end.boltDiameter && <circle cx={X(h.x)} cy={Y(h.y)} r={(end.boltDiameter / 2) * k * 0.92} fill={ink} fillOpacity="0.16" stroke="none" />}
          <line x1={X(h.x) - 3} x2={X(h.x) + 3} y1={Y(h.y)} y2={Y(h.y)} stroke={ink} strokeWidth="0.8" />
          <line x1={X(h.x)} x2={X(h.x)} y1={Y(h.y) - 3} y2={Y(h.y) + 3} stroke={ink} strokeWidth="0.8" />
          <text x={X(h.x) + (h.dd / 2) * k + 2} y={Y(h.y) - (h.dd / 2) * k - 1} fontSize="10" fontWeight="700" fill={ink}>
            {h.n}
          </text>
        </g>
      ))}
      {along}
      {across}
      <text x={m.left} y={14} fontSize="11" fill="var(--color-muted)">
        {holes.length ? `holes ⌀ ${distinct(holes.map((h) => h.dd)).map((d) => len(d)).join(', ')}` : 'no holes'}
        {end.boltDiameter ? ` · bolts ${units.system === 'si' ? `M${end.boltDiameter}` : len(end.boltDiameter)}${end.boltGrade ? ` ${end.boltGrade}` : ''}` : ''}
      </text>
    </svg>
  );
}

/** A dimension line with oblique ticks and its label; horizontal unless `vertical`. */
function Dim(props: {
  x1?: number;
  x2?: number;
  y?: number;
  y1?: number;
  y2?: number;
  x?: number;
  vertical?: boolean;
  label: string;
  /** Where the extension lines start (y for horizontal dims, x for vertical ones). */
  ext: [number, number];
  rotateLabel?: boolean;
}) {
  const ink = 'var(--color-ink)';
  if (!props.vertical) {
    const { x1 = 0, x2 = 0, y = 0, label, ext } = props;
    return (
      <g fontSize="10.5" fill={ink} data-dim={label}>
        <line x1={x1} x2={x1} y1={ext[0] - 2} y2={y - 4} stroke={ink} strokeWidth="0.5" />
        <line x1={x2} x2={x2} y1={ext[1] - 2} y2={y - 4} stroke={ink} strokeWidth="0.5" />
        <line x1={x1} x2={x2} y1={y} y2={y} stroke={ink} strokeWidth="0.8" />
        <line x1={x1 - 3} x2={x1 + 3} y1={y + 3} y2={y - 3} stroke={ink} strokeWidth="1.2" />
        <line x1={x2 - 3} x2={x2 + 3} y1={y + 3} y2={y - 3} stroke={ink} strokeWidth="1.2" />
        <text x={(x1 + x2) / 2} y={y - 5} textAnchor="middle">
          {label}
        </text>
      </g>
    );
  }
  const { y1 = 0, y2 = 0, x = 0, label, ext, rotateLabel } = props;
  const mid = (y1 + y2) / 2;
  return (
    <g fontSize="10.5" fill={ink} data-dim={label}>
      <line x1={ext[0]} x2={x + (x > ext[0] ? 4 : -4)} y1={y1} y2={y1} stroke={ink} strokeWidth="0.5" />
      <line x1={ext[1]} x2={x + (x > ext[1] ? 4 : -4)} y1={y2} y2={y2} stroke={ink} strokeWidth="0.5" />
      <line x1={x} x2={x} y1={y1} y2={y2} stroke={ink} strokeWidth="0.8" />
      <line x1={x - 3} x2={x + 3} y1={y1 + 3} y2={y1 - 3} stroke={ink} strokeWidth="1.2" />
      <line x1={x - 3} x2={x + 3} y1={y2 + 3} y2={y2 - 3} stroke={ink} strokeWidth="1.2" />
      {rotateLabel ? (
        <text transform={`translate(${x - 5} ${mid}) rotate(-90)`} textAnchor="middle">
          {label}
        </text>
      ) : (
        <text x={x + 6} y={mid + 4}>
          {label}
        </text>
      )}
    </g>
  );
}
