/**
 * Deviation of each measured slot against fret number, with the tolerance band. Plain SVG; the
 * results table beside it carries the same numbers for anyone who cannot see the chart.
 */
import { formatLength } from '~/lib/format/units.ts';
import type { CheckResult } from '~/lib/templates/check/compare.ts';

const WIDTH = 720;
const HEIGHT = 300;
const PAD = { left: 64, right: 16, top: 16, bottom: 44 };

/** Round-numbered ticks across ±extent, plus ±tolerance when there is room to label them. */
function axisTicks(extent: number, tolerance: number, plotHeight: number): number[] {
  const rough = extent / 2;
  const magnitude = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 5, 10].map((m) => m * magnitude).find((s) => s >= rough) ?? rough;
  const ticks: number[] = [];
  for (let t = -Math.floor(extent / step) * step; t <= extent + 1e-12; t += step) ticks.push(Math.abs(t) < step / 1e6 ? 0 : t);
  const pxPerUnit = plotHeight / (2 * extent);
  const roomFor = (value: number) => ticks.every((t) => Math.abs(t - value) * pxPerUnit > 14);
  return [...ticks, ...[-tolerance, tolerance].filter(roomFor)];
}

export function DeviationChart({ result, frets, title }: { result: CheckResult; frets: number; title: string }) {
  const { units, tolerance } = result;
  const extent = Math.max(2 * tolerance, ...result.slots.map((s) => Math.abs(s.deviation))) * 1.15;
  const plotW = WIDTH - PAD.left - PAD.right;
  const plotH = HEIGHT - PAD.top - PAD.bottom;
  const x = (fret: number) => PAD.left + (fret / (frets + 1)) * plotW;
  const y = (deviation: number) => PAD.top + ((extent - deviation) / (2 * extent)) * plotH;
  const ticks = axisTicks(extent, tolerance, plotH);
  // The fits list each measured line once, in the board's order: the first is drawn solid.
  const lines = result.fits.map((fit) => fit.along);
  const fretStep = frets > 24 ? 3 : frets > 12 ? 2 : 1;

  return (
    <svg
      viewBox={`0 0 ${WIDTH} ${HEIGHT}`}
      role="img"
      aria-labelledby="deviation-chart-title deviation-chart-desc"
      className="w-full max-w-3xl rounded border border-paper-line bg-white"
      data-testid="deviation-chart"
    >
      <title id="deviation-chart-title">{title}</title>
      <desc id="deviation-chart-desc">{result.summary}</desc>
      <rect
        x={PAD.left}
        y={y(tolerance)}
        width={plotW}
        height={y(-tolerance) - y(tolerance)}
        fill="#e3eeea"
        stroke="#2f5d50"
        strokeDasharray="4 3"
      />
      <text x={PAD.left + plotW - 4} y={y(tolerance) + 12} textAnchor="end" fontSize="11" fill="#234539">
        tolerance ±{formatLength(tolerance, units, true)}
      </text>
      {ticks.map((t) => (
        <g key={t}>
          <line
            x1={PAD.left - 4}
            x2={PAD.left + plotW}
            y1={y(t)}
            y2={y(t)}
            stroke={t === 0 ? '#4b5259' : '#d9d4c8'}
            strokeWidth={t === 0 ? 1 : 0.5}
          />
          <text x={PAD.left - 8} y={y(t) + 4} textAnchor="end" fontSize="11" fontFamily="JetBrains Mono, monospace" fill="#4b5259">
            {formatLength(t, units)}
          </text>
        </g>
      ))}
      {Array.from({ length: frets }, (_, i) => i + 1)
        .filter((f) => f % fretStep === 0 || f === 1)
        .map((f) => (
          <text
            key={f}
            x={x(f)}
            y={PAD.top + plotH + 16}
            textAnchor="middle"
            fontSize="11"
            fontFamily="JetBrains Mono, monospace"
            fill="#4b5259"
          >
            {f}
          </text>
        ))}
      <text x={PAD.left + plotW / 2} y={HEIGHT - 6} textAnchor="middle" fontSize="12" fill="#1f2328">
        Fret
      </text>
      <text transform={`translate(14 ${PAD.top + plotH / 2}) rotate(-90)`} textAnchor="middle" fontSize="12" fill="#1f2328">
        Deviation ({units}), + = toward the bridge
      </text>
      {lines.map((along, index) => {
        const points = result.slots.filter((s) => s.along === along).sort((a, b) => a.fret - b.fret);
        return (
          <g key={along}>
            <polyline
              points={points.map((s) => `${x(s.fret)},${y(s.deviation)}`).join(' ')}
              fill="none"
              stroke={index === 0 ? '#1f2328' : '#7a3b2e'}
              strokeWidth="1"
              strokeDasharray={index === 0 ? undefined : '3 2'}
            />
            {points.map((s) =>
              s.withinTolerance ? (
                <circle key={s.fret} cx={x(s.fret)} cy={y(s.deviation)} r="4" fill="#2f5d50" />
              ) : (
                <path key={s.fret} d={`M${x(s.fret) - 4},${y(s.deviation) - 4}l8,8m0,-8l-8,8`} stroke="#7a3b2e" strokeWidth="2" />
              ),
            )}
          </g>
        );
      })}
    </svg>
  );
}
