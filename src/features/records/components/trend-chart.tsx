import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { TrendSystem } from '@shared/schemas/records';

/**
 * Level over time (left axis, litres) and fluid added per flight hour (right axis) with the type's alert level
 * drawn as a dashed line. Points are drawn as well as lines so a single check is visible.
 */
export function TrendChart({
  system,
  threshold,
  days,
  width = 1100,
}: {
  system: TrendSystem;
  threshold: number;
  days: number;
  width?: number;
}) {
  const box = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!box.current) return;
    // The whole window is drawn, with the alert level across it, even when there is a single check.
    const end = Date.now();
    const start = end - days * 86_400_000;
    const stamps = [
      ...new Set([...system.levels.map((l) => l.at), ...system.ratePerFh.map((r) => r.at)]),
    ].sort();
    const times = [new Date(start).toISOString(), ...stamps, new Date(end).toISOString()];
    const xs = times.map((t) => Date.parse(t) / 1000);
    const level = times.map((t) => system.levels.find((l) => l.at === t)?.levelL ?? null);
    const rate = times.map((t) => system.ratePerFh.find((r) => r.at === t)?.litresPerFh ?? null);
    const limit = times.map(() => threshold);
    const maxRate = Math.max(
      threshold * 1.5,
      ...rate.filter((r): r is number => r !== null).map((r) => r * 1.1),
    );
    const maxLevel = Math.max(1, ...level.filter((l): l is number => l !== null)) * 1.2;
    const axis = {
      stroke: '#b9c3cc',
      grid: { stroke: '#3a5166', width: 1 },
      ticks: { stroke: '#3a5166' },
      font: '15px Barlow',
    };
    const plot = new uPlot(
      {
        width,
        height: 300,
        scales: {
          x: { time: true, range: [start / 1000, end / 1000] },
          L: { range: [0, maxLevel] },
          rate: { range: [0, maxRate] },
        },
        series: [
          {},
          {
            label: 'Level (L)',
            scale: 'L',
            stroke: '#5aa9ff',
            width: 2,
            points: { show: true, size: 7 },
            spanGaps: true,
          },
          {
            label: 'Added per flight hour (L/FH)',
            scale: 'rate',
            stroke: '#ffb81c',
            width: 0,
            points: { show: true, size: 10, fill: '#ffb81c' },
            paths: () => null,
          },
          {
            label: `Alert level ${threshold} L/FH`,
            scale: 'rate',
            stroke: '#ff5a4e',
            width: 2,
            dash: [8, 6],
            points: { show: false },
          },
        ],
        axes: [
          { ...axis },
          { ...axis, scale: 'L', label: 'Level, L', labelFont: '15px Barlow' },
          {
            ...axis,
            scale: 'rate',
            side: 1,
            label: 'L per flight hour',
            labelFont: '15px Barlow',
            grid: { show: false },
          },
        ],
        legend: { show: true },
      },
      [xs, level, rate, limit],
      box.current,
    );
    return () => plot.destroy();
  }, [system, threshold, days, width]);
  return (
    <div
      ref={box}
      className="rounded-lg bg-ink p-2 [&_.u-legend]:text-[15px] [&_.u-legend]:text-paper"
      data-testid={`trend-${system.system}`}
    />
  );
}
