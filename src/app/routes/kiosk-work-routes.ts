// The kiosk's screens after sign-in, in one chunk: the first screen (enrol, start, sign-in) stays small, and this
// chunk is fetched as soon as that screen is up (see warmKioskWork), before anyone has finished typing a PIN.
export { KioskAirframesRoute } from './kiosk-airframes-route';
export { KioskCheckRoute } from './kiosk-check-route';
export { KioskQueueRoute } from './kiosk-queue-route';
export { KioskResultRoute } from './kiosk-result-route';
