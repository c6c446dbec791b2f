import { useState, type ReactNode } from 'react';
import type { CheckKind } from '@shared/schemas/limits';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { errorMessage } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { QrScanner } from '@/components/ui/qr-scanner';
import { QrGlyph } from '@/components/ui/qr-glyph';
import { useAirframes } from '@/lib/shared-queries';
import { AirframeTile } from './airframe-tile';
import { CheckKindChooser } from './check-kind-chooser';
import { FleetNumberPad } from './fleet-number-pad';
import { tagTokenFrom } from './tag-token';

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
  const [scanning, setScanning] = useState(false);
  const [typing, setTyping] = useState(false);
  const [scanProblem, setScanProblem] = useState<string | null>(null);
  const selected = airframes.data?.find((airframe) => airframe.id === selectedId) ?? null;
  const now = airframes.dataUpdatedAt || Date.now();

  return (
    <div className="flex flex-col gap-5">
      <div className="grid grid-cols-2 gap-4">
        <Button
          tone="primary"
          size="large"
          onClick={() => {
            setScanProblem(null);
            setScanning(true);
          }}
        >
          <QrGlyph /> Scan tag
        </Button>
        <Button tone="neutral" size="large" onClick={() => setTyping(true)}>
          Type fleet number
        </Button>
      </div>
      {scanProblem && (
        <Notice tone="caution" title="Not an airframe tag">
          {scanProblem}
        </Notice>
      )}

      {selected && (
        <CheckKindChooser airframe={selected} onStart={(kind) => onStart(selected.id, kind)} now={now}>
          {selectedExtras?.(selected)}
        </CheckKindChooser>
      )}

      {airframes.isPending && <p className="text-lead text-ink-muted">Loading the fleet…</p>}
      {airframes.isError && (
        <Notice tone="warning" title="The fleet list did not load">
          {errorMessage(airframes.error)}
        </Notice>
      )}
      {airframes.data && (
        <ul className="grid gap-4 landscape:grid-cols-2 portrait:grid-cols-1" aria-label="Airframes">
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

      {scanning && (
        <QrScanner
          what="tag"
          onClose={() => setScanning(false)}
          onResult={(text) => {
            setScanning(false);
            const token = tagTokenFrom(text);
            if (token) onTag(token);
            else
              setScanProblem(
                'That QR code is not a Gaugewalk airframe tag. Scan the tag on the airframe, or type the fleet number.',
              );
          }}
        />
      )}
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
