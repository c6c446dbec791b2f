import { localNumber } from '@shared/domain/words';
import { useId, type PointerEvent } from 'react';
import type { LevelMarks } from '@shared/schemas/limits';
import { useTranslation } from 'react-i18next';

interface SightGlassProps {
  range: { min: number; max: number };
  marks: LevelMarks;
  /** null: not read yet; the glass is drawn without fluid so nothing looks like a reading. */
  value: number | null;
  unitLabel: string;
  onSet: (value: number) => void;
  /** Resolution of a tap, in the glass's unit. */
  resolution?: number;
}

const viewWidth = 380;
const viewHeight = 560;
const tubeX = 70;
const tubeWidth = 110;
const top = 24;
const bottom = viewHeight - 24;

/**
 * A reservoir sight glass drawn to scale with its marks. Tapping on it sets the level where the finger lands,
 * so the mechanic copies what the real glass shows instead of typing a number.
 */
export function SightGlass({ range, marks, value, unitLabel, onSet, resolution = 0.1 }: SightGlassProps) {
  const { t } = useTranslation('common');
  const clipId = useId();
  const span = range.max - range.min;
  const y = (level: number) => bottom - ((level - range.min) / span) * (bottom - top);

  const setFromPointer = (event: PointerEvent<SVGSVGElement>) => {
    const box = event.currentTarget.getBoundingClientRect();
    const svgY = ((event.clientY - box.top) / box.height) * viewHeight;
    const raw = range.min + ((bottom - svgY) / (bottom - top)) * span;
    const clamped = Math.min(range.max, Math.max(range.min, raw));
    // Snapping to the glass's resolution is what the eye does too; the verdict is still judged unrounded on it.
    const snapped = Math.round(clamped / resolution) * resolution;
    onSet(Number(snapped.toFixed(6)));
  };

  const ticks: number[] = [];
  for (let level = Math.ceil(range.min); level <= range.max; level += 1) ticks.push(level);

  const markRows: { key: string; label: string; level: number; colour: string; dashed?: boolean }[] = [
    { key: 'maximum', label: 'MAX', level: marks.maximum, colour: 'var(--gw-caution-text)' },
    { key: 'normal', label: 'NORMAL', level: marks.normal, colour: 'var(--gw-normal-text)' },
    { key: 'minimum', label: 'MIN', level: marks.minimum, colour: 'var(--gw-caution-text)' },
    ...(marks.isolation !== undefined
      ? [
          {
            key: 'isolation',
            label: 'ISOLATION',
            level: marks.isolation,
            colour: 'var(--gw-warning-text)',
            dashed: true,
          },
        ]
      : []),
  ];

  return (
    <svg
      data-testid="sight-glass"
      data-range-min={range.min}
      data-range-max={range.max}
      data-top={top / viewHeight}
      data-bottom={bottom / viewHeight}
      role="slider"
      aria-label={t('sightGlass.label')}
      aria-valuemin={range.min}
      aria-valuemax={range.max}
      aria-valuenow={value ?? undefined}
      aria-valuetext={value === null ? t('sightGlass.notRead') : `${localNumber(value, 1)} ${unitLabel}`}
      tabIndex={0}
      viewBox={`0 0 ${viewWidth} ${viewHeight}`}
      className="h-[min(56dvh,520px)] w-auto shrink-0 cursor-pointer touch-none select-none outline-none"
      onPointerDown={setFromPointer}
      onPointerMove={(event) => {
        if (event.buttons === 1) setFromPointer(event);
      }}
      onKeyDown={(event) => {
        const current = value ?? marks.normal;
        if (event.key === 'ArrowUp') onSet(Math.min(range.max, Number((current + resolution).toFixed(6))));
        if (event.key === 'ArrowDown') onSet(Math.max(range.min, Number((current - resolution).toFixed(6))));
      }}
    >
      <defs>
        <clipPath id={clipId}>
          <rect x={tubeX} y={top} width={tubeWidth} height={bottom - top} rx="22" />
        </clipPath>
        <linearGradient id={`${clipId}-fluid`} x1="0" x2="1">
          <stop offset="0" stopColor="#b4461f" />
          <stop offset="0.45" stopColor="#e0763d" />
          <stop offset="1" stopColor="#a33d1a" />
        </linearGradient>
      </defs>
      {/* Bezel and glass */}
      <rect
        x={tubeX - 14}
        y={top - 14}
        width={tubeWidth + 28}
        height={bottom - top + 28}
        rx="30"
        fill="var(--gw-ink-raised)"
        stroke="var(--gw-ink-line)"
        strokeWidth="3"
      />
      <rect x={tubeX} y={top} width={tubeWidth} height={bottom - top} rx="22" fill="var(--gw-glass-tube)" />
      <g clipPath={`url(#${clipId})`}>
        {value !== null && (
          <>
            <rect
              x={tubeX}
              y={y(value)}
              width={tubeWidth}
              height={bottom - y(value) + 30}
              fill={`url(#${clipId}-fluid)`}
            />
            <rect x={tubeX} y={y(value) - 3} width={tubeWidth} height="6" fill="var(--gw-paper)" />
          </>
        )}
        {value === null && (
          <text
            x={tubeX + tubeWidth / 2}
            y={(top + bottom) / 2}
            textAnchor="middle"
            fill="var(--gw-ink-muted)"
            fontSize="26"
            fontWeight="600"
            transform={`rotate(-90 ${tubeX + tubeWidth / 2} ${(top + bottom) / 2})`}
          >
            {t('sightGlass.tap')}
          </text>
        )}
        <rect x={tubeX + 12} y={top} width="10" height={bottom - top} fill="#ffffff" opacity="0.12" />
      </g>
      {/* Scale on the left */}
      {ticks.map((level) => (
        <g key={level}>
          <line
            x1={tubeX - 14}
            x2={tubeX - 2}
            y1={y(level)}
            y2={y(level)}
            stroke="var(--gw-ink-muted)"
            strokeWidth="2"
          />
          <text x={tubeX - 20} y={y(level) + 7} textAnchor="end" fill="var(--gw-ink-muted)" fontSize="20">
            {level}
          </text>
        </g>
      ))}
      {/* Marks across the glass with their names on the right */}
      {markRows.map((mark) => (
        <g key={mark.key}>
          <line
            x1={tubeX - 6}
            x2={tubeX + tubeWidth + 18}
            y1={y(mark.level)}
            y2={y(mark.level)}
            stroke={mark.colour}
            strokeWidth="4"
            strokeDasharray={mark.dashed ? '10 7' : undefined}
          />
          <text
            x={tubeX + tubeWidth + 26}
            y={y(mark.level) + 8}
            fill={mark.colour}
            fontSize="24"
            fontWeight="700"
          >
            {mark.label} {mark.level.toFixed(1)}
          </text>
        </g>
      ))}
      <text
        x={tubeX + tubeWidth / 2}
        y={viewHeight - 2}
        textAnchor="middle"
        fill="var(--gw-ink-muted)"
        fontSize="18"
      >
        {unitLabel}
      </text>
    </svg>
  );
}
