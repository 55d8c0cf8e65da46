// Every way a boundary can be refused, with the sentence the admin reads.
export type BoundaryFaultCode =
  | 'unparseable'
  | 'not-polygon'
  | 'ring-not-closed'
  | 'ring-too-short'
  | 'self-intersecting'
  | 'too-many-corners'
  | 'hole-outside-shell'
  | 'out-of-range'
  | 'swapped-coordinates'
  | 'area-too-small'
  | 'area-too-large';

export interface BoundaryFault {
  code: BoundaryFaultCode;
  message: string;
}

export class BoundaryError extends Error {
  constructor(public readonly fault: BoundaryFault) {
    super(fault.message);
    this.name = 'BoundaryError';
  }
}

export const fault = (code: BoundaryFaultCode, message: string) => new BoundaryError({ code, message });
