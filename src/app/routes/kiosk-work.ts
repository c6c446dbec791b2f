/**
 * The kiosk's screens after sign-in (airframes, the check, the result, the queue) as one lazy chunk. The sign-in
 * screen asks for it as soon as someone starts signing in, so it is there before the PIN is.
 */
export const kioskWork = () => import('./kiosk-work-routes');
