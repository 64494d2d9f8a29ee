import { depthColour, type ToolpathPreview as Preview } from '~/lib/export/toolpath-preview.ts';
import { formatLength, type LengthUnit } from '~/lib/format/units.ts';

/** The toolpath over the board: rapids dashed grey, cuts solid in a depth ramp (y flipped for SVG). */
export function ToolpathPreview({ preview, units }: { preview: Preview; units: LengthUnit }) {
  const { bounds } = preview;
  const pad = (bounds.maxY - bounds.minY) * 0.15;
  const width = bounds.maxX - bounds.minX + 2 * pad;
  const height = bounds.maxY - bounds.minY + 2 * pad;
  const stroke = Math.max(width, height) / 500;
  return (
    <figure className="space-y-1">
      <svg
        role="img"
        aria-label={`Toolpath preview: ${preview.moves} moves; cuts from ${formatLength(preview.zRange.max, units, true)} to ${formatLength(preview.zRange.min, units, true)} in Z`}
        viewBox={`${bounds.minX - pad} ${-(bounds.maxY + pad)} ${width} ${height}`}
        className="h-48 w-full rounded border border-paper-line bg-white"
        data-moves={preview.moves}
      >
        <polygon points={preview.outline.map((p) => `${p.x},${-p.y}`).join(' ')} fill="#f6efe4" stroke="#1f2328" strokeWidth={stroke} />
        <g transform="scale(1,-1)">
          {preview.paths.map((path, i) =>
            path.kind === 'rapid' ? (
              <path key={i} d={path.d} fill="none" stroke="#8a8f98" strokeWidth={stroke * 0.6} strokeDasharray={`${stroke * 4} ${stroke * 3}`} data-kind="rapid" />
            ) : (
              <path key={i} d={path.d} fill="none" stroke={depthColour(path.depth)} strokeWidth={stroke * 1.6} data-kind="cut" />
            ),
          )}
        </g>
      </svg>
      <figcaption className="flex flex-wrap items-center gap-3 text-xs text-ink-soft">
        <span className="flex items-center gap-1"><svg width="24" height="6" aria-hidden="true"><line x1="0" y1="3" x2="24" y2="3" stroke="#8a8f98" strokeDasharray="4 3" /></svg>rapid moves at safe Z</span>
        <span className="flex items-center gap-1">
          <svg width="60" height="8" aria-hidden="true">
            {[0, 0.25, 0.5, 0.75, 1].map((d, i) => <rect key={d} x={i * 12} y="0" width="12" height="8" fill={depthColour(d)} />)}
          </svg>
          cuts, shallow (Z {formatLength(preview.zRange.max, units, true)}) to deep (Z {formatLength(preview.zRange.min, units, true)})
        </span>
      </figcaption>
    </figure>
  );
}
