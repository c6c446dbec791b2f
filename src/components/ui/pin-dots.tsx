/** A PIN shown as filled dots only: the digits never appear on a shared tablet's screen. */
export function PinDots({ length, testId }: { length: number; testId: string }) {
  return (
    <div
      role="status"
      aria-live="polite"
      aria-label={`${length} digits entered`}
      data-testid={testId}
      className="flex min-h-[96px] items-center gap-4 rounded-xl border-2 border-ink-line bg-ink-soft px-6"
    >
      {Array.from({ length: Math.max(4, length) }, (_, index) => (
        <span
          key={index}
          className={`h-8 w-8 rounded-full border-[3px] ${index < length ? 'border-paper bg-paper' : 'border-ink-line'}`}
        />
      ))}
    </div>
  );
}
