import { useEffect, useRef } from 'react';
import uPlot from 'uplot';
import type { TFunction } from 'i18next';
import { useTranslation } from 'react-i18next';
import 'uplot/dist/uPlot.min.css';
import type { TrendSystem } from '@shared/schemas/records';
import { recordTime } from '@/lib/when';

const axis = {
  stroke: '#b9c3cc',
  grid: { stroke: '#3a5166', width: 1 },
  ticks: { stroke: '#3a5166' },
  font: '15px Barlow',
};

/**
 * The time axis in the screen's language, on the records' clock (UTC): ticks as that language writes a day
 * ("7 Sept", "7. Sept."), and each point's time in the legend as the records write it, where uPlot's own were
 * American ("9/7") and 12-hour, on the desk computer's clock.
 */
function timeAxis(t: TFunction<'records'>, language: string) {
  const dayMonth = new Intl.DateTimeFormat(language, { day: 'numeric', month: 'short', timeZone: 'UTC' });
  return {
    tzDate: (seconds: number) => uPlot.tzDate(new Date(seconds * 1000), 'UTC'),
    axis: {
      ...axis,
      // At least 90 px a tick: "22. Sept." is wider than uPlot's "9/22".
      space: 90,
      values: (_plot: uPlot, splits: number[]) => splits.map((seconds) => dayMonth.format(seconds * 1000)),
    },
    series: {
      label: t('chart.timeSeries'),
      value: (_plot: uPlot, at: number | null) => recordTime(at === null ? null : at * 1000),
    },
  };
}

interface Span {
  start: number;
  end: number;
}

/** Draws a plot into the box and removes it when the data change or the chart goes. */
function drawInto(box: HTMLDivElement | null, made: { options: uPlot.Options; data: uPlot.AlignedData }) {
  if (!box) return undefined;
  const plot = new uPlot(made.options, made.data, box);
  return () => plot.destroy();
}

function levelPlot(
  system: TrendSystem,
  span: Span,
  width: number,
  t: TFunction<'records'>,
  language: string,
) {
  const time = timeAxis(t, language);
  const times = [span.start, ...system.levels.map((l) => Date.parse(l.at)), span.end];
  const level = [null, ...system.levels.map((l) => l.levelL), null];
  const maxLevel = Math.max(1, ...system.levels.map((l) => l.levelL)) * 1.2;
  return {
    options: {
      width,
      height: 260,
      scales: { x: { time: true, range: [span.start / 1000, span.end / 1000] }, L: { range: [0, maxLevel] } },
      tzDate: time.tzDate,
      series: [
        time.series,
        {
          label: t('chart.levelSeries'),
          scale: 'L',
          stroke: '#5aa9ff',
          width: 2,
          points: { show: true, size: 7 },
          spanGaps: true,
        },
      ],
      axes: [time.axis, { ...axis, scale: 'L', label: t('chart.levelAxis'), labelFont: '15px Barlow' }],
      legend: { show: true },
    } satisfies uPlot.Options,
    data: [times.map((t) => t / 1000), level] as uPlot.AlignedData,
  };
}

function ratePlot(
  system: TrendSystem,
  threshold: number,
  span: Span,
  width: number,
  t: TFunction<'records'>,
  language: string,
) {
  const times = [span.start, ...system.ratePerFh.map((r) => Date.parse(r.at)), span.end];
  const rate = [null, ...system.ratePerFh.map((r) => r.litresPerFh), null];
  const maxRate = Math.max(threshold * 1.5, ...system.ratePerFh.map((r) => r.litresPerFh * 1.1));
  const time = timeAxis(t, language);
  return {
    options: {
      width,
      height: 200,
      scales: {
        x: { time: true, range: [span.start / 1000, span.end / 1000] },
        rate: { range: [0, maxRate] },
      },
      tzDate: time.tzDate,
      series: [
        time.series,
        {
          label: t('chart.rateSeries'),
          scale: 'rate',
          stroke: '#ffb81c',
          width: 0,
          points: { show: true, size: 10, fill: '#ffb81c' },
          paths: () => null,
        },
        {
          label: t('chart.alertSeries', {
            threshold: new Intl.NumberFormat(language, { useGrouping: false }).format(threshold),
          }),
          scale: 'rate',
          stroke: '#ff5a4e',
          width: 2,
          dash: [8, 6],
          points: { show: false },
        },
      ],
      axes: [time.axis, { ...axis, scale: 'rate', label: t('chart.rateAxis'), labelFont: '15px Barlow' }],
      legend: { show: true },
    } satisfies uPlot.Options,
    data: [times.map((t) => t / 1000), rate, times.map(() => threshold)] as uPlot.AlignedData,
  };
}

/**
 * Two plots over the same window, one above the other: the level with its own axis in litres, and fluid added per
 * flight hour with the type's alert level on an axis of its own ("L per flight hour"). Drawn on one plot, the alert
 * line crossed the level axis and read as a level mark. Points are drawn as well as lines so one check shows.
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
  const { t, i18n } = useTranslation('records');
  const levelBox = useRef<HTMLDivElement>(null);
  const rateBox = useRef<HTMLDivElement>(null);
  // The whole window is drawn, with the alert level across it, even when there is a single check.
  useEffect(() => {
    const end = Date.now();
    return drawInto(
      levelBox.current,
      levelPlot(system, { start: end - days * 86_400_000, end }, width, t, i18n.language),
    );
  }, [system, days, width, t, i18n.language]);
  useEffect(() => {
    const end = Date.now();
    return drawInto(
      rateBox.current,
      ratePlot(system, threshold, { start: end - days * 86_400_000, end }, width, t, i18n.language),
    );
  }, [system, threshold, days, width, t, i18n.language]);
  const frame = 'rounded-lg bg-ink p-2 [&_.u-legend]:text-[15px] [&_.u-legend]:text-paper';
  return (
    <div className="flex flex-col gap-2" data-testid={`trend-${system.system}`}>
      <div ref={levelBox} className={frame} data-testid={`trend-${system.system}-level`} />
      <div ref={rateBox} className={frame} data-testid={`trend-${system.system}-rate`} />
    </div>
  );
}
