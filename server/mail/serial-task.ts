import type { Logger } from 'pino';

/**
 * Runs a background task one at a time: a call while it runs asks for one more run afterwards, so bursts of
 * changes cost at most two runs. Errors are logged, never thrown at the caller.
 */
export function serialTask(name: string, task: () => Promise<void>, logger: Logger) {
  let running: Promise<void> | null = null;
  let again = false;
  const run = (): Promise<void> => {
    if (running) {
      again = true;
      return running;
    }
    running = (async () => {
      do {
        again = false;
        try {
          await task();
        } catch (err) {
          logger.error({ err }, `${name} failed`);
        }
      } while (again);
      running = null;
    })();
    return running;
  };
  return run;
}
