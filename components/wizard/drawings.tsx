import type { ReactNode } from 'react';

// Simple line drawings for the wizard's choices and the trade terms an answer explains, our own.
// Decorative: every choice and every term also has words.

const stroke = { stroke: 'currentColor', strokeWidth: 3, strokeLinecap: 'round' as const, fill: 'none' };

function Needles({ x, y, len = 10, spread = 1 }: { x: number; y: number; len?: number; spread?: number }) {
  return (
    <g {...stroke} strokeWidth={1.5}>
      <line x1={x} y1={y} x2={x - len * spread} y2={y - len} />
      <line x1={x} y1={y} x2={x + len * spread} y2={y - len} />
    </g>
  );
}

export function BranchingDrawing({ level }: { level: 'primary' | 'secondary' | 'tertiary' }) {
  return (
    <svg viewBox="0 0 120 80" className="h-20 w-28 text-bark-700" aria-hidden="true">
      <line x1="10" y1="70" x2="110" y2="40" {...stroke} strokeWidth={5} />
      {level !== 'primary' && (
        <g {...stroke}>
          <line x1="40" y1="61" x2="50" y2="30" />
          <line x1="75" y1="50" x2="88" y2="22" />
          <line x1="55" y1="56" x2="70" y2="76" />
        </g>
      )}
      {level === 'tertiary' && (
        <g {...stroke} strokeWidth={2}>
          <line x1="46" y1="42" x2="34" y2="30" />
          <line x1="48" y1="36" x2="60" y2="24" />
          <line x1="83" y1="32" x2="72" y2="20" />
          <line x1="85" y1="28" x2="100" y2="18" />
          <line x1="64" y1="68" x2="78" y2="66" />
        </g>
      )}
      <g className="text-moss-600">
        {(level === 'primary'
          ? [[110, 40]]
          : level === 'secondary'
            ? [
                [110, 40],
                [50, 30],
                [88, 22],
                [70, 76],
              ]
            : [
                [110, 40],
                [34, 30],
                [60, 24],
                [72, 20],
                [100, 18],
                [78, 66],
                [50, 30],
                [88, 22],
              ]
        ).map(([x, y], i) => (
          <circle key={i} cx={x} cy={y} r={level === 'tertiary' ? 5 : 6} fill="currentColor" opacity={0.7} />
        ))}
      </g>
    </svg>
  );
}

export function ShootDrawing({ state }: { state: 'dormant-bud' | 'candle-extending' | 'needles-opening' | 'needles-hardened' }) {
  return (
    <svg viewBox="0 0 80 100" className="h-24 w-20" aria-hidden="true">
      {/* last year's shoot with its needles */}
      <line x1="40" y1="98" x2="40" y2="62" stroke="#74573f" strokeWidth="5" strokeLinecap="round" />
      <g className="text-moss-700">
        {[92, 84, 76, 68].map((y) => (
          <Needles key={y} x={40} y={y} len={16} spread={1.1} />
        ))}
      </g>
      <g className="text-moss-400">
        {state === 'dormant-bud' && <ellipse cx="40" cy="56" rx="5" ry="8" fill="#a98766" />}
        {state === 'candle-extending' && <rect x="35" y="14" width="10" height="48" rx="5" fill="#c2d9a0" stroke="#548347" strokeWidth="1.5" />}
        {state === 'needles-opening' && (
          <>
            <rect x="36" y="14" width="8" height="48" rx="4" fill="#c2d9a0" stroke="#548347" strokeWidth="1.5" />
            {[56, 46, 36, 26].map((y) => (
              <Needles key={y} x={40} y={y} len={7} spread={0.7} />
            ))}
          </>
        )}
        {state === 'needles-hardened' && (
          <>
            <line x1="40" y1="62" x2="40" y2="18" stroke="#8f6d4e" strokeWidth="3" />
            <g className="text-moss-600">
              {[58, 50, 42, 34, 26, 20].map((y) => (
                <Needles key={y} x={40} y={y} len={15} spread={1} />
              ))}
            </g>
            <ellipse cx="40" cy="15" rx="3" ry="5" fill="#a98766" />
          </>
        )}
      </g>
    </svg>
  );
}

export function PositionDrawing({ position }: { position: 'beyond-silhouette' | 'at-silhouette' | 'interior' }) {
  const tip = position === 'beyond-silhouette' ? [92, 18] : position === 'at-silhouette' ? [80, 28] : [56, 46];
  return (
    <svg viewBox="0 0 120 80" className="h-20 w-28" aria-hidden="true">
      <path d="M10 62 Q20 20 60 16 Q100 18 108 60 Z" fill="#e2ecdc" stroke="#548347" strokeWidth="2" strokeDasharray="5 4" />
      <line x1="30" y1="70" x2="60" y2="58" stroke="#74573f" strokeWidth="4" strokeLinecap="round" />
      <line x1="60" y1="58" x2={tip[0]} y2={tip[1]} stroke="#74573f" strokeWidth="3" strokeLinecap="round" />
      <rect
        x={tip[0] - 4}
        y={tip[1] - 14}
        width="8"
        height="16"
        rx="4"
        fill="#c2d9a0"
        stroke="#33522c"
        strokeWidth="1.5"
        transform={`rotate(35 ${tip[0]} ${tip[1]})`}
      />
    </svg>
  );
}

// ---- Trade terms ----

function Twig({ children, label }: { children: ReactNode; label?: string }) {
  return (
    <svg viewBox="0 0 120 100" className="h-24 w-28 shrink-0" aria-hidden="true" data-testid={label ? `term-drawing-${label}` : undefined}>
      {children}
    </svg>
  );
}

function NeedleBundleDrawing({ count }: { count: 2 | 3 }) {
  return (
    <Twig label="needle-bundle">
      <line x1="20" y1="90" x2="100" y2="90" stroke="#74573f" strokeWidth="5" strokeLinecap="round" />
      {/* the papery sheath holding the bundle together */}
      <rect x="55" y="72" width="10" height="16" rx="3" fill="#a98766" />
      <g stroke="#406836" strokeWidth="2.5" strokeLinecap="round">
        <line x1="58" y1="74" x2="40" y2="10" />
        <line x1="62" y1="74" x2="82" y2="10" />
        {count === 3 && <line x1="60" y1="74" x2="60" y2="6" />}
      </g>
    </Twig>
  );
}

function DecandleDrawing() {
  return (
    <Twig label="decandle">
      <line x1="60" y1="98" x2="60" y2="58" stroke="#74573f" strokeWidth="5" strokeLinecap="round" />
      <g className="text-moss-700">
        {[92, 84, 76, 68].map((y) => (
          <Needles key={y} x={60} y={y} len={16} spread={1.1} />
        ))}
      </g>
      <rect x="55" y="12" width="10" height="44" rx="5" fill="#c2d9a0" stroke="#548347" strokeWidth="1.5" opacity="0.5" strokeDasharray="4 3" />
      {/* the cut, at the base of the candle */}
      <line x1="42" y1="58" x2="78" y2="58" stroke="#8a3b1f" strokeWidth="3" strokeDasharray="5 3" />
      <path d="M84 50 l10 -8 M84 66 l10 8" stroke="#8a3b1f" strokeWidth="3" strokeLinecap="round" />
    </Twig>
  );
}

function PinchDrawing() {
  return (
    <Twig label="pinch">
      <line x1="60" y1="98" x2="60" y2="62" stroke="#74573f" strokeWidth="5" strokeLinecap="round" />
      <g className="text-moss-700">
        {[92, 84, 76, 68].map((y) => (
          <Needles key={y} x={60} y={y} len={16} spread={1.1} />
        ))}
      </g>
      <rect x="55" y="34" width="10" height="28" rx="5" fill="#c2d9a0" stroke="#548347" strokeWidth="1.5" />
      <rect x="55" y="10" width="10" height="22" rx="5" fill="#c2d9a0" stroke="#548347" strokeWidth="1.5" opacity="0.45" strokeDasharray="4 3" />
      {/* finger and thumb at the break */}
      <ellipse cx="42" cy="33" rx="12" ry="6" fill="#dacbb7" stroke="#74573f" strokeWidth="1.5" />
      <ellipse cx="78" cy="33" rx="12" ry="6" fill="#dacbb7" stroke="#74573f" strokeWidth="1.5" />
    </Twig>
  );
}

function BackBudDrawing() {
  return (
    <Twig label="back-bud">
      <line x1="10" y1="80" x2="110" y2="40" stroke="#74573f" strokeWidth="5" strokeLinecap="round" />
      <g className="text-moss-600">
        {[
          [100, 44],
          [108, 41],
        ].map(([x, y]) => (
          <Needles key={x} x={x} y={y} len={14} />
        ))}
      </g>
      {[
        [40, 68],
        [60, 60],
      ].map(([x, y]) => (
        <g key={x}>
          <ellipse cx={x} cy={y - 8} rx="4" ry="7" fill="#a98766" />
          <circle cx={x} cy={y - 8} r="12" fill="none" stroke="#33522c" strokeWidth="1.5" strokeDasharray="3 3" />
        </g>
      ))}
    </Twig>
  );
}

function FlushDrawing() {
  return (
    <Twig label="flush">
      <line x1="60" y1="98" x2="60" y2="50" stroke="#74573f" strokeWidth="5" strokeLinecap="round" />
      {[30, 60, 90].map((x, i) => (
        <rect
          key={x}
          x={x - 5}
          y={14 + i * 4}
          width="10"
          height="38"
          rx="5"
          fill="#c2d9a0"
          stroke="#548347"
          strokeWidth="1.5"
          transform={`rotate(${(x - 60) / 2} 60 54)`}
        />
      ))}
    </Twig>
  );
}

function PadDrawing() {
  return (
    <Twig label="pad">
      <path d="M14 60 Q30 30 60 30 Q92 30 106 60 Q60 70 14 60 Z" fill="#c4d9ba" stroke="#406836" strokeWidth="2" />
      <line x1="10" y1="90" x2="60" y2="64" stroke="#74573f" strokeWidth="5" strokeLinecap="round" />
    </Twig>
  );
}

/** A drawing for a trade term, or null when words alone say it best. */
export function TermDrawing({ term }: { term: string }) {
  switch (term) {
    case 'candle':
      return <ShootDrawing state="candle-extending" />;
    case 'hardened':
      return <ShootDrawing state="needles-hardened" />;
    case 'decandle':
      return <DecandleDrawing />;
    case 'pinch':
      return <PinchDrawing />;
    case 'needle bundle':
      return <NeedleBundleDrawing count={3} />;
    case 'needle pair':
      return <NeedleBundleDrawing count={2} />;
    case 'silhouette':
      return <PositionDrawing position="beyond-silhouette" />;
    case 'interior shoot':
      return <PositionDrawing position="interior" />;
    case 'refinement':
    case 'ramification':
      return <BranchingDrawing level="tertiary" />;
    case 'development':
      return <BranchingDrawing level="primary" />;
    case 'back bud':
    case 'lateral bud':
      return <BackBudDrawing />;
    case 'flush':
    case 'whorl':
      return <FlushDrawing />;
    case 'pad':
      return <PadDrawing />;
    default:
      return null;
  }
}
