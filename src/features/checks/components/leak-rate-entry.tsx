import { useState, type ReactNode } from 'react';
import type { Checkpoint, LeakState, ReadingEntry } from '@shared/schemas/limits';
import { leakRateUnitWords } from '@shared/domain/units';
import { Button } from '@/components/ui/button';
import { Keypad } from '@/components/ui/keypad';
import { useArmed } from './yes-no-entry';

interface LeakRateEntryProps {
  checkpoint: Checkpoint;
  entry: ReadingEntry | undefined;
  /** "No leak": one tap, 0 drops per minute. */
  onNoLeak: () => void;
  onEntry: (entry: ReadingEntry | undefined) => void;
  verdict: ReactNode;
}

const leakStates: { state: LeakState; title: string; detail: string }[] = [
  { state: 'static', title: 'Static leak', detail: 'System not pressurised' },
  { state: 'dynamic', title: 'Dynamic leak', detail: 'System pressurised or operating' },
];

/**
 * A leak judged by its rate: "No leak" is the big one-tap answer; a leak found is said static or dynamic and its
 * drops per minute are counted on the keypad, whole drops only.
 */
export function LeakRateEntry({ checkpoint, entry, onNoLeak, onEntry, verdict }: LeakRateEntryProps) {
  const [armed, disarm] = useArmed();
  const leak = entry !== undefined && 'dropsPerMinute' in entry ? entry : undefined;
  const noLeak = leak !== undefined && leak.dropsPerMinute === 0 && leak.leakState === undefined;
  const [state, setState] = useState<LeakState | undefined>(leak?.leakState);
  const [typed, setTyped] = useState<string>(leak?.leakState ? String(leak.dropsPerMinute) : '');

  const enter = (text: string, leakState: LeakState | undefined) => {
    setTyped(text);
    if (leakState === undefined || text === '') onEntry(undefined);
    else onEntry({ dropsPerMinute: Number(text), leakState });
  };
  const pickState = (leakState: LeakState) => {
    setState(leakState);
    enter(typed, leakState);
  };
  const type = (digit: string) => {
    if (typed.length >= 3) return;
    enter(typed === '0' ? digit : typed + digit, state);
  };

  return (
    <div className="flex flex-col gap-4">
      <button
        type="button"
        aria-pressed={noLeak}
        disabled={!armed}
        onClick={() => {
          disarm();
          setState(undefined);
          setTyped('');
          onNoLeak();
        }}
        className={`flex min-h-[180px] items-center justify-center rounded-2xl border-4 text-[56px] font-bold tracking-wide active:scale-[0.98] disabled:opacity-60 ${
          noLeak
            ? 'border-signal-bright bg-signal-bright text-ink'
            : 'border-ink-line bg-ink-raised text-paper'
        }`}
      >
        No leak
      </button>
      <div className="flex flex-col gap-3" role="group" aria-label="Leak found">
        <p className="text-[24px] text-ink-muted">Leak found? Say how you saw it, then count the drops.</p>
        <div className="flex gap-4 portrait:flex-col">
          {leakStates.map(({ state: option, title, detail }) => (
            <Button
              key={option}
              tone={state === option ? 'primary' : 'neutral'}
              size="large"
              aria-pressed={state === option}
              aria-label={title}
              disabled={!armed}
              onClick={() => pickState(option)}
              className="flex-1 flex-col"
            >
              <span>{title}</span>
              <span className="text-[20px] font-normal">{detail}</span>
            </Button>
          ))}
        </div>
      </div>
      {state === undefined ? (
        verdict
      ) : (
        <div className="flex gap-6 portrait:flex-col">
          <div className="flex min-w-0 flex-1 flex-col gap-4">
            <output
              data-testid="reading-value"
              aria-label={`${checkpoint.label}, drops per minute`}
              className="tabular flex items-baseline gap-3 py-3 text-[72px] font-bold leading-none"
            >
              {typed === '' ? (
                <span className="text-[28px] font-normal text-ink-muted">Count the drops for a minute</span>
              ) : (
                typed
              )}
              <span className="text-[32px] font-semibold text-ink-muted">{leakRateUnitWords}</span>
            </output>
            <Button tone="quiet" size="large" aria-label="Clear count" onClick={() => enter('', state)}>
              Clear
            </Button>
            <p className="text-[22px] text-ink-muted">
              Whole drops from 0 to {checkpoint.range.max} {leakRateUnitWords}. A running leak is out of
              limits whatever its rate.
            </p>
            {verdict}
          </div>
          <div className="w-[380px] portrait:mx-auto portrait:w-full portrait:max-w-[460px]">
            <Keypad onDigit={type} onBackspace={() => enter(typed.slice(0, -1), state)} />
          </div>
        </div>
      )}
    </div>
  );
}
