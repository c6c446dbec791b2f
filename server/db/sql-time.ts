/** A DATETIME(3) literal in UTC, as the connection's time zone (+00:00) reads it. */
export const sqlTime = (d: Date) => d.toISOString().slice(0, 23).replace('T', ' ');
