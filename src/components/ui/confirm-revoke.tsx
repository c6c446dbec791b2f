import { useState } from 'react';
import { Button } from './button';
import { useTranslation } from 'react-i18next';

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
  const { t } = useTranslation('common');
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button tone="neutral" onClick={() => setAsking(true)}>
        {t('revoke.revoke')}
      </Button>
    );
  }
  return (
    <div className="flex gap-3">
      <Button tone="stop" onClick={() => onRevoke(() => setAsking(false))} disabled={pending}>
        {t('revoke.confirm', { name })}
      </Button>
      <Button tone="neutral" onClick={() => setAsking(false)}>
        {t('revoke.keep')}
      </Button>
    </div>
  );
}
