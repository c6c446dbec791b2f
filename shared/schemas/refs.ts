export interface PersonRef {
  id: number;
  name: string;
}

/** Whoever signed a record, with the licence it was signed under. */
export interface SignerRef extends PersonRef {
  licenceNumber: string | null;
}

export interface AirframeRef {
  id: number;
  fleetNumber: string;
  /** The registration mark, e.g. "QX-TNA"; null until engineering records one. */
  registration?: string | null;
}
