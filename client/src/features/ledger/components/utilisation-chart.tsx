import { useId } from 'react';
import { BAND_STYLE, DEFAULT_BAND_THRESHOLDS, type ResultBand } from '@shared/api';
import type { RevisionOverview } from '@shared/api/member-sheet';
import { formatUtilisation } from '../../../lib/units';

/**
 * Histogram of utilisation: bins of 0.1 from 0 to 1.5 and an open bin above. Bars are
 * ink; the band each stretch of the axis belongs to is drawn as a ruled strip under
 * the axis (hatched where over), so a bar that straddles a threshold is not given a
 * band it only half belongs to.
 */
export function UtilisationChart({ histogram, unknown }: { histogram: RevisionOverview['histogram']; unknown: number }) {
  const uid = useId().replace(/:/g, '');
  const ids = { title: `${uid}-title`, desc: `${uid}-desc`, hatch: `${uid}-hatch` };
  const W = 640;
  const H = 260;
  const m = { left: 48, right: 16, top: 16, bottom: 78 };
  const plotW = W - m.left - m.right;
  const plotH = H - m.top - m.bottom;
  const bins = histogram.length; // 15 closed bins + 1 open
  const binW = plotW / bins;
  const max = Math.max(1, ...histogram.map((b) => b.count));
  const step = max <= 5 ? 1 : max <= 10 ? 2 : max <= 25 ? 5 : Math.pow(10, Math.floor(Math.log10(max))) * (max / Math.pow(10, Math.floor(Math.log10(max))) > 5 ? 2 : 1);
  const top = Math.ceil(max / step) * step;
  const y = (count: number) => m.top + plotH - (count / top) * plotH;
  const xOf = (u: number) => m.left + Math.min(u, 1.5) * 10 * binW; // u in 0..1.5 maps across the closed bins
  const ticks: number[] = [];
  for (let v = 0; v <= top; v += step) ticks.push(v);

  const t = DEFAULT_BAND_THRESHOLDS;
  const zones: { band: ResultBand; from: number; to: number }[] = [
    { band: 'spare', from: 0, to: t.working },
    { band: 'working', from: t.working, to: t.tight },
    { band: 'tight', from: t.tight, to: t.over },
    { band: 'over', from: t.over, to: 1.6 },
  ];
  const stripY = m.top + plotH + 24;
  const total = histogram.reduce((s, b) => s + b.count, 0);
  const binLabel = (b: RevisionOverview['histogram'][number]) => (b.to === null ? `above ${formatUtilisation(b.from)}` : `${formatUtilisation(b.from)} to ${formatUtilisation(b.to)}`);

  return (
    <figure className="flex flex-col gap-2" data-print="keep">
      <svg viewBox={`0 0 ${W} ${H}`} className="h-auto w-full max-w-3xl" role="img" aria-labelledby={`${ids.title} ${ids.desc}`}>
        <title id={ids.title}>Members by utilisation</title>
        <desc id={ids.desc}>
          {histogram
            .filter((b) => b.count > 0)
            .map((b) => `${b.count} between ${binLabel(b)}`)
            .join('; ') || 'No members have a result.'}
        </desc>
        <defs>
          <pattern id={ids.hatch} width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="6" height="6" fill={BAND_STYLE.over.colour} />
            <line x1="0" y1="0" x2="0" y2="6" stroke="#fff" strokeWidth="2" strokeOpacity="0.6" />
          </pattern>
        </defs>
        {/* grid and y axis */}
        {ticks.map((v) => (
          <g key={v}>
            <line x1={m.left} x2={W - m.right} y1={y(v)} y2={y(v)} stroke="var(--color-rule)" strokeWidth={v === 0 ? 0 : 1} />
            <text x={m.left - 8} y={y(v) + 4} textAnchor="end" fontSize="11" fill="var(--color-muted)">
              {v}
            </text>
          </g>
        ))}
        <text transform={`translate(14 ${m.top + plotH / 2}) rotate(-90)`} textAnchor="middle" fontSize="11" fill="var(--color-muted)">
          Members
        </text>
        {/* bars */}
        {histogram.map((b, i) => {
          const x = m.left + i * binW;
          const open = b.to === null;
          return (
            <g key={i}>
              {b.count > 0 && (
                <>
                  <rect x={x + 3} y={y(b.count)} width={binW - 6} height={m.top + plotH - y(b.count)} fill={open ? `url(#${ids.hatch})` : 'var(--color-ink)'} opacity={open ? 1 : 0.82}>
                    <title>{`${b.count} ${b.count === 1 ? 'member' : 'members'}, utilisation ${binLabel(b)}`}</title>
                  </rect>
                  <text x={x + binW / 2} y={y(b.count) - 4} textAnchor="middle" fontSize="11" fontWeight="600" fill="var(--color-ink)">
                    {b.count}
                  </text>
                </>
              )}
            </g>
          );
        })}
        {/* x axis */}
        <line x1={m.left} x2={W - m.right} y1={m.top + plotH} y2={m.top + plotH} stroke="var(--color-ink)" strokeWidth="1.2" />
        {Array.from({ length: 16 }, (_, i) => i / 10).map((u) => (
          <g key={u}>
            <line x1={xOf(u)} x2={xOf(u)} y1={m.top + plotH} y2={m.top + plotH + (Math.round(u * 10) % 5 === 0 ? 6 : 3)} stroke="var(--color-ink)" />
          </g>
        ))}
        {[0, 0.5, 1.0].map((u) => (
          <text key={u} x={xOf(u)} y={m.top + plotH + 18} textAnchor="middle" fontSize="11" fill="var(--color-ink)">
            {u.toFixed(1)}
          </text>
        ))}
        <text x={m.left + 15 * binW + binW / 2} y={m.top + plotH + 18} textAnchor="middle" fontSize="11" fill="var(--color-muted)">
          1.5+
        </text>
        {/* band strip */}
        {zones.map((z) => {
          const x0 = xOf(z.from);
          const x1 = z.band === 'over' ? W - m.right : xOf(z.to);
          return (
            <g key={z.band}>
              <rect
                x={x0}
                y={stripY}
                width={x1 - x0}
                height={10}
                fill={z.band === 'over' ? `url(#${ids.hatch})` : BAND_STYLE[z.band].colour}
                stroke="var(--color-ink)"
                strokeOpacity="0.3"
              />
              <text x={(x0 + x1) / 2} y={stripY + 24} textAnchor="middle" fontSize="11" fill="var(--color-ink)" fontWeight={z.band === 'tight' || z.band === 'over' ? 700 : 400}>
                {BAND_STYLE[z.band].label}
              </text>
            </g>
          );
        })}
        <text x={m.left + plotW / 2} y={H - 4} textAnchor="middle" fontSize="11" fill="var(--color-muted)">
          Utilisation (design action ÷ design capacity)
        </text>
      </svg>
      <figcaption className="text-small text-muted">
        {total} {total === 1 ? 'member' : 'members'} with a result, in bins of 0.10.
        {unknown > 0 && ` ${unknown} without a result (${BAND_STYLE.unknown.description}) are not in the chart.`}
      </figcaption>
    </figure>
  );
}
