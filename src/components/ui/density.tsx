import { createContext, useContext } from 'react';

/**
 * How large the controls are drawn. The kiosk is used with gloves (76 px targets); the desk with mouse and keyboard,
 * denser and never below 16 px text. Components shared by both (the holds queue, the tech log) read it, so the desk
 * has one look without a second copy of them.
 */
export type Density = 'kiosk' | 'desk';

const DensityContext = createContext<Density>('kiosk');
export const DensityProvider = DensityContext.Provider;
export const useDensity = () => useContext(DensityContext);
