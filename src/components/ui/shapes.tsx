import type { Verdict } from '@shared/schemas/limits';
import type { AirframeState } from '@shared/schemas/airframes';
import { Stroke } from './stroke';

/** The tick inside a filled shape: the surface behind it, or the ink when none is set. */
const shapeInk = 'var(--shape-ink, var(--gw-ink))';

// Shapes carry meaning for anyone who cannot tell the colours apart: circle = good, triangle = attention,
// octagon = stop. They are drawn, not font glyphs, so they look the same on every tablet. A filled circle with a
// tick is kept for "Released" (a certificate of release to service in force); "Checks in limits" claims no
// release, so it is only the outline of that circle.
export type Shape = 'circle-check' | 'ring-check' | 'triangle' | 'octagon' | 'clock' | 'half' | 'dashed';

export const verdictShape: Record<Verdict, Shape> = {
  in_limits: 'circle-check',
  service: 'triangle',
  out_of_limits: 'octagon',
};

export const stateShape: Record<AirframeState, Shape> = {
  unserviceable: 'octagon',
  released: 'circle-check',
  checks_in_limits: 'ring-check',
  due: 'clock',
  in_progress: 'half',
  not_checked: 'dashed',
};

export function ShapeIcon({
  shape,
  size = 32,
  className = '',
}: {
  shape: Shape;
  size?: number;
  className?: string;
}) {
  const common = {
    width: size,
    height: size,
    viewBox: '0 0 32 32',
    'aria-hidden': true,
    className: `shrink-0 ${className}`,
  } as const;
  switch (shape) {
    case 'circle-check':
      return (
        <svg {...common}>
          <circle cx="16" cy="16" r="14" fill="currentColor" />
          <Stroke d="M9 16.5l4.5 4.5L23 11" width={3.5} color={shapeInk} roundEnds />
        </svg>
      );
    case 'ring-check':
      return (
        <svg {...common}>
          <circle cx="16" cy="16" r="13" fill="none" stroke="currentColor" strokeWidth="3" />
          <Stroke d="M10 16.5l4 4L22.5 12" width={3} roundEnds />
        </svg>
      );
    case 'triangle':
      return (
        <svg {...common}>
          <path d="M16 2.5L30.5 28.5H1.5Z" fill="currentColor" strokeLinejoin="round" />
          <path
            d="M16 11v8.5"
            stroke="var(--shape-ink, var(--gw-ink))"
            strokeWidth="3.5"
            strokeLinecap="round"
          />
          <circle cx="16" cy="24" r="2" fill="var(--shape-ink, var(--gw-ink))" />
        </svg>
      );
    case 'octagon':
      return (
        <svg {...common}>
          <path d="M10.2 2h11.6L30 10.2v11.6L21.8 30H10.2L2 21.8V10.2Z" fill="currentColor" />
          <path
            d="M11 11l10 10M21 11L11 21"
            stroke="var(--shape-ink, var(--gw-ink))"
            strokeWidth="3.5"
            strokeLinecap="round"
          />
        </svg>
      );
    case 'clock':
      return (
        <svg {...common}>
          <rect x="3" y="3" width="26" height="26" rx="3" transform="rotate(45 16 16)" fill="currentColor" />
          <path
            d="M16 9v7.5l4.5 3"
            fill="none"
            stroke="var(--shape-ink, var(--gw-ink))"
            strokeWidth="3"
            strokeLinecap="round"
          />
        </svg>
      );
    case 'half':
      return (
        <svg {...common}>
          <circle cx="16" cy="16" r="13" fill="none" stroke="currentColor" strokeWidth="3" />
          <path d="M16 3a13 13 0 0 1 0 26Z" fill="currentColor" />
        </svg>
      );
    case 'dashed':
      return (
        <svg {...common}>
          <rect
            x="4"
            y="4"
            width="24"
            height="24"
            rx="4"
            fill="none"
            stroke="currentColor"
            strokeWidth="3"
            strokeDasharray="5 4"
          />
        </svg>
      );
  }
}
