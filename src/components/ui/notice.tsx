import type { ReactNode } from 'react';
import { ShapeIcon, type Shape } from './shapes';
import { errorMessage } from '@/lib/api-client';

type Tone = 'info' | 'caution' | 'warning' | 'normal';

const tones: Record<Tone, { box: string; shape: Shape; icon: string }> = {
  info: { box: 'border-signal-edge bg-ink-soft', shape: 'half', icon: 'text-signal-text' },
  caution: { box: 'border-caution-edge bg-ink-soft', shape: 'triangle', icon: 'text-caution-edge' },
  warning: { box: 'border-warning-edge bg-ink-soft', shape: 'octagon', icon: 'text-warning-text' },
  normal: { box: 'border-normal-edge bg-ink-soft', shape: 'circle-check', icon: 'text-normal-text' },
};

/** A boxed message with a shape, for server messages and warnings; role=alert for the ones that need a look now. */
export function Notice({
  tone = 'info',
  title,
  children,
  big = false,
}: {
  tone?: Tone;
  title?: ReactNode;
  children?: ReactNode;
  big?: boolean;
}) {
  const t = tones[tone];
  return (
    <div
      role={tone === 'warning' || tone === 'caution' ? 'alert' : 'status'}
      className={`flex gap-4 rounded-xl border-l-8 border-2 p-4 ${t.box}`}
    >
      <ShapeIcon shape={t.shape} size={big ? 56 : 36} className={t.icon} />
      <div className="min-w-0">
        {title && (
          <div className={`${big ? 'text-[36px]' : 'text-[24px]'} font-bold leading-tight`}>{title}</div>
        )}
        {children && <div className={`${big ? 'text-[28px]' : 'text-[22px]'} leading-snug`}>{children}</div>}
      </div>
    </div>
  );
}

/**
 * Why an action did not happen, under one title: what the form found before sending (caution), then the
 * server's refusal of the last attempt (`failed`, a mutation or query; warning unless `failedTone` says otherwise).
 */
export function RefusalNotices({
  title,
  problem,
  failed,
  failedTone = 'warning',
}: {
  title: ReactNode;
  problem?: string | null;
  failed?: { isError: boolean; error: unknown };
  failedTone?: Tone;
}) {
  return (
    <>
      {problem && (
        <Notice tone="caution" title={title}>
          {problem}
        </Notice>
      )}
      {failed?.isError && (
        <Notice tone={failedTone} title={title}>
          {errorMessage(failed.error)}
        </Notice>
      )}
    </>
  );
}
