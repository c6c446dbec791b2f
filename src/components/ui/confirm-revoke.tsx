import { useState } from 'react';
import { Button } from './button';

/** "Revoke", then "Yes, revoke <name>" or "Keep it": a revocation always takes a second, deliberate tap. */
export function ConfirmRevoke({
  name,
  pending,
  onRevoke,
}: {
  name: string;
  pending: boolean;
  /** Revokes; calls `settled` when the server has answered either way. */
  onRevoke: (settled: () => void) => void;
}) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button tone="neutral" onClick={() => setAsking(true)}>
        Revoke
      </Button>
    );
  }
  return (
    <div className="flex gap-3">
      <Button tone="stop" onClick={() => onRevoke(() => setAsking(false))} disabled={pending}>
        Yes, revoke {name}
      </Button>
      <Button tone="neutral" onClick={() => setAsking(false)}>
        Keep it
      </Button>
    </div>
  );
}
