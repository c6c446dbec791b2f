import { useState } from 'react';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { Button } from '@/components/ui/button';
import { Keypad } from '@/components/ui/keypad';

const digitsOf = (fleetNumber: string) => fleetNumber.replace(/\D/g, '');

/** For a dirty or missing tag: type the digits of the fleet number ("1" finds T-01) and pick the match. */
export function FleetNumberPad({
  airframes,
  onPick,
  onClose,
}: {
  airframes: AirframeSummary[];
  onPick: (airframe: AirframeSummary) => void;
  onClose: () => void;
}) {
  const [digits, setDigits] = useState('');
  const matches =
    digits === ''
      ? []
      : airframes.filter((airframe) => Number(digitsOf(airframe.fleetNumber)) === Number(digits));

  return (
    <div
      role="dialog"
      aria-modal="true"
      aria-label="Type fleet number"
      className="fixed inset-0 z-50 flex flex-col gap-5 overflow-auto bg-ink p-6"
    >
      <div className="flex items-center gap-4">
        <h2 className="mr-auto text-[34px] font-bold">Type the fleet number</h2>
        <Button tone="neutral" size="large" onClick={onClose}>
          Back to list
        </Button>
      </div>
      <div className="grid flex-1 gap-6 landscape:grid-cols-[1fr_420px]">
        <div className="flex flex-col gap-4">
          <output className="tabular flex min-h-[112px] items-center rounded-xl border-2 border-ink-line bg-ink-soft px-6 text-[64px] font-bold">
            {digits || (
              <span className="text-[28px] font-normal text-ink-muted">
                Digits on the tail, e.g. 1 for T-01
              </span>
            )}
          </output>
          {digits !== '' && matches.length === 0 && (
            <p className="text-lead text-caution-text">No airframe in this fleet has that number.</p>
          )}
          {matches.map((airframe) => (
            <Button key={airframe.id} tone="primary" size="huge" onClick={() => onPick(airframe)}>
              Open {airframe.fleetNumber} ({airframe.type.code})
            </Button>
          ))}
        </div>
        <Keypad
          onDigit={(digit) => setDigits((value) => (value.length < 6 ? value + digit : value))}
          onBackspace={() => setDigits((value) => value.slice(0, -1))}
        />
      </div>
    </div>
  );
}
