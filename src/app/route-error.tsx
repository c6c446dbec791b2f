import { useRouteError } from 'react-router-dom';

/** Last resort: a broken screen still tells the mechanic that readings on the tablet are kept. */
export function RouteError() {
  const error = useRouteError();
  return (
    <div role="alert" className="flex min-h-dvh flex-col items-start gap-5 bg-ink p-8 text-paper">
      <h1 className="text-[40px] font-bold">This screen failed</h1>
      <p className="text-lead">
        {error instanceof Error ? error.message : 'Something went wrong.'} Readings typed so far are kept on
        this tablet.
      </p>
      <button
        type="button"
        onClick={() => window.location.reload()}
        className="min-h-touch rounded-xl border-2 border-ink-line bg-ink-raised px-6 text-[24px] font-semibold"
      >
        Reload
      </button>
    </div>
  );
}
