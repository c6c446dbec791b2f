import type { InputHTMLAttributes, ReactNode, SelectHTMLAttributes } from 'react';
import { forwardRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import { decimalText, typedDecimal } from '@/lib/typed-number';

/** Desk screens are used with mouse and keyboard: denser than the kiosk, never below 16 px text. */
export const inputClass =
  'h-10 w-full rounded-lg border-2 border-ink-line bg-ink px-3 text-[17px] text-paper placeholder:text-ink-muted aria-[invalid=true]:border-warning-edge';

export const Input = forwardRef<HTMLInputElement, InputHTMLAttributes<HTMLInputElement>>(function Input(
  { className = '', ...rest },
  ref,
) {
  return <input ref={ref} className={`${inputClass} ${className}`} {...rest} />;
});

/**
 * A figure typed with the screen's decimal mark ("5,5" on a German screen). It shows its value written in that
 * language, hands the form the number it reads (typedDecimal): undefined when empty, NaN when it cannot be read, so
 * the form's schema refuses it in words instead of keeping an older figure. A value set from outside (a button that
 * fills the form) replaces the text.
 */
export function DecimalInput({
  value,
  onChange,
  className = '',
  ...rest
}: Omit<InputHTMLAttributes<HTMLInputElement>, 'value' | 'defaultValue' | 'onChange' | 'type'> & {
  value: number | null | undefined;
  onChange: (value: number | undefined) => void;
}) {
  const { i18n } = useTranslation();
  const [text, setText] = useState(() => decimalText(value, i18n.language));
  const [shown, setShown] = useState(value);
  if (!Object.is(value ?? undefined, shown ?? undefined)) {
    setShown(value);
    setText(decimalText(value, i18n.language));
  }
  return (
    <input
      {...rest}
      inputMode="decimal"
      className={`${inputClass} tabular ${className}`}
      value={text}
      onChange={(e) => {
        const read = typedDecimal(e.target.value, i18n.language);
        setText(e.target.value);
        setShown(read);
        onChange(read);
      }}
    />
  );
}

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
