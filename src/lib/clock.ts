// How the screens write times for people: the local clock, with the day when it is not today. The server's
// words carry their own zone ("2 Dec 2026, 14:05 UTC"); these are for times the screen lays out itself.

export const clockTime = (iso: string) =>
  new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit', hourCycle: 'h23' });

/** "14:05" today, "2 Dec 14:05" on another day. */
export function shortWhen(iso: string, now = Date.now()): string {
  const at = new Date(iso);
  const sameDay = new Date(now).toDateString() === at.toDateString();
  return sameDay
    ? clockTime(iso)
    : `${at.toLocaleDateString([], { day: 'numeric', month: 'short' })} ${clockTime(iso)}`;
}

/** Time left until an instant, in the largest two units that matter: "2 d 5 h", "3 h 20 min", "12 min". */
export function timeLeft(iso: string, now: number): { text: string; past: boolean } {
  const minutes = Math.floor((new Date(iso).getTime() - now) / 60_000);
  const past = minutes < 0;
  const total = Math.abs(minutes);
  const days = Math.floor(total / 1440);
  const hours = Math.floor((total % 1440) / 60);
  const mins = total % 60;
  const text =
    days > 0
      ? `${days} d ${hours} h`
      : hours > 0
        ? `${hours} h ${String(mins).padStart(2, '0')} min`
        : `${mins} min`;
  return { text, past };
}
