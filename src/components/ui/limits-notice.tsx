/** Shown wherever limits appear: the app records and compares; people and approved data decide. */
export function LimitsNotice({ tone = 'dark' }: { tone?: 'dark' | 'light' }) {
  return (
    <p
      className={`text-[20px] leading-snug ${tone === 'dark' ? 'text-ink-muted' : 'text-paper-muted'}`}
      data-testid="limits-notice"
    >
      Real limits come from the aircraft's approved maintenance data, local regulations and licensed
      engineers. Gaugewalk records and compares; it does not certify.
    </p>
  );
}
