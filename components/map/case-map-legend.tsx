import { LINE_STYLES, PALETTE, type LineKind } from './map-styles';

export type LegendKey = 'bearing' | 'outlier' | 'excluded' | 'observer' | 'cross' | 'fix' | 'ellipse' | 'alternative' | 'trail' | 'spot' | 'reporter' | 'picked' | 'candidate' | 'premises';

const TEXT: Record<LegendKey, string> = {
  bearing: 'bearing line',
  outlier: 'outlier line (disagrees with the rest)',
  excluded: 'excluded line',
  observer: 'bearing taken here',
  cross: 'two lines cross',
  fix: 'fix',
  ellipse: '95 % error ellipse',
  alternative: 'fix with every line',
  trail: 'earlier fixes',
  spot: 'next spot (expected ellipse)',
  reporter: 'reporter (private)',
  picked: 'chosen position',
  candidate: 'house inside the region (listen closer, not an accusation)',
  premises: 'premises picked or confirmed',
};

function LineSwatch({ kind }: { kind: LineKind }) {
  const s = LINE_STYLES[kind];
  return (
    <svg width="32" height="12" viewBox="0 0 32 12" aria-hidden="true" className="shrink-0">
      <line x1="1" y1="6" x2="31" y2="6" stroke={s.color} strokeWidth={s.weight} strokeOpacity={s.opacity ?? 1} strokeDasharray={s.dashArray as string | undefined} />
    </svg>
  );
}

function DotSwatch({ fill, ring, cross }: { fill?: string; ring?: string; cross?: boolean }) {
  return (
    <svg width="32" height="16" viewBox="0 0 32 16" aria-hidden="true" className="shrink-0">
      {cross ? (
        <path d="M11 3L21 13M21 3L11 13" stroke={PALETTE.ink} strokeWidth="2" strokeLinecap="round" />
      ) : (
        <circle cx="16" cy="8" r="6" fill={fill ?? 'none'} stroke={ring ?? '#fff'} strokeWidth="2.5" />
      )}
    </svg>
  );
}

const SWATCH: Record<LegendKey, React.ReactNode> = {
  bearing: <LineSwatch kind="bearing" />,
  outlier: <LineSwatch kind="outlier" />,
  excluded: <LineSwatch kind="excluded" />,
  observer: <DotSwatch fill={PALETTE.hush900} ring="#fff" />,
  cross: <DotSwatch cross />,
  fix: <DotSwatch fill="#fff" ring={PALETTE.alarm600} />,
  ellipse: <LineSwatch kind="ellipse" />,
  alternative: <LineSwatch kind="ellipseAlt" />,
  trail: <LineSwatch kind="trail" />,
  spot: <DotSwatch fill="#fff" ring={PALETTE.hush900} />,
  reporter: <DotSwatch fill={PALETTE.inkFaint} ring="#fff" />,
  picked: <DotSwatch ring={PALETTE.flare700} />,
  candidate: <LineSwatch kind="candidate" />,
  premises: <LineSwatch kind="premises" />,
};

/** The map's legend in words, listing only what is drawn. */
export function CaseMapLegend({ keys }: { keys: LegendKey[] }) {
  if (keys.length === 0) return null;
  return (
    <ul aria-label="Map legend" data-testid="map-legend" className="mt-1 flex flex-wrap gap-x-3 gap-y-0.5 text-xs font-medium text-ink sm:text-sm">
      {keys.map((k) => (
        <li key={k} className="flex items-center gap-1.5" data-legend={k}>
          {SWATCH[k]}
          <span>{TEXT[k]}</span>
        </li>
      ))}
    </ul>
  );
}
