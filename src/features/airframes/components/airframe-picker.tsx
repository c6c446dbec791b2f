import { useState, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import type { CheckKind } from '@shared/schemas/limits';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useAirframes } from '@/lib/shared-queries';
import { AirframeTile } from './airframe-tile';
import { CheckKindChooser } from './check-kind-chooser';
import { FleetNumberPad } from './fleet-number-pad';
import { useTagScan } from './tag-scan';

interface AirframePickerProps {
  selectedId: number | null;
  onSelect: (airframeId: number | null) => void;
  onStart: (airframeId: number, kind: CheckKind) => void;
  onTag: (token: string) => void;
  /** More to do with the selected airframe than a check, for example raising a defect. */
  selectedExtras?: (airframe: AirframeSummary) => ReactNode;
}

export function AirframePicker({
  selectedId,
  onSelect,
  onStart,
  onTag,
  selectedExtras,
}: AirframePickerProps) {
  const airframes = useAirframes();
  const { t } = useTranslation('airframes');
  const [typing, setTyping] = useState(false);
  const tagScan = useTagScan(onTag, t('picker.otherwise'));
  const selected = airframes.data?.find((airframe) => airframe.id === selectedId) ?? null;
  const now = airframes.dataUpdatedAt || Date.now();

  return (
    <div className="flex flex-col gap-5">
      <div className="grid grid-cols-2 gap-4">
        {tagScan.button}
        <Button tone="neutral" size="large" onClick={() => setTyping(true)}>
          {t('picker.typeFleetNumber')}
        </Button>
      </div>
      {tagScan.problem}

      {selected && (
        <CheckKindChooser airframe={selected} onStart={(kind) => onStart(selected.id, kind)} now={now}>
          {selectedExtras?.(selected)}
        </CheckKindChooser>
      )}

      {airframes.isPending && <p className="text-lead text-ink-muted">{t('picker.loading')}</p>}
      {airframes.isError && (
        <Notice tone="warning" title={t('picker.notLoaded')}>
          {errorMessage(airframes.error)}
        </Notice>
      )}
      {airframes.data && (
        <ul
          className="grid gap-4 landscape:grid-cols-2 portrait:grid-cols-1"
          aria-label={t('picker.listLabel')}
        >
          {airframes.data.map((airframe) => (
            <li key={airframe.id} className="contents">
              <AirframeTile
                airframe={airframe}
                selected={airframe.id === selectedId}
                onOpen={() => onSelect(airframe.id === selectedId ? null : airframe.id)}
                now={now}
              />
            </li>
          ))}
        </ul>
      )}

      {tagScan.scanner}
      {typing && airframes.data && (
        <FleetNumberPad
          airframes={airframes.data}
          onClose={() => setTyping(false)}
          onPick={(airframe) => {
            setTyping(false);
            onSelect(airframe.id);
          }}
        />
      )}
    </div>
  );
}
