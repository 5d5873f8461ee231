// Errors are values at the boundaries: a discriminated kind and a message a user can act on.

export type Result<T, E> = { ok: true; value: T } | { ok: false; error: E };

export const ok = <T>(value: T): { ok: true; value: T } => ({ ok: true, value });
export const err = <E>(error: E): { ok: false; error: E } => ({ ok: false, error });

export class Cancelled extends Error {
  constructor() {
    super('cancelled');
    this.name = 'Cancelled';
  }
}

/** Progress callback shared by long stages: stage name and fraction 0..1. */
export type Progress = (stage: string, fraction: number) => void;

export function assertNever(x: never, what = 'value'): never {
  throw new Error(`unexpected ${what}: ${JSON.stringify(x)}`);
}
