import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from 'react';
import { forwardRef } from 'react';
import { errorMessage } from '@/lib/api-client';
import { Notice } from '@/components/ui/notice';
import { LimitsNotice } from '@/components/ui/limits-notice';

/** Desk screens are used with mouse and keyboard: denser than the kiosk, never below 16 px text. */
export const inputClass =
  'h-10 w-full rounded-lg border-2 border-ink-line bg-ink px-3 text-[17px] text-paper placeholder:text-ink-muted aria-[invalid=true]:border-warning-bright';

export const Input = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement>>(function Input(
  { className = '', ...rest },
  ref,
) {
  return <input ref={ref} className={`${inputClass} ${className}`} {...rest} />;
});

export const Select = forwardRef<HTMLSelectElement, SelectHTMLAttributes<HTMLSelectElement>>(function Select(
  { className = '', children, ...rest },
  ref,
) {
  return (
    <select ref={ref} className={`${inputClass} ${className}`} {...rest}>
      {children}
    </select>
  );
});

export function Field({
  label,
  error,
  hint,
  children,
  className = '',
}: {
  label: ReactNode;
  error?: string | undefined;
  hint?: ReactNode;
  children: ReactNode;
  className?: string;
}) {
  return (
    <label className={`flex min-w-0 flex-col gap-1 ${className}`}>
      <span className="text-[16px] font-semibold text-ink-muted">{label}</span>
      {children}
      {hint && !error && <span className="text-[15px] text-ink-muted">{hint}</span>}
      {error && <span className="text-[16px] text-warning-text">{error}</span>}
    </label>
  );
}

export function Panel({
  title,
  actions,
  children,
}: {
  title?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
}) {
  return (
    <section className="flex flex-col gap-3 rounded-xl border-2 border-ink-line bg-ink-soft p-4">
      {(title || actions) && (
        <div className="flex flex-wrap items-center gap-3">
          {title && <h2 className="mr-auto text-[22px] font-bold">{title}</h2>}
          {actions}
        </div>
      )}
      {children}
    </section>
  );
}

export function DeskPage({
  title,
  actions,
  showsLimits = false,
  children,
}: {
  title: ReactNode;
  actions?: ReactNode;
  showsLimits?: boolean;
  children: ReactNode;
}) {
  return (
    <div className="flex flex-col gap-4 text-[17px]">
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="mr-auto text-[32px] font-bold leading-tight">{title}</h1>
        {actions}
      </div>
      {showsLimits && (
        <div className="rounded-lg border-2 border-signal-bright/60 bg-ink-soft px-4 py-2">
          <LimitsNotice />
        </div>
      )}
      {children}
    </div>
  );
}

export function ServerError({ error, title = 'Not done' }: { error: unknown; title?: string }) {
  if (!error) return null;
  return (
    <Notice tone="caution" title={title}>
      {errorMessage(error)}
    </Notice>
  );
}

export const tableClass =
  'w-full border-collapse text-left text-[16px] [&_td]:border-t [&_td]:border-ink-line [&_td]:px-2 [&_td]:py-1.5 [&_th]:px-2 [&_th]:py-1.5 [&_th]:font-semibold [&_th]:text-ink-muted';

export function Loading({ what }: { what: string }) {
  return <p className="text-ink-muted">Loading {what}…</p>;
}

/** A change marker that never relies on colour: a word and a sign. */
export function ChangeTag({ change }: { change: 'added' | 'removed' | 'changed' }) {
  const style = {
    added: 'border-normal-bright text-normal-text',
    removed: 'border-warning-bright text-warning-text',
    changed: 'border-caution-bright text-caution-text',
  }[change];
  const sign = { added: '+', removed: '−', changed: '~' }[change];
  return (
    <span
      className={`inline-flex items-center gap-1 rounded border-2 px-1.5 text-[14px] font-bold uppercase ${style}`}
    >
      <span aria-hidden>{sign}</span>
      {change}
    </span>
  );
}

/** The options of a desk select, with an optional empty first choice ("all", "choose…"). */
export function Options<T>({
  none,
  items,
  value,
  label,
}: {
  none?: string;
  items: readonly T[] | undefined;
  value: (item: T) => string | number;
  label: (item: T) => ReactNode;
}) {
  return (
    <>
      {none !== undefined && <option value="">{none}</option>}
      {items?.map((item) => (
        <option key={value(item)} value={value(item)}>
          {label(item)}
        </option>
      ))}
    </>
  );
}

/** A row of checkboxes that picks several of `options`, kept in the order they were ticked. */
export function CheckboxSet<T extends string>({
  options,
  value,
  onChange,
  label = (option) => option,
}: {
  options: readonly T[];
  value: readonly T[];
  onChange: (picked: T[]) => void;
  label?: (option: T) => ReactNode;
}) {
  return (
    <div className="flex h-10 items-center gap-4">
      {options.map((option) => (
        <label key={option} className="flex items-center gap-1">
          <input
            type="checkbox"
            className="size-5"
            checked={value.includes(option)}
            onChange={(e) =>
              onChange(e.target.checked ? [...value, option] : value.filter((x) => x !== option))
            }
          />
          {label(option)}
        </label>
      ))}
    </div>
  );
}
