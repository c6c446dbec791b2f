import { useState, type ReactNode } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { UseQueryResult } from '@tanstack/react-query';
import { Loading, ServerError } from './desk-ui';
import { Field, Select } from './desk-form';
import { Button } from '@/components/ui/button';
import { DensityProvider } from '@/components/ui/density';
import { useTranslation } from 'react-i18next';

type Paper = 'A4' | 'letter';
const papers: readonly Paper[] = ['A4', 'letter'];

/** The ids a print sheet was opened for (`?ids=3,7`); null prints them all. Anything but a positive id is ignored. */
function usePrintIds(): number[] | null {
  const [params] = useSearchParams();
  const raw = params.get('ids');
  if (raw === null) return null;
  return raw
    .split(',')
    .map((part) => Number(part.trim()))
    .filter((id) => Number.isInteger(id) && id > 0);
}

/**
 * A printable sheet: the @page size follows the paper chosen, and printing shows the sheet alone, whatever the
 * surrounding layout, so the desk header never ends up on a tag.
 */
export function PrintSheet<T>({
  title,
  columns,
  what,
  useItems,
  children,
}: {
  title: string;
  columns: number;
  /** What the sheet prints, for the loading line: "tags", "badge cards". */
  what: string;
  /** The query for the ids the sheet was opened for (`?ids=3,7`, all when absent). */
  useItems: (ids: number[] | null) => UseQueryResult<T[]>;
  children: (item: T) => ReactNode;
}) {
  const { t } = useTranslation('common');
  const items = useItems(usePrintIds());
  const [paper, setPaper] = useState<Paper>('A4');
  if (items.isPending) return <Loading what={what} />;
  if (items.isError) return <ServerError error={items.error} title={t('print.notLoaded', { title })} />;
  const css = `
@page { size: ${paper === 'A4' ? 'A4' : 'letter'} portrait; margin: ${paper === 'A4' ? '12mm' : '0.5in'}; }
@media print {
  html, body { background: #fff !important; }
  body * { visibility: hidden; }
  [data-print-sheet], [data-print-sheet] * { visibility: visible; }
  [data-print-sheet] { position: absolute; inset: 0 auto auto 0; width: 100%; }
  [data-print-controls] { display: none !important; }
}`;
  return (
    <DensityProvider value="desk">
      <div className="flex flex-col gap-4">
        <style>{css}</style>
        <div data-print-controls className="flex flex-wrap items-end gap-3">
          <h1 className="mr-auto text-[32px] font-bold">{title}</h1>
          <Field label={t('print.paper')}>
            <Select
              value={paper}
              onChange={(e) => setPaper(e.target.value as Paper)}
              aria-label={t('print.paperSize')}
            >
              {papers.map((size) => (
                <option key={size} value={size}>
                  {t(size === 'A4' ? 'print.a4' : 'print.letter')}
                </option>
              ))}
            </Select>
          </Field>
          <Button tone="primary" onClick={() => window.print()}>
            {t('print.print')}
          </Button>
        </div>
        <div
          data-print-sheet
          data-paper={paper}
          className="grid gap-[6mm] bg-white p-[4mm] text-black"
          style={{ gridTemplateColumns: `repeat(${columns}, minmax(0, 1fr))` }}
        >
          {items.data.map(children)}
        </div>
      </div>
    </DensityProvider>
  );
}

/** The server renders the QR code as SVG text; it contains no script and is shown as an image. */
export function QrImage({ svg, label, sizeMm }: { svg: string; label: string; sizeMm: number }) {
  return (
    <img
      alt={label}
      src={`data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`}
      style={{ width: `${sizeMm}mm`, height: `${sizeMm}mm` }}
    />
  );
}
